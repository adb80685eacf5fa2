/**
 * 14 CFR Part 117's tables, as published (text unchanged since 78 FR 69288,
 * 2013). Start bands are minutes after local midnight, inclusive lower bound.
 */

/** Table B — maximum flight duty period, unaugmented, hours; columns 1, 2, … 7+ segments. */
export const US_117_TABLE_B: ReadonlyArray<{ from: number; hours: readonly number[] }> = [
  { from: 0, hours: [9, 9, 9, 9, 9, 9, 9] },
  { from: 4 * 60, hours: [10, 10, 10, 10, 9, 9, 9] },
  { from: 5 * 60, hours: [12, 12, 12, 12, 11.5, 11, 10.5] },
  { from: 6 * 60, hours: [13, 13, 12, 12, 11.5, 11, 10.5] },
  { from: 7 * 60, hours: [14, 14, 13, 13, 12.5, 12, 11.5] },
  { from: 12 * 60, hours: [13, 13, 13, 13, 12.5, 12, 11.5] },
  { from: 13 * 60, hours: [12, 12, 12, 12, 11.5, 11, 10.5] },
  { from: 17 * 60, hours: [12, 12, 11, 11, 10, 9, 9] },
  { from: 22 * 60, hours: [11, 11, 10, 10, 9, 9, 9] },
  { from: 23 * 60, hours: [10, 10, 10, 9, 9, 9, 9] },
];

/** Table A — maximum flight time, unaugmented, by time of report: hours. */
export const US_117_TABLE_A: ReadonlyArray<{ from: number; hours: number }> = [
  { from: 0, hours: 8 },
  { from: 5 * 60, hours: 9 },
  { from: 20 * 60, hours: 8 },
];

/** The row of a banded table for a local clock time (minutes after midnight). */
export function band<T extends { from: number }>(table: readonly T[], minuteOfDay: number): T {
  let row = table[0]!;
  for (const r of table) if (r.from <= minuteOfDay) row = r;
  return row;
}

/** Table B's limit in minutes for a start time and a number of segments (at least 1). */
export function usTableBMinutes(minuteOfDay: number, segments: number): number {
  const row = band(US_117_TABLE_B, minuteOfDay);
  return row.hours[Math.min(Math.max(segments, 1), 7) - 1]! * 60;
}

/** Table A's limit in minutes for a report time. */
export function usTableAMinutes(minuteOfDay: number): number {
  return band(US_117_TABLE_A, minuteOfDay).hours * 60;
}
