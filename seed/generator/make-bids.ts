/**
 * Plausible bids: every wish kind appears, and popularity is realistic — many
 * crew want the same weekends, holidays and the best layovers, and few want
 * red-eyes or very early reports (common practice; no published source).
 * Seniors and juniors wish for much the same things, so wishes collide.
 */
import type { CrewMember, Pairing, TripFilter, Wish } from "../../lib/domain/index.ts";
import { addDays, dayOfWeek, isRedEye, localTime, pairingDates } from "../../lib/domain/index.ts";
import type { Rng } from "../random.ts";
import { holidaysBetween, weekendDates } from "./holidays.ts";
import type { GeneratorParams } from "./params.ts";

/** Layovers crew like best (beaches, long stays abroad, a lively city). */
export const POPULAR_LAYOVERS = ["KMN", "OSY", "BKW", "PSB"];

/** How much crew in general like a trip: layovers, credit per day, weekdays, civil hours. */
export function tripAppeal(p: Pairing, zone: string): number {
  const layovers = p.dutyPeriods.slice(0, -1).map((d) => d.legs[d.legs.length - 1]!.to);
  const dates = pairingDates(p, zone);
  let score = layovers.filter((s) => POPULAR_LAYOVERS.includes(s)).length * 2;
  score += p.creditMinutes / p.dutyPeriods.length / 60 - 4; // credit per duty day above 4 h
  score -= dates.filter((d) => dayOfWeek(d) >= 6).length * 0.6;
  if (isRedEye(p, zone)) score -= 2;
  if (localTime(p.dutyPeriods[0]!.report, zone) < "06:00") score -= 1;
  return score;
}

export interface BidContext {
  params: GeneratorParams;
  zone: string;
  endDate: string;
  /** pairings by appeal, best first */
  ranked: readonly Pairing[];
}

/** A bid for every crew member who bids (about 9 in 10), keyed by employee number. */
export function makeBids(crew: readonly CrewMember[], ctx: BidContext, r: Rng): Record<string, Wish[]> {
  const bids: Record<string, Wish[]> = {};
  const buddies = pickBuddies(crew, r);
  for (const c of crew) {
    if (r.next() < 0.1) continue; // some never bid
    const wishes = personalWishes(c, ctx, r);
    const buddy = buddies.get(c.id);
    if (buddy) wishes.splice(r.int(0, Math.min(2, wishes.length)), 0, { kind: "buddy", crewId: buddy });
    bids[c.id] = wishes;
  }
  return bids;
}

function personalWishes(c: CrewMember, ctx: BidContext, r: Rng): Wish[] {
  const { params, zone, ranked } = ctx;
  const wishes: Wish[] = [];
  const holidays = holidaysBetween(params.startDate, ctx.endDate);
  const saturdays = weekendDates(params.startDate, ctx.endDate).filter((d) => dayOfWeek(d) === 6);
  if (r.next() < 0.75) {
    // Free days: a holiday cluster, a weekend or a personal block of dates.
    const pick = r.next();
    const dates =
      pick < 0.35 && holidays.length
        ? holidays.slice(0, r.int(1, holidays.length))
        : pick < 0.75 && saturdays.length
          ? ((sat) => [sat, addDays(sat, 1)].filter((x) => x <= ctx.endDate))(r.pick(saturdays))
          : ((d) => [d, addDays(d, 1), addDays(d, 2)].filter((x) => x <= ctx.endDate))(addDays(params.startDate, r.int(0, params.days - 3)));
    if (dates.length) wishes.push({ kind: "free-days", dates: [...new Set(dates)].sort() });
  }
  if (r.next() < 0.6) {
    // Named trips from the most appealing ones; everyone looks at the same top list.
    const top = ranked.slice(0, Math.max(6, Math.round(ranked.length * 0.12))).filter((p) => p.requires.every((q) => c.qualifications.includes(q)));
    const chosen = new Set<string>();
    for (let k = r.int(2, 4); k > 0 && top.length; k--) chosen.add(r.pick(top).id);
    if (chosen.size) wishes.push({ kind: "trip", pairingIds: [...chosen], count: 1 });
  }
  if (r.next() < 0.45) {
    const filter: TripFilter = r.next() < 0.6
      ? { layoverAt: [r.pick(POPULAR_LAYOVERS)] }
      : { lengthDays: { min: 3, max: 4 }, minCreditPerDutyDay: 300 };
    wishes.push({ kind: "trip", filter, count: r.int(1, 3) });
  }
  if (r.next() < 0.45) {
    const avoid: TripFilter = r.pick<TripFilter>([{ redEye: true }, { reportBefore: "06:00" }, { lengthDays: { min: 4 } }, { releaseAfter: "22:00" }]);
    wishes.push({ kind: "no-trip", filter: avoid });
  }
  if (r.next() < 0.35) wishes.push(r.next() < 0.5 ? { kind: "rhythm", maxDaysOn: r.int(3, 5) } : { kind: "rhythm", weekendsOff: true, ...(r.next() < 0.4 ? { maxDaysOn: 4 } : {}) });
  if (r.next() < 0.55) {
    const low = r.int(13, 16) * 300; // 65–80 h
    wishes.push(r.next() < 0.7 ? { kind: "credit", minMinutes: low, maxMinutes: low + r.int(2, 4) * 300 } : { kind: "credit", maxMinutes: low });
  }
  // Rank order is personal: shuffle, then keep what the crew member ranked.
  for (let k = wishes.length - 1; k > 0; k--) {
    const j = r.int(0, k);
    [wishes[k], wishes[j]] = [wishes[j]!, wishes[k]!];
  }
  return wishes;
}

/** About 8 % of crew pair up with a colleague of their own position; one in five such wishes is one-sided. */
function pickBuddies(crew: readonly CrewMember[], r: Rng): Map<string, string> {
  const out = new Map<string, string>();
  const byPosition = new Map<string, CrewMember[]>();
  for (const c of crew) byPosition.set(c.position, [...(byPosition.get(c.position) ?? []), c]);
  for (const group of byPosition.values()) {
    const free = group.filter(() => r.next() < 0.08);
    for (let k = 0; k + 1 < free.length; k += 2) {
      const [a, b] = [free[k]!, free[k + 1]!];
      out.set(a.id, b.id);
      if (r.next() < 0.8) out.set(b.id, a.id);
    }
  }
  return out;
}
