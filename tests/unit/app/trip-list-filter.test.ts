// The phone's trip-list filters against lib/domain's trip filter: for generated
// trips (the seed's pairing factory at three bases, across the US change to
// daylight-saving time on 14 March 2027) and generated list filters, the list
// shows a trip exactly when the trip filter made from the list's filters
// (asTripFilter, what "use these filters as a trip wish" sends) matches it.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { asTripFilter, emptyFilter, filterErrors, tripPasses, type ListFilter } from "@/app/(crew)/trips/trip-list-filter";
import { matchesTripFilter, tripFilterSchema, tripSummary, type Pairing } from "@/lib/domain";
import { addDays } from "@/lib/domain/time";
import { STATIONS } from "@/seed/carrier";
import { makePairing } from "@/seed/pairing-factory";
import { rng } from "@/seed/random";

const RUNS = { numRuns: 300, seed: 20270314 } as const;
const BASES = ["HLV", "EMR", "PSB"] as const;
const zoneOf = (base: string) => STATIONS.find((s) => s.code === base)!.zone;

/** A pairing from the factory, or null when the factory finds no leg for the spec (rare; skipped). */
function trip(seed: number, base: string, day: number, days: number, departure: string, deadheadChance: number): Pairing | null {
  let flight = 100;
  try {
    return makePairing(
      { id: `T${seed % 1000}`, base, startDate: addDays("2027-03-01", day), days, firstDeparture: departure, crewNeeded: { captain: 1 }, deadheadChance, maxLegsPerDuty: 1 + (seed % 5) },
      rng(seed),
      () => (flight += 3),
    );
  } catch {
    return null;
  }
}

const clock = fc.tuple(fc.integer({ min: 0, max: 23 }), fc.integer({ min: 0, max: 11 })).map(([h, m]) => `${String(h).padStart(2, "0")}:${String(m * 5).padStart(2, "0")}`);
const tripArb = fc
  .record({
    seed: fc.integer({ min: 1, max: 2 ** 31 - 1 }),
    base: fc.constantFrom(...BASES),
    day: fc.integer({ min: 0, max: 27 }),
    days: fc.integer({ min: 1, max: 5 }),
    departure: clock,
    deadheadChance: fc.constantFrom(0, 0.5, 1),
  })
  .map((t) => ({ base: t.base, pairing: trip(t.seed, t.base, t.day, t.days, t.departure, t.deadheadChance) }));

/** Hours as a crew member types them: whole, one or two decimals, sometimes with a comma. */
const hoursText = fc.oneof(
  fc.constant(""),
  fc.integer({ min: 0, max: 12 }).map(String),
  fc.integer({ min: 0, max: 1200 }).map((n) => (n / 100).toFixed(2)),
  fc.integer({ min: 0, max: 120 }).map((n) => (n / 10).toFixed(1).replace(".", ",")),
);
const stations = STATIONS.map((s) => s.code);
/** A run of lengths next to each other (or none), as the chips give them. */
const lengthRun = fc.oneof(
  fc.constant([] as number[]),
  fc.tuple(fc.integer({ min: 1, max: 4 }), fc.integer({ min: 0, max: 3 })).map(([a, n]) => Array.from({ length: Math.min(n, 4 - a) + 1 }, (_, k) => a + k)),
);
/** A clock time one minute either side of `time`, or `time` itself: where "at or after" and "by" can go wrong. */
const near = (time: string) =>
  fc.integer({ min: -1, max: 1 }).map((d) => {
    const m = (Number(time.slice(0, 2)) * 60 + Number(time.slice(3)) + d + 1440) % 1440;
    return `${String(Math.floor(m / 60)).padStart(2, "0")}:${String(m % 60).padStart(2, "0")}`;
  });
/** Hours that round to the trip's own credit per duty day, give or take a minute (written with four decimals). */
const nearPerDay = (minutes: number) => fc.integer({ min: -1, max: 1 }).map((d) => (Math.max(0, Math.round(minutes) + d) / 60).toFixed(4));

/**
 * A list filter with only conditions a trip filter also has. Half the time its
 * times and credit sit at the generated trip's own values, so the edges of
 * every comparison are reached, not only the easy middle.
 */
