/**
 * The award benchmark (`npm run bench:award -- [--instances S,M,L,pub1:BAA,…]
 * [--methods column-generation,greedy,compact-mip] [--time-limit 180]`): every
 * method on every instance at the same time limit, one after the other, each in
 * its own process (peak memory is per method), side by side in one run on one
 * machine. Prints the table and writes it to docs/benchmarks.md.
 * Methods: column-generation (weighted balance), strict (strict seniority),
 * greedy, compact-mip, compact-strict (strict seniority with the compact model
 * and stacked objectives); instances may carry "@0.8" (that share of the crew).
 * With strict and compact-strict both run, a second table compares them where
 * both reach the same lexicographic scores.
 * `--rows FILE` renders rows already measured by bench-award-one (one JSON line
 * each) instead of running them, with `--note` saying how they were run;
 * `--save-rows FILE` appends each measured row to FILE as it comes.
 * Targets (issue 5): L weighted ≤ 3 minutes with gap ≤ 0.5 % and ≤ 2 GB;
 * coverage 100 % wherever the LP shows it possible. Issue 6: L strict ≤ 10
 * minutes and ≤ 2 GB with the audits clean; open time at 0.8 crew beside the
 * greedy award's; on M, strict ≥ 20× faster than compact-strict.
 */
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import { parseArgs } from "node:util";

const { values } = parseArgs({
  options: {
    instances: { type: "string", default: "S,M,L,pub1:BAA,pub1:BAB,pub1:BAC,pub2:BAA,pub2:BAB,pub2:BAC" },
    methods: { type: "string", default: "column-generation,greedy,compact-mip" },
    "time-limit": { type: "string", default: "180" },
    out: { type: "string", default: "docs/benchmarks.md" },
    rows: { type: "string" },
    note: { type: "string" },
    "save-rows": { type: "string" },
  },
});
const instances = values.instances.split(",");
const methods = values.methods.split(",");
const seconds = values["time-limit"];

interface Row {
  instance: string;
  method: string;
  crew?: number;
  pairings?: number;
  seconds?: number;
  positions?: number;
  openPositions?: number;
  openCreditMinutes?: number;
  coverageLpBound?: number;
  mean?: number;
  min?: number;
  jain?: number;
  gap?: number | null;
  columns?: number;
  rounds?: number;
  stoppedBy?: string | null;
  peakMB?: number;
  strictSteps?: Record<string, number> | null;
  stacked?: { settled: number; steps: number; coverage: boolean; stoppedAt?: string } | null;
  scores?: number[] | null;
  audit?: { problems: number; first: string | null; swapsTried: number; movesTried: number; seconds: number } | null;
  error?: string;
}

const rows: Row[] = values.rows
  ? fs.readFileSync(values.rows, "utf8").split("\n").filter((l) => l.trim()).map((l) => JSON.parse(l) as Row)
  : [];
for (const instance of values.rows ? [] : instances) {
  for (const method of methods) {
    process.stderr.write(`${instance} ${method} … `);
    try {
      const out = execFileSync("node_modules/.bin/tsx", ["lib/cli/bench-award-one.ts", instance, method, seconds], {
        encoding: "utf8",
        // a method may overrun its limit while finishing; give it twice the limit, then record the overrun
        timeout: (Number(seconds) * 2 + 120) * 1000,
        maxBuffer: 16 * 1024 * 1024,
      });
      const row = JSON.parse(out.trim().split("\n").at(-1)!) as Row;
      rows.push(row);
      if (values["save-rows"]) fs.appendFileSync(values["save-rows"], `${JSON.stringify(row)}\n`);
      process.stderr.write(`${row.seconds!.toFixed(1)} s\n`);
    } catch (e) {
      const failed = e as { killed?: boolean; code?: string; stderr?: string; message?: string };
      // The child's own last words say why; the spawn error only says that it failed.
      const why = (failed.stderr ?? "").split("\n").filter((l) => /Error|error:/.test(l)).at(-1)?.trim();
      const message = failed.killed || failed.code === "ETIMEDOUT" ? `killed after ${Number(seconds) * 2 + 120} s` : (why ?? String(failed.message).split("\n")[0]!);
      rows.push({ instance, method, error: message });
      if (values["save-rows"]) fs.appendFileSync(values["save-rows"], `${JSON.stringify({ instance, method, error: message })}\n`);
      process.stderr.write(`failed: ${message}\n`);
    }
  }
}

const steps = (r: Row) =>
  r.stacked ? `${r.stacked.coverage ? "coverage, " : ""}${r.stacked.settled} of ${r.stacked.steps} crew settled`
  : r.strictSteps ? Object.entries(r.strictSteps).sort((a, b) => b[1] - a[1]).map(([method, count]) => `${method} ${count}`).join(", ") : "—";
const audits = (r: Row) =>
  !r.audit ? "—" : r.audit.problems === 0 ? `clean (${r.audit.swapsTried} swaps, ${r.audit.movesTried} moves)` : `${r.audit.problems} problems, first: ${r.audit.first}`;
