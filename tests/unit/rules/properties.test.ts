// Property tests of the legality engine (fast-check, seeded): order independence, cumulative limits only
// ever grow, canFollow agrees with checkLine on the pairwise rules, extend step by step agrees with checkLine.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Pairing, RuleSet } from "@/lib/domain";
import { addMinutes, instantMs } from "@/lib/domain/time";
import { REGISTRY, canFollow, checkLine, extend, finish, presetRuleSet, start, type LineItem, type LineState, type PresetId, type Violation } from "@/lib/rules";
import { BASE, at, context, crew, duty, items, pairing } from "@/tests/support/rule-fixtures";

const RUNS = { numRuns: 100, seed: 20270501 } as const;
const ctx = context();
const PRESETS: PresetId[] = ["us-flightcrew", "us-cabin", "eu-crew"];
const T0 = at("2027-05-02", "05:00");

interface DutySpec { minutes: number; segments: number; restAfter: number }
interface TripSpec { gapBefore: number; duties: DutySpec[] }

const dutySpec = fc.record({
  minutes: fc.integer({ min: 5 * 60, max: 14 * 60 }),
  segments: fc.integer({ min: 1, max: 5 }),
  restAfter: fc.integer({ min: 8 * 60, max: 26 * 60 }),
});
/** gapBefore: minutes from the previous trip's release (or from T0); duties 1–3. */
const tripSpec = (minGap: number) => fc.record({ gapBefore: fc.integer({ min: minGap, max: 40 * 60 }), duties: fc.array(dutySpec, { minLength: 1, maxLength: 3 }) });

const STOPS = [BASE, "PLM", "CBS"];
/** `segments` operated legs from `from` to `to` over the three short-hop stations; a single leg back to where it started rides home as a deadhead. */
function route(from: string, to: string, segments: number): { route: string[]; deadheads: number[] } {
  if (segments === 1 && from === to) return { route: [from, "CBS", to], deadheads: [1] };
  const path = [from];
  for (let j = 1; j < segments; j++) path.push(STOPS.find((s) => s !== path.at(-1) && (j < segments - 1 || s !== to))!);
  path.push(to);
  return { route: path, deadheads: [] };
}

function buildTrip(id: string, report: string, spec: TripSpec): Pairing {
  let t = report;
  const n = spec.duties.length;
  const dutyPeriods = spec.duties.map((d, i) => {
    const r = route(i === 0 ? BASE : "PLM", i === n - 1 ? BASE : "PLM", d.segments);
    const dp = duty(t, r.route, { minutes: d.minutes, deadheads: r.deadheads, blocks: r.route.map(() => 30), turn: 15 });
    t = addMinutes(dp.release, d.restAfter);
    return dp;
  });
  return pairing(id, dutyPeriods);
}

/** Trips one after another (gaps may be negative: overlaps), in time order. */
function buildLine(specs: TripSpec[], prefix = "P"): Pairing[] {
  let cursor = T0;
  return specs.map((s, k) => {
    const p = buildTrip(`${prefix}${k}`, addMinutes(cursor, s.gapBefore), s);
    cursor = p.dutyPeriods.at(-1)!.release;
    return p;
  });
}

const implOf = (rs: RuleSet, id: string) => {
  const rule = rs.rules.find((r) => r.id === id)!;
  return REGISTRY.get(typeof rule.params.check === "string" ? rule.params.check : rule.id)!;
};
const pairwiseIds = (rs: RuleSet) => new Set(["no-overlap", ...rs.rules.filter((r) => implOf(rs, r.id).pairwise).map((r) => r.id)]);
const cumulativeIds = (rs: RuleSet) => new Set(rs.rules.filter((r) => implOf(rs, r.id).id === "cumulative-limit").map((r) => r.id));
const list = (r: ReturnType<typeof checkLine>): Violation[] => (r.legal ? [] : r.violations);

