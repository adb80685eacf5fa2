/**
 * Seeded synthetic bids for the converted instances. The data set carries no
 * crew wishes, so each pilot gets a plausible bid: a trip wish naming two or
 * three of the base's pairings, a free-days wish for two or three dates in a
 * row, a credit range around the base's fair share, and a no-trip wish with a
 * trip filter, in a seeded rank order. Invented data: for tests and demos only.
 */
import type { BidPeriod, CrewMember, Instance, Pairing, TripFilter, Wish } from "../../lib/domain/index.ts";
import { addDays, daysBetween } from "../../lib/domain/time.ts";
import type { Rng } from "../random.ts";

/** What a bid maker sees of one base's instance. */
export interface BidInput {
  /** The base's station code. */
  base: string;
  period: BidPeriod;
  crew: readonly CrewMember[];
  pairings: readonly Pairing[];
  /** The line's credit maximum of the rule set, in minutes. */
  creditMaxMinutes: number;
  /** A seeded random source for this base alone. */
  rng: Rng;
}

/** Makes the bids of one base: crew id → wishes in rank order. */
export type MakeBids = (input: BidInput) => Instance["bids"];

/** The no-trip filters a pilot picks one from: early starts, deadheads, long trips, red-eyes, late finishes. */
const AVOID: readonly TripFilter[] = [
  { reportBefore: "06:00" },
  { deadhead: true },
  { lengthDays: { min: 4 } },
  { redEye: true },
  { releaseAfter: "22:00" },
];

function shuffled<T>(items: readonly T[], r: Rng): T[] {
  const out = [...items];
  for (let k = out.length - 1; k > 0; k--) {
    const j = r.int(0, k);
    [out[k], out[j]] = [out[j]!, out[k]!];
  }
  return out;
}

function tripWish(pairings: readonly Pairing[], r: Rng): Wish | undefined {
  if (pairings.length === 0) return undefined;
  const named = shuffled(pairings, r).slice(0, Math.min(pairings.length, r.int(2, 3)));
  return { kind: "trip", pairingIds: named.map((p) => p.id), count: 1 };
}

function freeDaysWish(period: BidPeriod, r: Rng): Wish {
  const length = daysBetween(period.startDate, period.endDate) + 1;
  const count = Math.min(length, r.int(2, 3));
  const first = addDays(period.startDate, r.int(0, length - count));
  return { kind: "free-days", dates: Array.from({ length: count }, (_, k) => addDays(first, k)) };
}

/** A range of whole hours near the base's credit per pilot, inside the line's maximum. */
function creditWish(fairShareMinutes: number, creditMaxMinutes: number, r: Rng): Wish {
  const capHours = Math.floor(creditMaxMinutes / 60);
  const minHours = Math.max(0, Math.min(capHours, Math.round(fairShareMinutes / 60) - r.int(0, 10)));
  const maxHours = Math.min(capHours, minHours + r.int(5, 15));
  return { kind: "credit", minMinutes: minHours * 60, maxMinutes: maxHours * 60 };
}

/** The default bid maker: every pilot bids the four wishes above, ranks shuffled by the seed. */
export const seededBids: MakeBids = ({ crew, pairings, period, creditMaxMinutes, rng: r }) => {
  const totalCredit = pairings.reduce((sum, p) => sum + p.creditMinutes * (p.crewNeeded.captain ?? 0), 0);
  const fairShare = crew.length > 0 ? totalCredit / crew.length : 0;
  const bids: Instance["bids"] = {};
  for (const member of crew) {
    const wishes = [
      tripWish(pairings, r),
      freeDaysWish(period, r),
      creditWish(fairShare, creditMaxMinutes, r),
      { kind: "no-trip", filter: structuredClone(r.pick(AVOID)) } satisfies Wish,
    ].filter((wish): wish is Wish => wish !== undefined);
    bids[member.id] = shuffled(wishes, r);
  }
  return bids;
};
