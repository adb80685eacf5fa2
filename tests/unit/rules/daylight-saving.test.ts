// Rules across a daylight-saving change in the base's zone (America/Denver: MST → MDT on 14 March 2027,
// MDT → MST on 7 November 2027; dates checked below through the time module, not taken on trust).
import { describe, expect, it } from "vitest";
import { localDayMinutes } from "@/lib/domain/time";
import { checkLine, type LineResult, type Violation } from "@/lib/rules";
import { ZONE, at, context, crew, items, oneDuty, only } from "@/tests/support/rule-fixtures";

const violations = (r: LineResult): Violation[] => (r.legal ? [] : r.violations);

describe("daylight-saving changes", () => {
  it("the chosen dates are change days in America/Denver (23 h and 25 h long)", () => {
    expect(localDayMinutes("2027-03-14", ZONE)).toBe(23 * 60);
    expect(localDayMinutes("2027-11-07", ZONE)).toBe(25 * 60);
  });

  describe("§117.13 Table B reads the local clock on either side of the change", () => {

    const rule = only("us-flightcrew", "fdp-limit");
    const limitAt = (date: string, time: string, minutes: number) =>
      violations(checkLine(crew(), rule, items(oneDuty("D1", at(date, time), minutes, 3)), context(date.slice(0, 8) + "01", date.slice(0, 8) + "28")));

    it("§117.13 Table B: 06:59 MST (13 Mar) and 06:59 MDT (14 Mar) both read the 0600–0659 row: 12 h with 3 segments", () => {
      for (const date of ["2027-03-13", "2027-03-14"]) {
        expect(limitAt(date, "06:59", 720), date).toEqual([]);
        expect(limitAt(date, "06:59", 721)[0], date).toMatchObject({ ruleId: "fdp-limit", limit: 720 });
      }
    });

    it("§117.13 Table B: 07:00 MDT on 14 Mar (13:00 UTC, which at the winter offset would read 06:00) reads the 0700 row: 13 h", () => {
      expect(limitAt("2027-03-14", "07:00", 780)).toEqual([]);
      expect(limitAt("2027-03-14", "07:00", 781)[0]).toMatchObject({ limit: 780 });
    });

    it("§117.13 Table B: after the fall-back (7 Nov, MST), 06:59 reads 12 h and 07:00 reads 13 h", () => {
      expect(limitAt("2027-11-07", "06:59", 721)[0]).toMatchObject({ limit: 720 });
      expect(limitAt("2027-11-07", "07:00", 780)).toEqual([]);
    });

  });

  describe("§117.25(e) rest is measured in real hours, not on the wall clock", () => {
    const rule = only("us-flightcrew", "rest-before-fdp");
    const check = (ctxDates: [string, string], ...ps: ReturnType<typeof oneDuty>[]) =>
      violations(checkLine(crew(), rule, items(...ps), context(...ctxDates)));

    it("§117.25(e) across spring-forward: release 22:00 MST 13 Mar, report 09:00 MDT 14 Mar is 10 h (the clock shows 11 h)", () => {
      const t1 = oneDuty("S1", at("2027-03-13", "12:00"), 600); // released 22:00 MST
      const march: [string, string] = ["2027-03-01", "2027-03-31"];
      expect(check(march, t1, oneDuty("S2", at("2027-03-14", "09:00"), 480))).toEqual([]);
      expect(check(march, t1, oneDuty("S2", at("2027-03-14", "08:59"), 480))[0]).toMatchObject({ ruleId: "rest-before-fdp", measured: 599, limit: 600 });
    });

    it("§117.25(e) across fall-back: release 22:00 MDT 6 Nov, report 07:00 MST 7 Nov is 10 h (the clock shows 9 h)", () => {
      const t1 = oneDuty("N1", at("2027-11-06", "12:00"), 600); // released 22:00 MDT
      const november: [string, string] = ["2027-11-01", "2027-11-30"];
      expect(check(november, t1, oneDuty("N2", at("2027-11-07", "07:00"), 480))).toEqual([]);
      expect(check(november, t1, oneDuty("N2", at("2027-11-07", "06:59"), 480))[0]).toMatchObject({ measured: 599, limit: 600 });
    });
  });
});
