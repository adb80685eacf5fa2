/**
 * The legality engine's view of a line: a time-ordered list of duties. A
 * pairing's duty periods, a carry-in trip's, the look-back duties and fixed
 * activities all become duties (or free blocks) here, so every rule reads one
 * shape.
 */
import type { CrewMember, DutyPeriod, FixedActivity, Pairing } from "../domain/index.ts";
import { instantMs, localDate, localDatesTouched } from "../domain/time.ts";

/** Where a duty came from, for violation messages. */
export interface DutySource {
  kind: "pairing" | "carry-in" | "look-back" | "activity";
  /** trip number, or the activity's kind */
  id: string;
  /** 0-based duty period within the trip */
  index: number;
}

export interface Duty {
  source: DutySource;
  /** epoch ms */
  report: number;
  release: number;
  /** a flight duty period: it has legs (operated or deadhead) */
  flight: boolean;
  /** operated legs: deadheads are not segments (14 CFR 117.3) */
  segments: number;
  /** scheduled block of operated legs, minutes */
  flightMinutes: number;
  /** station of the first departure and the last arrival; undefined for ground duty */
  from?: string;
  to?: string;
  /** epoch ms of the first departure and the last arrival; undefined for ground duty */
  firstDeparture?: number;
  lastArrival?: number;
}

/** A line item the caller hands to the engine. */
export type LineItem = { kind: "pairing"; pairing: Pairing } | { kind: "activity"; activity: FixedActivity };

const cache = new WeakMap<object, Duty[]>();

function dutyOf(d: DutyPeriod, source: DutySource): Duty {
  const operated = d.legs.filter((l) => !l.deadhead);
  return {
    source,
    report: instantMs(d.report),
    release: instantMs(d.release),
    flight: d.legs.length > 0,
    segments: operated.length,
    flightMinutes: operated.reduce((t, l) => t + l.blockMinutes, 0),
    from: d.legs[0]?.from,
    to: d.legs[d.legs.length - 1]?.to,
    firstDeparture: d.legs[0] ? instantMs(d.legs[0].departure) : undefined,
    lastArrival: d.legs.length ? instantMs(d.legs[d.legs.length - 1]!.arrival) : undefined,
  };
}

/** The duties of a pairing (computed once per pairing object: parsed pairings are not changed). */
export function pairingDuties(p: Pairing): Duty[] {
  let known = cache.get(p);
  if (!known) {
    known = p.dutyPeriods.map((d, index) => dutyOf(d, { kind: "pairing", id: p.id, index }));
    cache.set(p, known);
  }
  return known;
}

/** Training and office days are duty (not flight duty); leave, medical and other activities are time off. */
export function activityDuty(a: FixedActivity): Duty | undefined {
  if (a.kind !== "training" && a.kind !== "office") return undefined;
  return { source: { kind: "activity", id: a.kind, index: 0 }, report: instantMs(a.start), release: instantMs(a.end), flight: false, segments: 0, flightMinutes: 0 };
}

/**
 * The crew member's history: look-back duties, carry-in trips' duties and the
 * training or office duty that ended before the period (`periodStartMs`), in
 * time order.
 */
export function historyDuties(crew: CrewMember, periodStartMs: number): Duty[] {
  const past = crew.lookBack.duties.map(
    (d, index): Duty => ({
      source: { kind: "look-back", id: "look-back", index },
      report: instantMs(d.report),
      release: instantMs(d.release),
      flight: d.flightMinutes > 0 || d.segments > 0,
      segments: d.segments,
      flightMinutes: d.flightMinutes,
      to: d.endStation,
    }),
  );
  const carry = crew.carryIn.flatMap((t) => t.dutyPeriods.map((d, index) => dutyOf(d, { kind: "carry-in", id: t.pairingId, index })));
  const before = crew.fixedActivities.flatMap((a) => (instantMs(a.end) <= periodStartMs ? [activityDuty(a)].filter((d): d is Duty => !!d) : []));
  return [...past, ...carry, ...before].sort((a, b) => a.report - b.report);
}

/** "trip T412", "carry-in trip C1", "training" — how a message names a duty's source. */
export function describeSource(s: DutySource): string {
  if (s.kind === "pairing") return `trip ${s.id}`;
  if (s.kind === "carry-in") return `carry-in trip ${s.id}`;
  if (s.kind === "look-back") return "a duty before the period";
  return s.id;
}

const dutyDateMemo = new WeakMap<Duty, Map<string, { report: string; touched: readonly string[] }>>();

/**
 * A duty's base-local report date and the dates it touches (report to
 * release), memoised per duty object and zone: rules ask the same duties
 * again for every line a search tries.
 */
export function dutyDates(d: Duty, zone: string): { report: string; touched: readonly string[] } {
  let byZone = dutyDateMemo.get(d);
  if (!byZone) dutyDateMemo.set(d, (byZone = new Map()));
  let known = byZone.get(zone);
  if (!known) {
    const report = new Date(d.report).toISOString();
    known = { report: localDate(report, zone), touched: Object.freeze(localDatesTouched(report, new Date(d.release).toISOString(), zone)) };
    byZone.set(zone, known);
  }
  return known;
}
