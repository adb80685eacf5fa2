/**
 * The CSV files a planner loads into Bidwright (the format is ours; see
 * docs/csv-format.md). One row per thing, UTC instants, minutes as integers,
 * lists joined by ";". Written with npm csv-stringify.
 */
import fs from "node:fs";
import path from "node:path";
import { stringify } from "csv-stringify/sync";
import type { Bundle } from "../../lib/domain/index.ts";
import { POSITIONS } from "./csv-columns.ts";

/** The four files' texts for a bundle: trips.csv, legs.csv, crew.csv and activities.csv. */
export function csvTexts(bundle: Bundle): Record<"trips.csv" | "legs.csv" | "crew.csv" | "activities.csv", string> {
  const out = {} as Record<"trips.csv" | "legs.csv" | "crew.csv" | "activities.csv", string>;
  const write = (name: keyof typeof out, header: string[], rows: (string | number | boolean)[][]) => {
    out[name] = stringify([header, ...rows.map((r) => r.map(String))]);
  };
  const first = bundle.instances[0];
  if (!first) throw new Error("the bundle holds no instance");
  const pairings = new Map(bundle.instances.flatMap((i) => i.pairings).map((p) => [p.id, p]));
  const crew = bundle.instances.flatMap((i) => i.crew).sort((a, b) => a.seniority - b.seniority);
  write(
    "trips.csv",
    ["trip", "base", "block_minutes", "credit_minutes", "away_minutes", ...POSITIONS.map((p) => `need_${p}`), "requires"],
    [...pairings.values()].map((p) => [p.id, p.base, p.blockMinutes, p.creditMinutes, p.tafbMinutes, ...POSITIONS.map((pos) => p.crewNeeded[pos] ?? 0), p.requires.join(";")]),
  );
  write(
    "legs.csv",
    ["trip", "duty", "report_utc", "release_utc", "leg", "flight", "from", "to", "departs_utc", "arrives_utc", "deadhead", "block_minutes", "equipment"],
    [...pairings.values()].flatMap((p) =>
      p.dutyPeriods.flatMap((d, di) =>
        d.legs.map((l, li) => [p.id, di + 1, d.report, d.release, li + 1, l.flightNumber, l.from, l.to, l.departure, l.arrival, l.deadhead ? "yes" : "no", l.blockMinutes, l.equipment ?? ""]),
      ),
    ),
  );
  write(
    "crew.csv",
    ["employee_number", "name", "seniority", "base", "position", "qualifications"],
    crew.map((c) => [c.id, c.name, c.seniority, c.base, c.position, c.qualifications.join(";")]),
  );
  write(
    "activities.csv",
    ["employee_number", "kind", "start_utc", "end_utc", "label"],
    crew.flatMap((c) => c.fixedActivities.map((a) => [c.id, a.kind, a.start, a.end, a.label ?? ""])),
  );
  return out;
}

/** Writes trips.csv, legs.csv, crew.csv and activities.csv for a bundle into `dir`. */
export function writeCsv(bundle: Bundle, dir: string): string[] {
  fs.mkdirSync(dir, { recursive: true });
  const texts = csvTexts(bundle);
  for (const [name, text] of Object.entries(texts)) fs.writeFileSync(path.join(dir, name), text);
  return Object.keys(texts);
}
