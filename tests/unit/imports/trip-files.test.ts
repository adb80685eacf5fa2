/** readTripFiles and readCrewFiles: a refused row is reported once, not again by the rows that depend on it. */
import { describe, expect, it } from "vitest";
import { readCrewFiles } from "@/lib/imports/crew-files";
import { readTripFiles } from "@/lib/imports/trip-files";
import { csvTexts } from "@/seed/generator/write-csv";
import { smallScenario, smallScenarioBundle } from "@/seed/small-scenario";

const texts = csvTexts(smallScenarioBundle(smallScenario({ seed: 12, now: new Date("2027-01-01T12:00:00Z") })));
// The stations the legs name, as the database would know them.
const stations = new Set(texts["legs.csv"].split("\n").slice(1).flatMap((l) => l.split(",").slice(6, 8)).filter(Boolean));
const ctx = { baseCode: "HLV", zone: "America/Denver", startDate: "2027-02-01", endDate: "2027-02-28", stations };

describe("import problems", () => {
  it("reads the generator's own files with no problem", () => {
    const read = readTripFiles(texts["trips.csv"], texts["legs.csv"], ctx);
    expect(read.problems).toEqual([]);
    expect(read.pairings).toHaveLength(36);
  });

  it("reports a trip's bad row once, and not its legs as belonging to no trip", () => {
    const trips = texts["trips.csv"].split("\n");
    const cells = trips[1]!.split(",");
    cells[2] = "lots";
    trips[1] = cells.join(",");
    const read = readTripFiles(trips.join("\n"), texts["legs.csv"], ctx);
    expect(read.problems).toEqual([{ file: "trips.csv", line: 2, column: "block_minutes", message: "expected a whole number of minutes such as 540" }]);
  });

  it("reports a crew member's bad row once, and not their activities as belonging to no one", () => {
    const crew = texts["crew.csv"].trimEnd().split("\n");
    const newcomer = "NEW9,Ada Newcomer,99,HLV,navigator,A220";
    const read = readCrewFiles([...crew, newcomer].join("\n"), "employee_number,kind,start_utc,end_utc,label\nNEW9,training,2027-02-03T15:00:00Z,2027-02-04T01:00:00Z,\n", {
      baseCode: "HLV",
      periodStart: "2027-02-01T07:00:00Z",
      periodEnd: "2027-03-01T07:00:00Z",
      known: new Map(),
    });
    expect(read.problems.map((p) => [p.file, p.line, p.column])).toEqual([["crew.csv", 14, "position"]]);
  });
});