const f = (x: number | undefined | null, digits = 3) => (x === undefined || x === null ? "—" : x.toFixed(digits));
const table = [
  "| instance | crew × pairings | method | time (s) | open positions | open time (h) | LP bound on open time (h) | mean sat. | min sat. | Jain | gap to LP bound | strict steps | audits | lines | rounds | stopped by | peak memory (MB) |",
  "| --- | --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- | --- | ---: | ---: | --- | ---: |",
  ...rows.map((r) =>
    r.error
      ? `| ${r.instance} | | ${r.method} | | | | | | | | | | | | | ${r.error} | |`
      : `| ${r.instance} | ${r.crew} × ${r.pairings} | ${r.method} | ${f(r.seconds, 1)} | ${r.openPositions} of ${r.positions} | ${f(r.openCreditMinutes! / 60, 1)} | ${r.method === "column-generation" || r.method === "strict" ? f(r.coverageLpBound! / 60, 1) : "—"} | ${f(r.mean)} | ${f(r.min)} | ${f(r.jain)} | ${r.method !== "strict" && r.gap !== null && r.gap !== undefined ? `${(r.gap * 100).toFixed(2)} %` : "—"} | ${steps(r)} | ${audits(r)} | ${r.columns ?? "—"} | ${r.rounds ?? "—"} | ${r.stoppedBy ?? "—"} | ${f(r.peakMB, 0)} |`,
  ),
].join("\n");

/** The first place where two strict awards differ lexicographically (coverage, then scores in seniority order), or undefined. */
function firstDifference(a: Row, b: Row): string | undefined {
  if (a.openCreditMinutes !== b.openCreditMinutes || a.openPositions !== b.openPositions) return `coverage: open ${f(a.openCreditMinutes! / 60, 1)} h against ${f(b.openCreditMinutes! / 60, 1)} h`;
  const k = a.scores!.findIndex((s, i) => Math.abs(s - b.scores![i]!) > 1e-6);
  return k < 0 ? undefined : `seniority place ${k + 1}: ${f(a.scores![k])} against ${f(b.scores![k])}`;
}
const pairs = rows.flatMap((b) => {
  const a = rows.find((r) => r.instance === b.instance && r.method === "strict");
  return b.method === "compact-strict" && a ? [[a, b] as const] : [];
});
const comparison = pairs.length
  ? [
      "",
      "Strict seniority against the compact MIP with stacked objectives (the same time limit; a ratio only where both end every step with the same lexicographic scores):",
      "",
      "| instance | strict (s) | compact-strict (s) | compact-strict's state | same lexicographic scores | speed-up |",
      "| --- | ---: | ---: | --- | --- | ---: |",
      ...pairs.map(([a, b]) => {
        if (a.error || b.error) return `| ${b.instance} | ${f(a.seconds, 1)} | — | ${(b.error ?? a.error)!.slice(0, 80)} | — | — |`;
        const done = b.stacked!.coverage && b.stacked!.settled === b.stacked!.steps;
        const differs = a.scores && b.scores ? firstDifference(a, b) : "no scores";
        const same = differs === undefined;
        const state = done ? "every step ended" : `stopped at ${b.stacked!.stoppedAt}: ${b.stacked!.settled} of ${b.stacked!.steps} settled`;
        return `| ${b.instance} | ${f(a.seconds, 1)} | ${f(b.seconds, 1)} | ${state} | ${same ? "yes" : `no (${differs})`} | ${done && same ? `${f(b.seconds! / a.seconds!, 1)}×` : "—"} |`;
      }),
    ].join("\n")
  : "";

const doc = `# Award benchmark

Written by lib/cli/bench-award.ts (\`npm run bench\`); do not edit by hand.

- Run: ${values.note ?? `${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC on ${os.cpus().length} × ${os.cpus()[0]?.model ?? "unknown CPU"}, Node ${process.version}; every run one after the other in its own process, at a time limit of ${seconds} s.`}
- Instances: S (30 crew, 120 pairings), M (150, 600) and L (300, 1,650), generated for 31 days with seed 1 (the fictional Larkfield Air, captains at Halvern); pubN:BASE is the published instance N (Kasirzadeh, Saddoune & Soumis 2017) at one crew base, under the data set's own rule set.
- Instances with "@0.8" keep 0.8 of the crew, evenly through the seniority list (fewer crew than the trips need, so that coverage binds).
- Mode: column-generation is weighted balance (β = 1, rank decay 0.8, no fairness floor); strict is strict seniority (coverage first, then each crew member's score in seniority order), and its "strict steps" count the certificates of its crew members (see DEVELOPERS.md, "Strict seniority"): best-alone, coverage, reserve-minimum, enumeration and no-legal-line are proofs, unproven is not. Satisfaction is each crew member's score over the best line they could hold alone.
- "Audits" (strict modes): the tests' swap and move audits with a whole-line legality re-check of every line (tests/unit/award/oracle/audits.ts, through lib/rules and lib/domain only), run after the clock stops.
- "Gap to LP bound" is (bound − objective) / bound with the engine's Lagrangian bound; the greedy award has no bound. "LP bound on open time" is the engine's lower bound on the open time any award can reach.

${table}
${comparison}
`;
fs.mkdirSync("docs", { recursive: true });
fs.writeFileSync(values.out, doc);
console.log(table);
console.log(`wrote ${values.out}`);