describe("legality engine properties (fast-check)", () => {
  it("checkLine's result does not depend on the order of its input", () => {
    fc.assert(
      fc.property(fc.constantFrom(...PRESETS), fc.array(tripSpec(-6 * 60), { minLength: 1, maxLength: 8 }), fc.func(fc.integer()), (preset, specs, key) => {
        const rs = presetRuleSet(preset);
        const line = items(...buildLine(specs));
        const shuffled = line.map((it, k) => ({ it, k: key(k) })).sort((a, b) => a.k - b.k).map((x) => x.it);
        expect(checkLine(crew(), rs, shuffled, ctx)).toEqual(checkLine(crew(), rs, line, ctx));
        expect(checkLine(crew(), rs, [...line].reverse(), ctx)).toEqual(checkLine(crew(), rs, line, ctx));
      }),
      RUNS,
    );
  });

  it("adding a duty never removes a cumulative-limit violation (§117.23, ORO.FTL.210 windows only grow)", () => {
    let withViolations = 0;
    fc.assert(
      fc.property(
        fc.constantFrom<PresetId>("us-flightcrew", "eu-crew"),
        fc.array(tripSpec(8 * 60), { minLength: 3, maxLength: 10 }),
        tripSpec(0),
        fc.integer({ min: 0, max: 20 * 24 * 60 }),
        (preset, specs, extraSpec, offset) => {
          const rs = presetRuleSet(preset);
          const cumulative = cumulativeIds(rs);
          const line = buildLine(specs);
          const extra = buildTrip("X", addMinutes(T0, offset), extraSpec);
          const keyed = (vs: Violation[]) =>
            new Map(vs.filter((v) => cumulative.has(v.ruleId)).map((v) => [`${v.ruleId}|${v.items.join(",")}`, v.measured] as const));
          const before = keyed(list(checkLine(crew(), rs, items(...line), ctx)));
          const after = keyed(list(checkLine(crew(), rs, items(...line, extra), ctx)));
          if (before.size > 0) withViolations++;
          for (const [k, measured] of before) {
            expect(after.has(k), k).toBe(true);
            expect(after.get(k)!).toBeGreaterThanOrEqual(measured);
          }
        },
      ),
      RUNS,
    );
    expect(withViolations).toBeGreaterThan(10); // the generated lines do break cumulative limits often enough to test something
  });

  it("canFollow(a, b) agrees with checkLine([a, b]) on the pairwise rules (rest, overlap)", () => {
    const seen = { yes: 0, no: 0 };
    fc.assert(
      fc.property(fc.constantFrom(...PRESETS), tripSpec(0), tripSpec(-4 * 60), (preset, aSpec, bSpec) => {
        const rs = presetRuleSet(preset);
        const [a, b] = buildLine([aSpec, bSpec]);
        const pairwise = pairwiseIds(rs);
        // Violations between the two trips (internal layovers of a or b name only one trip).
        const between = list(checkLine(crew(), rs, items(a!, b!), ctx)).filter((v) => pairwise.has(v.ruleId) && v.items.includes("P0") && v.items.includes("P1"));
        const answer = canFollow(crew(), rs, a!, b!, ctx);
        answer ? seen.yes++ : seen.no++;
        expect(answer, JSON.stringify(between)).toBe(between.length === 0);
      }),
      RUNS,
    );
    expect(seen.yes).toBeGreaterThan(10);
    expect(seen.no).toBeGreaterThan(10);
  });

  it("extend step by step, in time order, agrees with checkLine (its first violation is checkLine's first; finish gives the rest)", () => {
    fc.assert(
      fc.property(fc.constantFrom(...PRESETS), fc.array(tripSpec(-2 * 60), { minLength: 1, maxLength: 8 }), (preset, specs) => {
        const rs = presetRuleSet(preset);
        const line: LineItem[] = items(...buildLine(specs)).sort(
          (x, y) => instantMs((x as { pairing: Pairing }).pairing.dutyPeriods[0]!.report) - instantMs((y as { pairing: Pairing }).pairing.dutyPeriods[0]!.report),
        );
        const whole = checkLine(crew(), rs, line, ctx);
        let state: LineState = start(crew(), rs, ctx);
        let first: Violation | undefined;
        for (const it of line) {
          const r = extend(state, it);
          if ("ruleId" in r) {
            first = r;
            break;
          }
          state = r;
        }
        if (first) expect(list(whole)[0]).toEqual(first);
        else expect(whole).toEqual(finish(state));
      }),
      RUNS,
    );
  });
});
