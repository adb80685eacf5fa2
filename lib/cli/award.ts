/**
 * `npm run award -- <instance.json> [--mode strict|balanced] [--time-limit 600] [--out award.json]`:
 * awards an instance (or every instance of a bundle) with the column-generation
 * engine in a worker thread, shows a progress bar on a terminal, and prints a
 * summary per award group: coverage, open time, satisfaction, Jain's index, gap
 * and time; in strict mode, how each crew member's score was certified.
 * `--mode` overrides the instance's own mode (settings.mode).
 * `--method greedy` runs the greedy baseline instead. A bad file gets
 * an error naming the path of the bad field.
 */
import fs from "node:fs";
import { parseArgs } from "node:util";
import type { z } from "zod";
import { awardGroupKey, bundleSchema, instanceSchema, isAppError, type Instance } from "../domain/index.ts";
import { greedyAward, solveAwardInThread, type AwardResult } from "../award/index.ts";
import { fairnessReport } from "../fairness/index.ts";

const USAGE = `usage: npm run award -- <instance-or-bundle.json> [--mode strict|balanced] [--time-limit SECONDS] [--method column-generation|greedy] [--out FILE.json]`;

function fail(message: string, code = 2): never {
  console.error(`award: ${message}`);
  if (code === 2) console.error(USAGE);
  process.exit(code);
}

let parsed;
try {
  parsed = parseArgs({
    allowPositionals: true,
    options: {
      mode: { type: "string" },
      "time-limit": { type: "string" },
      method: { type: "string", default: "column-generation" },
      out: { type: "string" },
      help: { type: "boolean" },
    },
  });
} catch (e) {
  fail((e as Error).message);
}
const { values, positionals } = parsed;
if (values.help) {
  console.log(USAGE);
  process.exit(0);
}
if (positionals.length !== 1) fail("name one instance or bundle file");
const file = positionals[0]!;
const mode = values.mode;
if (mode !== undefined && mode !== "strict" && mode !== "balanced") fail(`--mode must be strict or balanced, not "${mode}"`);
if (values.method !== "column-generation" && values.method !== "greedy") fail(`--method must be column-generation or greedy, not "${values.method}"`);
const timeLimit = values["time-limit"] === undefined ? undefined : Number(values["time-limit"]);
if (timeLimit !== undefined && !(timeLimit > 0 && timeLimit <= 86_400)) fail(`--time-limit must be a number of seconds in (0, 86400], not "${values["time-limit"]}"`);

/** "pairings[3].dutyPeriods[0].report: …" for each issue. */
function describe(error: z.ZodError, prefix: string): string {
  return error.issues
    .slice(0, 12)
    .map((i) => `  ${prefix}${i.path.map((p) => (typeof p === "number" ? `[${p}]` : `.${String(p)}`)).join("").replace(/^\./, "")}: ${i.message}`)
    .join("\n") + (error.issues.length > 12 ? `\n  … and ${error.issues.length - 12} more` : "");
}

let raw: unknown;
try {
  raw = JSON.parse(fs.readFileSync(file, "utf8"));
} catch (e) {
  fail(`${file}: ${(e as Error).message}`, 1);
}
const isBundle = typeof raw === "object" && raw !== null && "instances" in raw;
let instances: Instance[];
if (isBundle) {
  const r = bundleSchema.safeParse(raw);
  if (!r.success) fail(`${file} is not a valid bundle:\n${describe(r.error, "")}`, 1);
  instances = r.data.instances;
} else {
  const r = instanceSchema.safeParse(raw);
  if (!r.success) fail(`${file} is not a valid instance:\n${describe(r.error, "")}`, 1);
  instances = [r.data];
}

