// Bad input to the converter of the published data set (Kasirzadeh, Saddoune &
// Soumis 2017) is refused with a message naming the file and the line. The
// files here are tiny hand-made texts in the data set's layout.
import { describe, expect, it } from "vitest";
import { isAppError } from "@/lib/domain";
import { convertKasirzadeh, stationCodeFor, type KasirzadehFiles } from "@/seed/published/kasirzadeh-2017";

const bases = "airport , status , nbEmployees\nBASE1 , 1 , 2\nAIR1 , 0 , 0\nAIR27 , 0 , 0\n";
const day1 = [
  "#leg_nb , airport_dep , date_dep , hour_dep , airport_arr , date_arr , hour_arr",
  "LEG_01_0 , BASE1 , 2000-01-01 , 08:00 , AIR1 , 2000-01-01 , 09:30",
  "LEG_01_1 , AIR1 , 2000-01-01 , 10:15 , AIR27 , 2000-01-01 , 11:00",
].join("\n");
const day2 = [
  "#leg_nb , airport_dep , date_dep , hour_dep , airport_arr , date_arr , hour_arr",
  "LEG_02_0 , AIR27 , 2000-01-02 , 07:00 , BASE1 , 2000-01-02 , 08:15",
  "LEG_02_1 , BASE1 , 2000-01-02 , 12:00 , AIR1 , 2000-01-02 , 13:00",
].join("\n");
const solution = "Solution = {\n\nPairing 1 : Base BASE1 : LEG_01_0 , LEG_01_1 , LEG_02_0;\n\n};\n";

const files = (change: Partial<KasirzadehFiles> = {}): KasirzadehFiles => ({
  listOfBases: bases,
  days: { "day_1.csv": day1, "day_2.csv": day2 },
  initialSolution: solution,
  ...change,
});

function failure(input: KasirzadehFiles): string {
  try {
    convertKasirzadeh(input, { seed: 1 });
  } catch (error) {
    expect(isAppError(error, "invalid")).toBe(true);
    return (error as Error).message;
  }
  throw new Error("expected the converter to refuse the input");
}

describe("the converter on a tiny data set in the published layout", () => {
  it("converts good input: one duty split at a rest of 8 h or more, codes by the documented mapping", () => {
    const { instances } = convertKasirzadeh(files(), { seed: 1 });
    const pairing = instances[0]!.pairings[0]!;
    // 11:00 → 07:00 next day is a 20 h gap, so two duty periods.
    expect(pairing.dutyPeriods.map((d) => d.legs.map((l) => l.flightNumber))).toEqual([["LEG_01_0", "LEG_01_1"], ["LEG_02_0"]]);
    expect(pairing.dutyPeriods[0]!.legs[1]).toMatchObject({ from: "AAA", to: "ABA" });
    expect(pairing.base).toBe("BAA");
    // Flown 90 + 45 + 75 = 210 min; the day files' extra leg LEG_02_1 is flown by no pairing, and that is allowed.
    expect(pairing.creditMinutes).toBe(210);
    expect(instances[0]!.period).toMatchObject({ startDate: "2000-01-01", endDate: "2000-01-02" });
  });

  it("rounds half a deadhead minute up once per pairing", () => {
    const odd = solution.replace("LEG_01_1", "TDH_LEG_01_1");
    const { instances } = convertKasirzadeh(files({ initialSolution: odd }), { seed: 1 });
    // Flown 90 + 75, deadhead 45 min → 22.5 → 23.
    expect(instances[0]!.pairings[0]).toMatchObject({ blockMinutes: 165, creditMinutes: 188 });
  });

  it("names the file and line of a pairing naming an unknown leg", () => {
    const bad = solution.replace("LEG_01_1", "LEG_09_9");
    expect(failure(files({ initialSolution: bad }))).toBe(
      "initialSolution.in line 3: pairing 1 names leg LEG_09_9, which no day_N.csv file holds",
    );
  });

  it("names the file and line of a malformed CSV row", () => {
    const bad = day2.replace("LEG_02_1 , BASE1 , 2000-01-02 , 12:00 ,", "LEG_02_1 , BASE1 , 2000-01-02 ,");
    expect(failure(files({ days: { "day_1.csv": day1, "day_2.csv": bad } }))).toMatch(/^day_2\.csv line 3: expected 7 comma-separated fields/);
    const badTime = day1.replace("09:30", "9h30");
    expect(failure(files({ days: { "day_1.csv": badTime, "day_2.csv": day2 } }))).toMatch(/^day_1\.csv line 2: arrival of leg LEG_01_0/);
    const badCount = bases.replace("BASE1 , 1 , 2", "BASE1 , 1 , two");
    expect(failure(files({ listOfBases: badCount }))).toMatch(/^listOfBases\.csv line 2: number of pilots of BASE1 is "two"/);
  });

  it("names the file and line of an airport, a leg or a base it cannot place", () => {
    const stranger = day1.replace("AIR1 , 2000-01-01 , 09:30", "AIR9 , 2000-01-01 , 09:30");
    expect(failure(files({ days: { "day_1.csv": stranger, "day_2.csv": day2 } }))).toBe(
      "day_1.csv line 2: leg LEG_01_0 uses airport AIR9, which listOfBases.csv does not list",
    );
    const twice = day2.replace("LEG_02_1", "LEG_01_0");
    expect(failure(files({ days: { "day_1.csv": day1, "day_2.csv": twice } }))).toBe(
      "day_2.csv line 3: leg LEG_01_0 is listed again (first in day_1.csv line 2)",
    );
    expect(failure(files({ initialSolution: solution.replace("Base BASE1", "Base AIR1") }))).toMatch(
      /^initialSolution\.in line 3: pairing 1 has base AIR1, which listOfBases\.csv does not mark as a crew base/,
    );
    expect(failure(files({ initialSolution: solution.replace(" , LEG_02_0", "") }))).toBe(
      "initialSolution.in line 3: pairing 1 ends at AIR27, not at its base BASE1",
    );
    expect(failure(files({ initialSolution: solution.replace("LEG_01_0 , LEG_01_1", "LEG_01_1 , LEG_01_0") }))).toMatch(
      /^initialSolution\.in line 3: pairing 1: leg LEG_01_0 departs BASE1 but the leg before it, LEG_01_1, arrives at AIR27/,
    );
    expect(failure(files({ initialSolution: solution.replace("Pairing 1 :", "Pairing one :") }))).toMatch(
      /^initialSolution\.in line 3: expected "Pairing <n> : Base <airport> : <leg>, <leg>, …;"/,
    );
    expect(failure(files({ listOfBases: `${bases}GATE7 , 0 , 0\n` }))).toMatch(/^listOfBases\.csv line 5: airport "GATE7" is not BASE<n> or AIR<n>/);
  });

  it("maps station names as documented", () => {
    const at = { file: "listOfBases.csv", line: 1 };
    expect(["BASE1", "BASE2", "BASE3", "AIR1", "AIR26", "AIR27", "AIR32"].map((n) => stationCodeFor(n, at))).toEqual([
      "BAA", "BAB", "BAC", "AAA", "AAZ", "ABA", "ABF",
    ]);
  });
});
