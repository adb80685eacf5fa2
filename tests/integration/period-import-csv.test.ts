/**
 * Creating a period and loading it from the planner's CSV files
 * (docs/csv-format.md) through lib/db/period-csv-import.ts: the happy path
 * gives back the generator's own trips, field for field; a re-import changes
 * nothing; and each bad file (missing column, bad time, unknown station,
 * duplicate trip number, a 5 MB file) is refused with its file, line, column
 * and reason, importing nothing.
 */
import { beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/client";
import { createPeriod } from "@/lib/db/period-create";
import { openBidding } from "@/lib/db/period-lifecycle";
import { importCsvFiles, type CsvFiles } from "@/lib/db/period-csv-import";
import { pairingFromRow } from "@/lib/db/pairing-rows";
import { canonicalJson, isAppError, pairingSchema } from "@/lib/domain/index";
import type { ImportProblem } from "@/lib/imports/csv-table";
import { csvTexts } from "@/seed/generator/write-csv";
import { smallScenario, smallScenarioBundle } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

const DEC_1 = new Date("2026-12-01T12:00:00Z");
// The same crew in February 2027, with other trips (seed 12) and the vacation moved to February.
const february = smallScenarioBundle(smallScenario({ seed: 12, now: new Date("2027-01-01T12:00:00Z") }));
const texts = csvTexts(february);
const files: CsvFiles = { trips: texts["trips.csv"], legs: texts["legs.csv"], crew: texts["crew.csv"], activities: texts["activities.csv"] };
let scheduler = "";
let feb = "";

/** The problems an import was refused with (it must be refused). */
async function refused(periodId: string, f: CsvFiles): Promise<ImportProblem[]> {
  try {
    await importCsvFiles(periodId, scheduler, f);
  } catch (error) {
    if (isAppError(error, "invalid")) return (error.details?.problems ?? []) as ImportProblem[];
    throw error;
  }
  throw new Error("the import was not refused");
}

/** Every trip of the period, as lib/domain pairings, canonical JSON by trip number. */
async function storedTrips(periodId: string): Promise<Map<string, string>> {
  const rows = await db().pairing.findMany({
    where: { bidPeriodId: periodId },
    include: { dutyPeriods: { orderBy: { seq: "asc" }, include: { legs: { orderBy: { seq: "asc" } } } } },
  });
  return new Map(rows.map((r) => [r.code, canonicalJson(pairingSchema.parse(pairingFromRow(r, "HLV")))]));
}

/** Replaces line `n` (1-based) of `text` with `edit(line)`. */
function editLine(text: string, n: number, edit: (line: string) => string): string {
  const lines = text.split("\n");
  lines[n - 1] = edit(lines[n - 1]!);
  return lines.join("\n");
}

describe("creating a period and importing its CSV files", () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    await writeScenario(db(), smallScenario({ now: DEC_1 }));
    scheduler = (await db().user.findFirstOrThrow({ where: { role: "scheduler" } })).id;
  });

  it("creates a draft for a base, with the groups and settings of the base's last period, and refuses an overlapping one", async () => {
    const jan = await db().awardGroup.findMany({ where: { bidPeriod: { name: "January 2027" } }, orderBy: { position: "asc" } });
    await db().awardGroup.updateMany({ where: { id: jan[0]!.id }, data: { settings: { mode: "balanced", timeLimitSeconds: 90 } } });
    const created = await createPeriod({ baseCode: "HLV", startDate: "2027-02-01", endDate: "2027-02-28" }, scheduler);
    feb = created.id;
    expect(created.message).toBe("February 2027 at HLV is a draft: bidding Fri, Jan 1, 00:00 MST to Wed, Jan 20, 18:00 MST. Import its trips next.");
    const groups = await db().awardGroup.findMany({ where: { bidPeriodId: feb }, orderBy: { position: "asc" } });
    expect(groups.map((g) => [g.position, g.ruleSetId, g.settings])).toEqual([
      [jan[0]!.position, jan[0]!.ruleSetId, { mode: "balanced", timeLimitSeconds: 90 }],
      [jan[1]!.position, jan[1]!.ruleSetId, jan[1]!.settings],
    ]);
    await expect(createPeriod({ baseCode: "HLV", startDate: "2027-02-15", endDate: "2027-03-14" }, scheduler)).rejects.toThrow("HLV already has a period over those days: February 2027");
    await expect(createPeriod({ baseCode: "HLV", startDate: "2027-04-01", endDate: "2027-05-30" }, scheduler)).rejects.toThrow(/at most 42 days; this one is 60/);
    await expect(createPeriod({ baseCode: "ZZZ", startDate: "2027-04-01", endDate: "2027-04-30" }, scheduler)).rejects.toThrow("there is no base ZZZ");
    expect((await db().auditEvent.findMany({ where: { entityId: feb } })).map((a) => a.action)).toEqual(["period.created"]);
  });

  it("refuses each bad file with its line, column and reason, and imports nothing", async () => {
    const trips = files.trips!;
    const legs = files.legs!;
    // missing column
    const noCredit = trips
      .split("\n")
      .map((l) => l.split(",").filter((_, k) => k !== 3).join(","))
      .join("\n");
    expect(await refused(feb, { ...files, trips: noCredit })).toContainEqual({ file: "trips.csv", line: 1, column: "credit_minutes", message: 'missing column "credit_minutes"' });
    // a bad time on line 5 of legs.csv
    const badTime = editLine(legs, 5, (l) => l.replace(/,(\d{4}-\d\d-\d\dT[\d:]+Z),(\d{4}-\d\d-\d\dT[\d:]+Z),(yes|no),/, ",2027-02-30T25:10:00Z,$2,$3,"));
    expect(await refused(feb, { ...files, legs: badTime })).toEqual([
      { file: "legs.csv", line: 5, column: "departs_utc", message: '"2027-02-30T25:10:00Z" is not a UTC instant: write it like 2027-03-14T08:00:00Z (a real date, 24-hour time, ending in Z)' },
    ]);
    // an unknown station on line 3
    const unknown = editLine(legs, 3, (l) => {
      const cells = l.split(",");
      cells[7] = "QQQ";
      return cells.join(",");
    });
    expect(await refused(feb, { ...files, legs: unknown })).toEqual([
      { file: "legs.csv", line: 3, column: "to", message: "Bidwright does not know station QQQ, so it has no time zone for it: check the code (new stations come with a JSON import of a period that uses them)" },
    ]);
    // a trip number twice: line 2's trip again at the end
    const twice = trips.trimEnd() + "\n" + trips.split("\n")[1]! + "\n";
    const last = twice.trimEnd().split("\n").length;
    expect(await refused(feb, { ...files, trips: twice })).toEqual([
      { file: "trips.csv", line: last, column: "trip", message: `trip ${trips.split("\n")[1]!.split(",")[0]} appears twice (first on line 2); a trip number is unique in the period` },
    ]);
    // the templates alone: trips.csv with no trips would remove them all
    const header = (t: string) => t.split("\n")[0] + "\n";
    expect(await refused(feb, { trips: header(trips), legs: header(legs) })).toEqual([
      { file: "trips.csv", message: "the file holds no trips, only its header: a period's trips come from it, so importing it would remove them all" },
    ]);
    // a 5 MB legs.csv
    const big = legs + legs.split("\n").slice(1).join("\n").repeat(Math.ceil((5 * 1024 * 1024) / legs.length) + 1);
    expect(Buffer.byteLength(big)).toBeGreaterThan(5 * 1024 * 1024);
    const tooBig = await refused(feb, { ...files, legs: big });
    expect(tooBig).toHaveLength(1);
    expect(tooBig[0]!.file).toBe("legs.csv");
    expect(tooBig[0]!.line).toBeUndefined();
    expect(tooBig[0]!.message).toMatch(/^the file is 5\.\d MB; a CSV file may be at most 4\.0 MB$/);
    // crew: a seniority number given twice, an unknown position, a crew member of another base
    const crew = editLine(editLine(files.crew!, 3, (l) => l.replace(/,2,HLV,/, ",1,HLV,")), 4, (l) => l.replace("captain", "navigator").replace("first_officer", "navigator"));
    const crewProblems = await refused(feb, { crew });
    expect(crewProblems.map((p) => [p.file, p.line, p.column])).toEqual([
      ["crew.csv", 3, "seniority"],
      ["crew.csv", 4, "position"],
    ]);
    expect(crewProblems[1]!.message).toBe('"navigator" is not a position: use captain, first_officer, purser or flight_attendant');
    // Leave from 30 January: it would change January, whose bidding is open.
    const employee = files.crew!.split("\n")[2]!.split(",")[0]!;
    await expect(importCsvFiles(feb, scheduler, { activities: `employee_number,kind,start_utc,end_utc,label\n${employee},vacation,2027-01-30T07:00:00Z,2027-02-03T07:00:00Z,\n` })).rejects.toThrow(
      `the activities file adds employee ${employee}'s vacation from 2027-01-30T07:00:00Z to 2027-02-03T07:00:00Z, which reaches into January 2027 (open for bidding): that period's bids and runs use the activities as they are; nothing was imported`,
    );
    expect((await storedTrips(feb)).size).toBe(0);
    expect(await db().auditEvent.count({ where: { entityId: feb, action: "period.imported" } })).toBe(0);
  });

  it("imports the files: the stored trips are the generator's, field for field", async () => {
    const result = await importCsvFiles(feb, scheduler, files);
    const pairings = new Map(february.instances.flatMap((i) => i.pairings).map((p) => [p.id, canonicalJson(p)]));
    expect(result.trips).toEqual({ added: pairings.size, changed: 0, removed: 0, unchanged: 0 });
    // The same twelve crew as January's period: all unchanged; the vacationer's leave moves to February.
    expect(result.crew).toEqual({ added: 0, changed: 0, removed: 0, unchanged: 12 });
    expect(result.activities).toEqual({ replaced: 1, unchanged: 11, rows: 1, kept: 0, keptIn: [] });
    expect(result.changed).toBe(true);
    expect(await storedTrips(feb)).toEqual(pairings);
  });

  it("changes nothing when the same files come again, and says so", async () => {
    const before = await storedTrips(feb);
    const ids = (await db().pairing.findMany({ where: { bidPeriodId: feb }, select: { id: true }, orderBy: { id: "asc" } })).map((p) => p.id);
    const again = await importCsvFiles(feb, scheduler, files);
    expect(again.changed).toBe(false);
    expect(again.message).toBe("Nothing changed: the files match what the period holds already.");
    expect(again.trips).toEqual({ added: 0, changed: 0, removed: 0, unchanged: before.size });
    expect(await storedTrips(feb)).toEqual(before);
    expect((await db().pairing.findMany({ where: { bidPeriodId: feb }, select: { id: true }, orderBy: { id: "asc" } })).map((p) => p.id)).toEqual(ids);
    expect(await db().auditEvent.count({ where: { entityId: feb, action: "period.imported" } })).toBe(1);
  });

  it("applies a changed file as the period's new state (a trip dropped, a qualification, a seniority swap), crew changes only once no other period is under way", async () => {
    const lines = files.trips!.trimEnd().split("\n");
    const dropped = lines[1]!.split(",")[0]!;
    const trips = [lines[0], ...lines.slice(2)].join("\n") + "\n";
    const legs = files.legs!.split("\n").filter((l) => !l.startsWith(`${dropped},`)).join("\n");
    // Swap seniority 1 and 2 and give seniority 3 a language.
    const crew = files.crew!.replace(/,1,HLV,/, ",X,HLV,").replace(/,2,HLV,/, ",1,HLV,").replace(/,X,HLV,/, ",2,HLV,");
    const crew2 = editLine(crew, 4, (l) => l.replace(/,A220(;[^,\n]*)?$/, ",A220;lang:fr"));
    // While January's bidding is under way its bids and runs use the crew list as it is: crew changes wait.
    const jan = await db().bidPeriod.findFirstOrThrow({ where: { name: "January 2027" } });
    await expect(importCsvFiles(feb, scheduler, { trips, legs, crew: crew2 })).rejects.toThrow(
      /^the crew list in crew\.csv differs \(employee \d+ \(line 2\), .*\) while January 2027 \(open for bidding\) at this base is not yet published, .* Nothing was imported$/,
    );
    expect((await storedTrips(feb)).has(dropped)).toBe(true);
    await db().bidPeriod.update({ where: { id: jan.id }, data: { state: "published" } });
    const result = await importCsvFiles(feb, scheduler, { trips, legs, crew: crew2 });
    await db().bidPeriod.update({ where: { id: jan.id }, data: { state: "open" } });
    expect(result.trips).toMatchObject({ added: 0, changed: 0, removed: 1 });
    expect(result.crew).toEqual({ added: 0, changed: 3, removed: 0, unchanged: 9 });
    expect((await storedTrips(feb)).has(dropped)).toBe(false);
    const top = await db().crewMember.findMany({ where: { seniority: { in: [1, 2, 3] } }, orderBy: { seniority: "asc" } });
    const original = february.instances.flatMap((i) => i.crew).sort((a, b) => a.seniority - b.seniority);
    expect(top.map((c) => c.employeeNumber)).toEqual([original[1]!.id, original[0]!.id, original[2]!.id]);
    expect(top[2]!.qualifications).toEqual(["A220", "lang:fr"]);
  });

  it("refuses imports once bidding is open, and a second open period at the base", async () => {
    const jan = await db().bidPeriod.findFirstOrThrow({ where: { name: "January 2027" } });
    await expect(importCsvFiles(jan.id, scheduler, files)).rejects.toThrow("imports change a period only while it is a draft, and January 2027 is open: crew bid on its trips as they are");
    await expect(importCsvFiles(feb, scheduler, { trips: files.trips })).rejects.toThrow("import trips.csv and legs.csv together: a trip's legs are in legs.csv");
    // February has its trips now, but January's bidding is still open at the base.
    await expect(openBidding(feb, scheduler, DEC_1)).rejects.toThrow("bidding for January 2027 at this base is still open: close it before opening February 2027");
  });
});
