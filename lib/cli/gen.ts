/**
 * `npm run gen -- --crew 150 --pairings 600 --seed 7 --out x.json`: a generated
 * bid period as the engine's JSON — an instance for one position, a bundle for
 * several — and, with --csv DIR, the planner's CSV files. Prints statistics.
 */
import fs from "node:fs";
import path from "node:path";
import { parseArgs } from "node:util";
import { generatePeriod } from "../../seed/generator/generate-period.ts";
import { instanceStats } from "../../seed/generator/period-stats.ts";
import { writeCsv } from "../../seed/generator/write-csv.ts";

const USAGE = `usage: npm run gen -- [--crew N] [--pairings N | --tightness X] [--seed N] [--positions captain,first_officer]
                     [--start YYYY-MM-DD] [--days N] [--out FILE.json] [--csv DIR]`;

function fail(message: string): never {
  console.error(`gen: ${message}\n${USAGE}`);
  process.exit(2);
}

function int(name: string, text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  if (!/^\d+$/.test(text)) fail(`--${name} must be a whole number, not "${text}"`);
  return Number(text);
}

let values;
try {
  ({ values } = parseArgs({
    options: {
      crew: { type: "string" }, pairings: { type: "string" }, tightness: { type: "string" }, seed: { type: "string" },
      positions: { type: "string" }, start: { type: "string" }, days: { type: "string" }, out: { type: "string" },
      csv: { type: "string" }, help: { type: "boolean" },
    },
    strict: true,
  }));
} catch (e) {
  fail((e as Error).message);
}
if (values.help) {
  console.log(USAGE);
  process.exit(0);
}
const tightness = values.tightness === undefined ? undefined : Number(values.tightness);
if (tightness !== undefined && !(tightness > 0)) fail(`--tightness must be a positive number, not "${values.tightness}"`);

let bundle;
try {
  bundle = generatePeriod({
    crew: int("crew", values.crew),
    pairings: int("pairings", values.pairings),
    seed: int("seed", values.seed),
    days: int("days", values.days),
    tightness,
    startDate: values.start,
    positions: values.positions?.split(",").map((p) => p.trim()) as never,
  });
} catch (e) {
  const issues = (e as { issues?: { path: PropertyKey[]; message: string }[] }).issues;
  fail(issues ? issues.map((i) => `${i.path.join(".") || "input"}: ${i.message}`).join("; ") : (e as Error).message);
}
const doc = bundle.instances.length === 1 ? bundle.instances[0] : bundle;
if (values.out) {
  fs.mkdirSync(path.dirname(path.resolve(values.out)), { recursive: true });
  fs.writeFileSync(values.out, `${JSON.stringify(doc, null, 2)}\n`);
  console.log(`wrote ${values.out}: ${bundle.instances.length === 1 ? "an instance" : `a bundle of ${bundle.instances.length} instances`}`);
}
if (values.csv) console.log(`wrote ${writeCsv(bundle, values.csv).map((f) => path.join(values.csv!, f)).join(", ")}`);
for (const instance of bundle.instances) console.log(JSON.stringify(instanceStats(instance)));