const tty = process.stderr.isTTY === true;
function bar(group: string, percent: number, message: string): void {
  if (!tty) return;
  const width = 24;
  const filled = Math.round((Math.max(0, Math.min(100, percent)) / 100) * width);
  const line = `${group} [${"#".repeat(filled)}${"-".repeat(width - filled)}] ${percent.toFixed(0).padStart(3)} % ${message}`;
  process.stderr.write(`\r${line.slice(0, (process.stderr.columns || 100) - 1).padEnd((process.stderr.columns || 100) - 1)}`);
}

const hours = (minutes: number) => `${(minutes / 60).toFixed(1)} h`;
const results: { group: string; result: AwardResult }[] = [];
for (const original of instances) {
  const instance: Instance = {
    ...original,
    settings: { ...original.settings, ...(mode ? { mode } : {}), ...(timeLimit !== undefined ? { timeLimitSeconds: timeLimit } : {}) },
  };
  const group = awardGroupKey(instance.group);
  const t0 = performance.now();
  let result: AwardResult;
  try {
    result =
      values.method === "greedy"
        ? greedyAward(instance)
        : await solveAwardInThread(instance, { onProgress: (p) => bar(group, p.percent, p.message) });
  } catch (e) {
    if (tty) process.stderr.write("\n");
    fail(`${group}: ${isAppError(e) ? e.message : (e as Error).stack}`, 1);
  }
  if (tty) process.stderr.write("\r\x1b[K");
  const seconds = (performance.now() - t0) / 1000;
  const seniority = new Map(instance.crew.map((c) => [c.id, c.seniority]));
  const fairness = fairnessReport(result.award.lines.map((l) => ({ seniority: seniority.get(l.crewId)!, satisfaction: l.satisfaction })));
  const positions = instance.pairings.reduce((t, p) => t + (p.crewNeeded[instance.group.position] ?? 0), 0);
  const { report, stats } = result;
  const reserve = result.award.lines.filter((l) => l.kind === "reserve").length;
  console.log(`${group} — ${instance.crew.length} crew, ${instance.pairings.length} pairings (${values.method}${values.method === "greedy" ? "" : `, ${instance.settings.mode}`})`);
  console.log(`  coverage      ${positions - report.openPositions} of ${positions} positions; open time ${hours(report.openCreditMinutes)} in ${report.openPositions} positions${report.illegalPairings.length ? ` (${report.illegalPairings.length} pairings illegal in themselves)` : ""}`);
  console.log(`  satisfaction  mean ${fairness.mean.toFixed(3)}, minimum ${fairness.min.toFixed(3)}; Jain ${fairness.jain.toFixed(3)}, Gini ${fairness.gini.toFixed(3)}; ${reserve} on reserve`);
  if (report.method !== "greedy") {
    const gap = Number.isFinite(report.gap) ? `${(report.gap * 100).toFixed(2)} %` : "unknown (no bound)";
    console.log(`  solver        objective ${report.objective.toFixed(4)}, LP bound ${report.lpBound.toFixed(4)}, gap ${gap}${report.provenOptimal ? " (proven optimal)" : ""}; ${stats.columns} lines, ${stats.rounds} pricing rounds; stopped by ${stats.stoppedBy}`);
  }
  if (report.strictSteps) {
    const steps = Object.entries(report.strictSteps).map(([method, count]) => `${method} ${count}`).join(", ");
    console.log(`  seniority     each crew member's score certified by: ${steps}`);
  }
  console.log(`  time          ${seconds.toFixed(1)} s`);
  for (const w of report.warnings) console.log(`  note          ${w}`);
  for (const s of report.fairnessShortfalls.slice(0, 5)) console.log(`  below floor   ${s.crewId} by ${s.shortfall.toFixed(3)}`);
  results.push({ group, result });
}
if (values.out) {
  const body = results.map(({ result }) => ({ award: result.award, stats: result.stats, report: result.report }));
  fs.writeFileSync(values.out, `${JSON.stringify(isBundle ? body : body[0], null, 2)}\n`);
  console.log(`wrote ${values.out}`);
}
