/**
 * The legality engine: a line (pairings and fixed activities, carry-in and
 * look-back from the crew member) checked against a rule set. One code path:
 * `checkLine` is `start` + `extend` for every item in time order + `finish`,
 * so the incremental form the award engine uses can never disagree with it.
 */
import type { CrewMember, Pairing, RuleSet, Station } from "../domain/index.ts";
import { instantMs, startOfLocalDay } from "../domain/time.ts";
import { noOverlap } from "./checks/no-overlap.ts";
import { activityDuty, describeSource, historyDuties, pairingDuties, type Duty, type LineItem } from "./duty.ts";
import { bindRules, type BoundRule } from "./registry.ts";
import type { RuleEnv, RuleImpl, Violation } from "./rule.ts";

export interface EngineContext {
  stations: readonly Station[];
  periodStart: string;
  periodEnd: string;
  /** the base's zone */
  zone: string;
}

/** The engine's state after some items; treat as opaque and immutable. */
export interface LineState {
  env: RuleEnv;
  rules: BoundRule[];
  duties: Duty[];
  pairings: Pairing[];
  dailyFlight: Map<string, number>;
  /** the crew member's training and office duty in the period, not yet merged in (time order) */
  pending: Duty[];
  /** leave, medical and other time off: nothing may overlap it, but it is not duty */
  off: { start: number; end: number; kind: string }[];
}

export type LineResult = { legal: true } | { legal: false; violations: Violation[] };

const bound = new WeakMap<RuleSet, BoundRule[]>();
const stationMaps = new WeakMap<readonly Station[], Map<string, Station>>();

function rulesOf(ruleSet: RuleSet): BoundRule[] {
  let rules = bound.get(ruleSet);
  if (!rules) {
    rules = bindRules(ruleSet.rules);
    bound.set(ruleSet, rules);
  }
  return rules;
}

function stationMap(stations: readonly Station[]): Map<string, Station> {
  let m = stationMaps.get(stations);
  if (!m) {
    m = new Map(stations.map((s) => [s.code, s]));
    stationMaps.set(stations, m);
  }
  return m;
}

/**
 * A fresh line for a crew member: their history is in, nothing of the period
 * yet. Their fixed activities in the period come in by themselves, in time
 * order, as items are added (and at `finish`).
 */
export function start(crew: CrewMember, ruleSet: RuleSet, ctx: EngineContext): LineState {
  const env: RuleEnv = { crew, zone: ctx.zone, stations: stationMap(ctx.stations), periodStart: ctx.periodStart, periodEnd: ctx.periodEnd };
  const from = periodStartMs(ctx);
  const history = historyDuties(crew, from);
  const pending = crew.fixedActivities
    .filter((a) => instantMs(a.end) > from)
    .flatMap((a) => {
      const d = activityDuty(a);
      return d ? [d] : [];
    })
    .sort((a, b) => a.report - b.report);
  const off = crew.fixedActivities
    .filter((a) => !activityDuty(a))
    .map((a) => ({ start: instantMs(a.start), end: instantMs(a.end), kind: a.kind }));
  const state: LineState = {
    env,
    rules: rulesOf(ruleSet),
    duties: [],
    pairings: [],
    dailyFlight: new Map(crew.lookBack.dailyFlightMinutes.map((d) => [d.date, d.minutes])),
    pending,
    off,
  };
  // History is not judged itself (it was flown or awarded already); the line's
  // own duties are judged against it, carry-in included.
  let s = state;
  for (const d of history) s = push(s, d, false).state;
  return s;
}

function push(state: LineState, d: Duty, check: boolean): { state: LineState; violations: Violation[] } {
  const duties = [...state.duties, d];
  const next = { ...state, duties };
  if (!check) return { state: next, violations: [] };
  const violations: Violation[] = [];
  for (const r of [NO_OVERLAP, ...state.rules]) {
    const found = r.impl.onDuty?.({ env: state.env, params: r.params, duties, dailyFlight: state.dailyFlight }) ?? [];
    for (const v of found) violations.push({ ...v, ruleId: r.rule.id });
  }
  for (const o of state.off) {
    if (d.report < o.end && o.start < d.release) {
      violations.push({
        ruleId: "no-overlap",
        measured: (Math.min(d.release, o.end) - Math.max(d.report, o.start)) / 60_000,
        limit: 0,
        unit: "minutes",
        items: [d.source.id, o.kind],
        text: `${describeSource(d.source)} falls in the crew member's ${o.kind}; a line cannot hold both`,
      });
    }
  }
  return { state: next, violations };
}

const NO_OVERLAP = { rule: { id: "no-overlap", params: {}, text: "" }, impl: noOverlap as RuleImpl<unknown>, params: {} } as BoundRule;

