// 14 CFR 121.467 (flight attendants) check values from ../shared/reference/duty-rest-rules.md
// (rest as amended by Amendment 121-386, 87 FR 61452, 2022: 10 h, not 9 h); section named in each title.
import { describe, expect, it } from "vitest";
import { addDays } from "@/lib/domain/time";
import { checkLine, type LineResult, type Violation } from "@/lib/rules";
import { at, context, crew, items, oneDuty, only } from "@/tests/support/rule-fixtures";

const violations = (r: LineResult): Violation[] => (r.legal ? [] : r.violations);
const ctx = context();
const DAY = "2027-05-12";

describe("14 CFR 121.467 — us-cabin preset", () => {
  it("§121.467(b): a scheduled duty period of 14 h passes, 14 h 1 min fails", () => {
    const rule = only("us-cabin", "max-scheduled-duty");
    expect(violations(checkLine(crew(), rule, items(oneDuty("C1", at(DAY, "06:00"), 840)), ctx))).toEqual([]);
    const v = violations(checkLine(crew(), rule, items(oneDuty("C1", at(DAY, "06:00"), 841)), ctx));
    expect(v).toHaveLength(1);
    expect(v[0]).toMatchObject({ ruleId: "max-scheduled-duty", measured: 841, limit: 840, items: ["C1"] });
    expect(v[0]!.text).toBe("duty 1 of trip C1 lasts 14 h 1 min; at most 14 h is allowed (14 CFR 121.467(b))");
  });

  it("§121.467(b) as amended in 2022: 10 h rest passes, 9 h 59 min fails (the older 9 h no longer suffices)", () => {
    const rule = only("us-cabin", "rest-after-duty");
    const t1 = oneDuty("C1", at(DAY, "07:00"), 600); // released 17:00
    const next = (time: string) => oneDuty("C2", at(addDays(DAY, 1), time), 480);
    expect(violations(checkLine(crew(), rule, items(t1, next("03:00")), ctx))).toEqual([]);
    expect(violations(checkLine(crew(), rule, items(t1, next("02:59")), ctx))[0]).toMatchObject({ ruleId: "rest-after-duty", measured: 599, limit: 600 });
    expect(violations(checkLine(crew(), rule, items(t1, next("02:00")), ctx))[0]).toMatchObject({ measured: 540, limit: 600 });
  });

  it("§121.467(b): the rest is required before any duty, ground training too", () => {
    const rule = only("us-cabin", "rest-after-duty");
    const t1 = oneDuty("C1", at(DAY, "07:00"), 600);
    const training = (time: string) => crew({ fixedActivities: [{ kind: "training", start: at(addDays(DAY, 1), time), end: at(addDays(DAY, 1), "12:00") }] });
    expect(violations(checkLine(training("03:00"), rule, items(t1), ctx))).toEqual([]);
    expect(violations(checkLine(training("02:59"), rule, items(t1), ctx))).toEqual([
      {
        ruleId: "rest-after-duty",
        measured: 599,
        limit: 600,
        unit: "minutes",
        items: ["C1", "training"],
        text: "rest before training is 9 h 59 min; at least 10 h is required (14 CFR 121.467(b) (10 h since the 2022 amendment))",
      },
    ]);
  });

  describe("§121.467(b)(13): 24 consecutive hours free in any 7 consecutive calendar days", () => {
    const rule = only("us-cabin", "free-24-in-7-days");
    // 10–16 May: duties 08:00–18:00 every day, except 13 May's, which reports at `day4` for 4 h.
    const week = (day4: string) => [
      ...[10, 11, 12].map((d) => oneDuty(`C${d}`, at(`2027-05-${d}`, "08:00"), 600)),
      oneDuty("C13", at("2027-05-13", day4), 240),
      ...[14, 15, 16].map((d) => oneDuty(`C${d}`, at(`2027-05-${d}`, "08:00"), 600)),
    ];

    it("§121.467(b)(13): exactly 24 h free (12 May 18:00 → 13 May 18:00) in 10–16 May passes", () => {
      expect(violations(checkLine(crew(), rule, items(...week("18:00")), ctx))).toEqual([]);
    });

    it("§121.467(b)(13): 23 h 59 min free fails on the seventh day", () => {
      const v = violations(checkLine(crew(), rule, items(...week("17:59")), ctx));
      expect(v).toHaveLength(1);
      expect(v[0]).toMatchObject({ ruleId: "free-24-in-7-days", measured: 1439, limit: 1440, items: ["C10", "C11", "C12", "C13", "C14", "C15", "C16"] });
      expect(v[0]!.text).toBe(
        "the longest time free from duty in the 7 days ending 2027-05-16 is 23 h 59 min; at least 24 h in a row is required (14 CFR 121.467(b)(13))",
      );
    });

    it("§121.467(b)(13): a late duty that fills the rest of its day is not free time (14 days of 14:00–24:00)", () => {
      // Rests of 14 h every night: no 24 h free in any 7 days, though each day ends with a duty at 24:00.
      const late = Array.from({ length: 14 }, (_, k) => oneDuty(`N${k}`, at(addDays("2027-05-10", k), "14:00"), 600));
      const v = violations(checkLine(crew(), rule, items(...late), ctx));
      expect(v.length).toBeGreaterThan(0);
      expect(Math.max(...v.map((x) => x.measured))).toBe(14 * 60);
    });
  });
});
