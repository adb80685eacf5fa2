/**
 * The legality engine's benchmark (`npm run bench:rules`): `canFollow` answers
 * per second on distinct pairs of pairings (every pair asked once per pass, no
 * answer memoised), and full `checkLine` calls per second on the 30-day lines
 * the generator's greedy test filler builds. Instance: generatePeriod({ crew:
 * 100, seed: 7, positions: ["captain"] }) under its us-flightcrew preset.
 * Target (issue 4): at least 100,000 canFollow per second.
 */
import { performance } from "node:perf_hooks";
import type { Pairing } from "../domain/index.ts";
import { instantMs } from "../domain/time.ts";
import { canFollow, checkLine, type EngineContext, type LineItem } from "../rules/index.ts";
import { generatePeriod } from "../../seed/generator/generate-period.ts";
import { greedyLines } from "../../seed/greedy-lines.ts";

const TARGET = 100_000;
const MIN_MS = Number(process.env.BENCH_MS ?? 2000);

const instance = generatePeriod({ crew: 100, seed: 7, positions: ["captain"] }).instances[0]!;
if (instance.ruleSet.preset !== "us-flightcrew") throw new Error(`expected the us-flightcrew preset, got ${instance.ruleSet.preset}`);
const ctx: EngineContext = { stations: instance.stations, zone: instance.period.zone, periodStart: instance.period.startDate, periodEnd: instance.period.endDate };
const crew = instance.crew;

// Distinct ordered pairs (a, b) with b reporting after a is released: the pairs a line builder asks about.
const startOf = (p: Pairing) => instantMs(p.dutyPeriods[0]!.report);
const endOf = (p: Pairing) => instantMs(p.dutyPeriods.at(-1)!.release);
const pairs: Array<[Pairing, Pairing]> = [];
for (const a of instance.pairings) for (const b of instance.pairings) if (a !== b && startOf(b) >= endOf(a)) pairs.push([a, b]);

/** Runs `pass` until MIN_MS have gone by (after one warm-up pass); returns operations per second. */
function measure(opsPerPass: number, pass: (round: number) => number): { perSecond: number; sink: number } {
  let sink = pass(-1); // warm-up (JIT), not timed
  let ops = 0;
  let round = 0;
  const t0 = performance.now();
  let elapsed = 0;
  do {
    sink += pass(round++);
    ops += opsPerPass;
    elapsed = performance.now() - t0;
  } while (elapsed < MIN_MS);
  return { perSecond: (ops / elapsed) * 1000, sink };
}

// canFollow: each pass asks every distinct pair once, crew member rotating, so no (crew, a, b) answer repeats within a pass.
const follow = measure(pairs.length, (round) => {
  let yes = 0;
  for (let i = 0; i < pairs.length; i++) {
    const [a, b] = pairs[i]!;
    if (canFollow(crew[(i + round + 1) % crew.length]!, instance.ruleSet, a, b, ctx)) yes++;
  }
  return yes;
});

// checkLine on every crew member's greedy 30-day line (carry-in, fixed activities and look-back included).
const { lines } = greedyLines(instance);
const byId = new Map(instance.pairings.map((p) => [p.id, p]));
const lineItems = crew.map((c) => ({ crew: c, items: (lines[c.id] ?? []).map((id): LineItem => ({ kind: "pairing", pairing: byId.get(id)! })) }));
let legalLines = 0;
const full = measure(lineItems.length, (round) => {
  let legal = 0;
  for (const { crew: c, items } of lineItems) if (checkLine(c, instance.ruleSet, items, ctx).legal) legal++;
  if (round === -1) legalLines = legal;
  return legal;
});

const avgTrips = lineItems.reduce((t, l) => t + l.items.length, 0) / lineItems.length;
const fmt = (n: number) => Math.round(n).toLocaleString("en-US");
console.log(`instance: ${instance.period.name}, ${instance.pairings.length} pairings, ${crew.length} crew, preset ${instance.ruleSet.preset}`);
console.log(`canFollow: ${fmt(follow.perSecond)} answers/s over ${fmt(pairs.length)} distinct pairs (no memo; ${follow.sink} yes)`);
console.log(`checkLine: ${fmt(full.perSecond)} full 30-day lines/s (${lineItems.length} lines, ${avgTrips.toFixed(1)} trips each, ${legalLines} legal)`);
console.log(`ratio canFollow / checkLine: ${fmt(follow.perSecond / full.perSecond)}`);
console.log(`target ${fmt(TARGET)} canFollow/s: ${follow.perSecond >= TARGET ? "met" : "NOT met"}`);