/** Merges the pending activities that start before `until` (epoch ms). */
function flush(state: LineState, until: number): { state: LineState; violations: Violation[] } {
  let s = state;
  const violations: Violation[] = [];
  while (s.pending.length && s.pending[0]!.report < until) {
    const [first, ...rest] = s.pending;
    const r = push({ ...s, pending: rest }, first!, true);
    s = r.state;
    violations.push(...r.violations);
  }
  return { state: s, violations };
}

function dutiesOfItem(item: LineItem): Duty[] {
  if (item.kind === "pairing") return pairingDuties(item.pairing);
  const d = activityDuty(item.activity);
  return d ? [d] : [];
}

/** Adds one item, collecting every violation it causes. Items must come in time order. */
export function extendAll(state: LineState, item: LineItem): { state: LineState; violations: Violation[] } {
  const duties = dutiesOfItem(item);
  const before = flush(state, duties[0]?.report ?? Infinity);
  let s = before.state;
  const violations: Violation[] = [...before.violations];
  for (const d of duties) {
    const r = push(s, d, true);
    s = r.state;
    violations.push(...r.violations);
  }
  if (item.kind === "pairing") s = { ...s, pairings: [...s.pairings, item.pairing] };
  return { state: s, violations };
}

/** Adds one item; the first violation it causes, or the new state. */
export function extend(state: LineState, item: LineItem): LineState | Violation {
  const r = extendAll(state, item);
  return r.violations[0] ?? r.state;
}

/** The crew member's remaining activities, then the line-level rules (credit window, days off, days on). */
export function finish(state: LineState, opts: { reserve?: boolean } = {}): LineResult {
  const rest = flush(state, Infinity);
  const violations: Violation[] = [...rest.violations];
  const all = rest.state.duties;
  const lineDuties = all.filter((d) => d.source.kind !== "look-back");
  for (const r of rest.state.rules) {
    const found = r.impl.onLine?.({ env: state.env, params: r.params, duties: lineDuties, allDuties: all, pairings: state.pairings, reserve: opts.reserve ?? false }) ?? [];
    for (const v of found) violations.push({ ...v, ruleId: r.rule.id });
  }
  return violations.length ? { legal: false, violations } : { legal: true };
}

const itemStart = (item: LineItem) =>
  item.kind === "pairing" ? instantMs(item.pairing.dutyPeriods[0]!.report) : instantMs(item.activity.start);

/** Every violation of a line, items in any order (the crew member's fixed activities come in by themselves). */
export function checkLine(
  crew: CrewMember,
  ruleSet: RuleSet,
  items: readonly LineItem[],
  ctx: EngineContext,
  opts: { reserve?: boolean } = {},
): LineResult {
  const ordered = [...items].sort((a, b) => itemStart(a) - itemStart(b) || itemKey(a).localeCompare(itemKey(b)));
  let state = start(crew, ruleSet, ctx);
  const violations: Violation[] = [];
  for (const item of ordered) {
    const r = extendAll(state, item);
    state = r.state;
    violations.push(...r.violations);
  }
  const end = finish(state, opts);
  if (!end.legal) violations.push(...end.violations);
  return violations.length ? { legal: false, violations } : { legal: true };
}

const itemKey = (item: LineItem) => (item.kind === "pairing" ? `p:${item.pairing.id}` : `a:${item.activity.kind}:${item.activity.start}`);

/**
 * May pairing `b` follow pairing `a` in one line, on the rules that look at two
 * neighbouring duties only (rest, overlap)? Cheap: no history, no line rules,
 * and nothing of the crew member's fixed activities — eligibility (a trip that
 * clashes with leave or training) and `extend` answer those.
 */
export function canFollow(crew: CrewMember, ruleSet: RuleSet, a: Pairing, b: Pairing, ctx: EngineContext): boolean {
  const last = pairingDuties(a).at(-1)!;
  const first = pairingDuties(b)[0]!;
  if (first.report < last.release) return false;
  const env: RuleEnv = { crew, zone: ctx.zone, stations: stationMap(ctx.stations), periodStart: ctx.periodStart, periodEnd: ctx.periodEnd };
  const duties = [last, first];
  for (const r of rulesOf(ruleSet)) {
    if (!r.impl.pairwise || !r.impl.onDuty) continue;
    if (r.impl.onDuty({ env, params: r.params, duties, dailyFlight: EMPTY }).length) return false;
  }
  return true;
}

const EMPTY = new Map<string, number>();

function periodStartMs(ctx: EngineContext): number {
  return instantMs(startOfLocalDay(ctx.periodStart, ctx.zone));
}
