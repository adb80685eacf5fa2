/**
 * One benchmark run in a process of its own (so that peak memory is this
 * method's alone): `tsx lib/cli/bench-award-one.ts <instance> <method> <seconds>`
 * prints one JSON line of figures. Instances: "S", "M", "L" (generated, seed 1,
 * captains) and "pub1:BAB"-style (the published data set's instance and base);
 * a suffix "@0.8" keeps that share of the crew (every crew member whose place in
 * seniority order falls in the kept share, spread evenly: see fewerCrew), so
 * that coverage binds. Methods: "column-generation" (balanced), "strict"
 * (column generation in strict seniority), "greedy", "compact-mip" (balanced),
 * "compact-strict" (strict seniority with the compact model and stacked
 * objectives: the baseline of issue 6).
 */
import type { Instance } from "../domain/index.ts";
import { instanceSchema } from "../domain/index.ts";
import { greedyAward, solveAward, type AwardResult } from "../award/index.ts";
import type { StackedProgress } from "../award/compact-mip.ts";
import { fairnessReport } from "../fairness/index.ts";
import { generatePeriod } from "../../seed/generator/generate-period.ts";
import { loadKasirzadeh } from "../../seed/published/kasirzadeh-2017.ts";

export const GENERATED = {
  S: { crew: 30, pairings: 120 },
  M: { crew: 150, pairings: 600 },
  L: { crew: 300, pairings: 1650 },
} as const;

/** The instance with `share` of its crew, kept evenly through the seniority list (the k-th of n kept when ⌊k·share⌋ grows). */
export function fewerCrew(instance: Instance, share: number): Instance {
  const sorted = [...instance.crew].sort((a, b) => a.seniority - b.seniority);
  const kept = sorted.filter((_, k) => Math.floor((k + 1) * share) > Math.floor(k * share));
  const ids = new Set(kept.map((c) => c.id));
  const bids = Object.fromEntries(Object.entries(instance.bids).filter(([id]) => ids.has(id)));
  return { ...instance, crew: kept, bids };
}

export function benchInstance(name: string): Instance {
  const scaled = /^(.*)@([0-9.]+)$/.exec(name);
  if (scaled) return fewerCrew(benchInstance(scaled[1]!), Number(scaled[2]));
  const size = GENERATED[name as keyof typeof GENERATED];
  if (size) return generatePeriod({ ...size, days: 31, seed: 1, positions: ["captain"] }).instances[0]!;
  const match = /^pub([12]):([A-Z]{3})$/.exec(name);
  if (!match) throw new Error(`unknown benchmark instance "${name}"`);
  const { instances } = loadKasirzadeh(`tests/fixtures/kasirzadeh-2017/instance${match[1]}`, { seed: 7 });
  const found = instances.find((i) => i.group.base === match[2]);
  if (!found) throw new Error(`no base ${match[2]} in published instance ${match[1]}`);
  return found;
}

async function main(): Promise<void> {
  const [name, method, seconds] = process.argv.slice(2);
  if (!name || !method || !seconds) throw new Error("usage: bench-award-one <instance> <method> <seconds>");
  const base = benchInstance(name);
  const mode = method === "strict" || method === "compact-strict" ? "strict" : "balanced";
  const instance = instanceSchema.parse({ ...base, settings: { ...base.settings, mode, timeLimitSeconds: Number(seconds) } });
  const t0 = performance.now();
  let result: AwardResult;
  let stacked: StackedProgress | null = null;
  if (method === "column-generation" || method === "strict") result = await solveAward(instance);
  else if (method === "greedy") result = greedyAward(instance);
  else if (method === "compact-mip") {
    const { compactMipAward } = await import("../award/compact-mip.ts");
    result = await compactMipAward(instance, { timeLimitSeconds: Number(seconds) });
  } else if (method === "compact-strict") {
    const { compactStrictAward } = await import("../award/compact-mip.ts");
    const baseline = await compactStrictAward(instance, { timeLimitSeconds: Number(seconds) });
    ({ progress: stacked, ...result } = baseline);
  } else throw new Error(`unknown method "${method}"`);
  const elapsed = (performance.now() - t0) / 1000;
  const peakMB = process.resourceUsage().maxRSS / 1024;
  // Strict seniority: the tests' independent audits (swap, move and whole-line legality, through lib/rules
  // and lib/domain only), run after the clock stops.
  let audit: { problems: number; first: string | null; swapsTried: number; movesTried: number; seconds: number } | null = null;
  if (mode === "strict") {
    const { strictAudits } = await import("../../tests/unit/award/oracle/audits.ts");
    const a0 = performance.now();
    const found = strictAudits(instance, result.award);
    audit = { problems: found.problems.length, first: found.problems[0] ?? null, swapsTried: found.swapsTried, movesTried: found.movesTried, seconds: (performance.now() - a0) / 1000 };
  }
  const seniority = new Map(instance.crew.map((c) => [c.id, c.seniority]));
  const fairness = fairnessReport(result.award.lines.map((l) => ({ seniority: seniority.get(l.crewId)!, satisfaction: l.satisfaction })));
  const positions = instance.pairings.reduce((t, p) => t + (p.crewNeeded[instance.group.position] ?? 0), 0);
  const { report, stats } = result;
  console.log(
    JSON.stringify({
      instance: name,
      method,
      crew: instance.crew.length,
      pairings: instance.pairings.length,
      seconds: elapsed,
      positions,
      openPositions: report.openPositions,
      openCreditMinutes: report.openCreditMinutes,
      coverageLpBound: report.coverageLpBound,
      mean: fairness.mean,
      min: fairness.min,
      jain: fairness.jain,
      objective: report.objective,
      lpBound: Number.isFinite(report.lpBound) ? report.lpBound : null,
      gap: Number.isFinite(report.gap) ? report.gap : null,
      columns: stats.columns,
      rounds: stats.rounds,
      // "optimal" only when proven; a search that ended by itself short of a proof says so.
      stoppedBy: report.provenOptimal ? "optimal" : stats.stoppedBy === "optimal" ? "search ended" : (stats.stoppedBy ?? null),
      neighbourhoods: report.neighbourhoods ?? null,
      strictSteps: report.strictSteps ?? null,
      stacked,
      audit,
      // strict seniority: each crew member's score in seniority order, to compare methods lexicographically
      scores: mode === "strict" ? [...result.award.lines].sort((a, b) => seniority.get(a.crewId)! - seniority.get(b.crewId)!).map((l) => l.score) : null,
      times: stats.times,
      // (measured before the audits: they hold every line at once too, but are not the method's memory)
      peakMB,
    }),
  );
}

if (process.argv[1]?.endsWith("bench-award-one.ts")) await main();