const sharedFilter = (p: Pairing | null, zone: string) => {
  const s = p ? tripSummary(p, zone) : null;
  const pick = <T,>(free: fc.Arbitrary<T>, edge: fc.Arbitrary<T> | null) => (edge ? fc.oneof(free, edge) : free);
  return fc
    .record({
      lengths: pick(lengthRun, s ? fc.constant<number[]>([Math.min(4, s.days)]) : null),
      layover: pick(fc.oneof(fc.constant(""), fc.constantFrom(...stations)), s && s.layovers.length ? fc.constantFrom(...s.layovers) : null),
      reportAfter: pick(fc.oneof(fc.constant(""), clock), s ? near(s.report) : null),
      releaseBefore: pick(fc.oneof(fc.constant(""), clock), s ? near(s.release) : null),
      daysOfWeek: fc.uniqueArray(fc.integer({ min: 1, max: 7 }), { maxLength: 4 }),
      creditPerDayMin: pick(hoursText, s ? nearPerDay(s.creditPerDutyDayMinutes) : null),
      redEye: fc.constantFrom("any", "yes", "no"),
      deadhead: fc.constantFrom("any", "yes", "no"),
    })
    .map((f): ListFilter => ({ ...emptyFilter, ...f }));
};
const tripAndFilter = tripArb.chain((t) => sharedFilter(t.pairing, zoneOf(t.base)).map((f) => ({ ...t, f })));

describe("the trip list's filters and lib/domain's trip filter (fast-check)", () => {
  it("agree on every trip: the list shows a trip exactly when the trip filter made from it matches", () => {
    let compared = 0;
    let shown = 0;
    fc.assert(
      fc.property(tripAndFilter, ({ base, pairing, f }) => {
        if (!pairing) return;
        const made = asTripFilter(f);
        const zone = zoneOf(base);
        const listed = tripPasses(tripSummary(pairing, zone), f);
        if (!made.ok) {
          // Nothing shared was set: the list shows every trip.
          expect(listed).toBe(true);
          return;
        }
        expect(made.leftOut).toEqual([]);
        expect(tripFilterSchema.safeParse(made.filter).success).toBe(true);
        expect(listed).toBe(matchesTripFilter(pairing, made.filter, zone));
        compared++;
        if (listed) shown++;
      }),
      RUNS,
    );
    // The generated cases exercise both answers, not only one.
    expect(compared).toBeGreaterThan(100);
    expect(shown).toBeGreaterThan(5);
    expect(compared - shown).toBeGreaterThan(5);
  });

  it("the list's own conditions (search, total credit) only narrow it, and a wish made from it names them as left out", () => {
    const listOnly = fc.record({ q: fc.oneof(fc.constant("T1"), fc.constantFrom(...stations)), creditMin: hoursText, creditMax: hoursText });
    fc.assert(
      fc.property(tripAndFilter, listOnly, ({ base, pairing, f: shared }, own) => {
        if (!pairing) return;
        const f = { ...shared, ...own };
        const made = asTripFilter(f);
        if (!made.ok) return;
        expect(made.leftOut[0]).toBe(`the search "${own.q}"`);
        const zone = zoneOf(base);
        if (tripPasses(tripSummary(pairing, zone), f)) expect(matchesTripFilter(pairing, made.filter, zone)).toBe(true);
      }),
      RUNS,
    );
  });

  it("turns the chips into one length range (4 = 4 or more) and refuses lengths that are not next to each other", () => {
    expect(asTripFilter({ ...emptyFilter, lengths: [3, 2] })).toEqual({ ok: true, filter: { lengthDays: { min: 2, max: 3 } }, leftOut: [] });
    expect(asTripFilter({ ...emptyFilter, lengths: [4, 3] })).toEqual({ ok: true, filter: { lengthDays: { min: 3 } }, leftOut: [] });
    const gap = asTripFilter({ ...emptyFilter, lengths: [1, 3] });
    expect(gap.ok).toBe(false);
    if (!gap.ok) expect(gap.message).toContain("1, 3 days are not");
    expect(asTripFilter({ ...emptyFilter, q: "PLM" }).ok).toBe(false);
    expect(asTripFilter({ ...emptyFilter, creditPerDayMin: "5,5", redEye: "no" })).toEqual({ ok: true, filter: { minCreditPerDutyDay: 330, redEye: false }, leftOut: [] });
  });

  it("names an hours field that holds no number of hours, and a credit range upside down", () => {
    expect(filterErrors({ ...emptyFilter, creditMin: "abc", creditPerDayMin: "-2" })).toEqual({
      creditMin: "Enter hours as a number, such as 5 or 5.5",
      creditPerDayMin: "Enter hours as a number, such as 5 or 5.5",
    });
    expect(filterErrors({ ...emptyFilter, creditMin: "20", creditMax: "12" })).toEqual({ creditMax: "This is below the credit from" });
    expect(filterErrors({ ...emptyFilter, creditMin: "12,5", creditMax: "20" })).toEqual({});
  });
});
