/**
 * Regulation (EU) No 965/2012, Annex III, ORO.FTL.205(b)(1) Table 2 (as
 * inserted by Regulation (EU) No 83/2014): maximum daily FDP of acclimatised
 * crew, minutes, by start at reference time; columns 1–2, 3, 4, … 10 sectors.
 */
import { band } from "./us-117.ts";

const hm = (h: number, m: number) => h * 60 + m;
const NIGHT = [hm(11, 0), hm(10, 30), hm(10, 0), hm(9, 30), hm(9, 0), hm(9, 0), hm(9, 0), hm(9, 0), hm(9, 0)];

/** Rows in clock order; the 1700–0459 row wraps past midnight, so it opens the day and closes it. */
export const EU_TABLE_2: ReadonlyArray<{ from: number; minutes: readonly number[] }> = [
  { from: 0, minutes: NIGHT },
  { from: hm(5, 0), minutes: [hm(12, 0), hm(11, 30), hm(11, 0), hm(10, 30), hm(10, 0), hm(9, 30), hm(9, 0), hm(9, 0), hm(9, 0)] },
  { from: hm(5, 15), minutes: [hm(12, 15), hm(11, 45), hm(11, 15), hm(10, 45), hm(10, 15), hm(9, 45), hm(9, 15), hm(9, 0), hm(9, 0)] },
  { from: hm(5, 30), minutes: [hm(12, 30), hm(12, 0), hm(11, 30), hm(11, 0), hm(10, 30), hm(10, 0), hm(9, 30), hm(9, 0), hm(9, 0)] },
  { from: hm(5, 45), minutes: [hm(12, 45), hm(12, 15), hm(11, 45), hm(11, 15), hm(10, 45), hm(10, 15), hm(9, 45), hm(9, 15), hm(9, 0)] },
  { from: hm(6, 0), minutes: [hm(13, 0), hm(12, 30), hm(12, 0), hm(11, 30), hm(11, 0), hm(10, 30), hm(10, 0), hm(9, 30), hm(9, 0)] },
  { from: hm(13, 30), minutes: [hm(12, 45), hm(12, 15), hm(11, 45), hm(11, 15), hm(10, 45), hm(10, 15), hm(9, 45), hm(9, 15), hm(9, 0)] },
  { from: hm(14, 0), minutes: [hm(12, 30), hm(12, 0), hm(11, 30), hm(11, 0), hm(10, 30), hm(10, 0), hm(9, 30), hm(9, 0), hm(9, 0)] },
  { from: hm(14, 30), minutes: [hm(12, 15), hm(11, 45), hm(11, 15), hm(10, 45), hm(10, 15), hm(9, 45), hm(9, 15), hm(9, 0), hm(9, 0)] },
  { from: hm(15, 0), minutes: [hm(12, 0), hm(11, 30), hm(11, 0), hm(10, 30), hm(10, 0), hm(9, 30), hm(9, 0), hm(9, 0), hm(9, 0)] },
  { from: hm(15, 30), minutes: [hm(11, 45), hm(11, 15), hm(10, 45), hm(10, 15), hm(9, 45), hm(9, 15), hm(9, 0), hm(9, 0), hm(9, 0)] },
  { from: hm(16, 0), minutes: [hm(11, 30), hm(11, 0), hm(10, 30), hm(10, 0), hm(9, 30), hm(9, 0), hm(9, 0), hm(9, 0), hm(9, 0)] },
  { from: hm(16, 30), minutes: [hm(11, 15), hm(10, 45), hm(10, 15), hm(9, 45), hm(9, 15), hm(9, 0), hm(9, 0), hm(9, 0), hm(9, 0)] },
  { from: hm(17, 0), minutes: NIGHT },
];

/** Table 2's limit in minutes; 1 and 2 sectors share a column, 10 or more read the last. */
export function euTableTwoMinutes(minuteOfDay: number, sectors: number): number {
  const row = band(EU_TABLE_2, minuteOfDay);
  return row.minutes[Math.min(Math.max(sectors, 2), 10) - 2]!;
}
