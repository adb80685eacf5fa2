// 14 CFR Part 117 (flightcrew) check values, from ../shared/reference/duty-rest-rules.md
// ("US 14 CFR Part 117", text unchanged since 78 FR 69288, 2013); the section is named in each title.
import { describe, expect, it } from "vitest";
import { addDays, addMinutes } from "@/lib/domain/time";
import { checkLine, usTableAMinutes, usTableBMinutes, type LineResult, type Violation } from "@/lib/rules";
import { BASE, BERLIN, at, context, crew, duty, hops, items, oneDuty, only, pairing, pastDuty } from "@/tests/support/rule-fixtures";

const violations = (r: LineResult): Violation[] => (r.legal ? [] : r.violations);
const DAY = "2027-05-12"; // no daylight-saving change near
const ctx = context();

// §117.13 Table B, transcribed from the reference file (not from lib/rules): start band, hours for 1 … 7+ segments.
const TABLE_B: Array<[from: string, to: string, hours: number[]]> = [
  ["00:00", "03:59", [9, 9, 9, 9, 9, 9, 9]],
  ["04:00", "04:59", [10, 10, 10, 10, 9, 9, 9]],
  ["05:00", "05:59", [12, 12, 12, 12, 11.5, 11, 10.5]],
  ["06:00", "06:59", [13, 13, 12, 12, 11.5, 11, 10.5]],
  ["07:00", "11:59", [14, 14, 13, 13, 12.5, 12, 11.5]],
  ["12:00", "12:59", [13, 13, 13, 13, 12.5, 12, 11.5]],
  ["13:00", "16:59", [12, 12, 12, 12, 11.5, 11, 10.5]],
  ["17:00", "21:59", [12, 12, 11, 11, 10, 9, 9]],
  ["22:00", "22:59", [11, 11, 10, 10, 9, 9, 9]],
  ["23:00", "23:59", [10, 10, 10, 9, 9, 9, 9]],
];
const minuteOf = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3));

const fdpOnly = only("us-flightcrew", "fdp-limit");

/** A one-duty trip reporting at `time` on DAY, lasting `minutes`, and what checkLine says of it. */
function fdp(time: string, minutes: number, segments: number, date = DAY) {
  return violations(checkLine(crew(), fdpOnly, items(oneDuty("T100", at(date, time), minutes, segments)), ctx));
}

/** A duty exactly at the limit is legal; one minute over is an fdp-limit violation naming the limit. */
function expectLimit(time: string, segments: number, limitMinutes: number, date = DAY) {
  expect(fdp(time, limitMinutes, segments, date), `${time}, ${segments} segments, ${limitMinutes} min`).toEqual([]);
  const over = fdp(time, limitMinutes + 1, segments, date);
  expect(over, `${time}, ${segments} segments, ${limitMinutes + 1} min`).toHaveLength(1);
  expect(over[0]).toMatchObject({ ruleId: "fdp-limit", measured: limitMinutes + 1, limit: limitMinutes, unit: "minutes", items: ["T100"] });
}

describe("14 CFR 117.13 Table B — maximum FDP, unaugmented, acclimated", () => {
  for (const [from, to, hours] of TABLE_B) {
    it(`§117.13 Table B row ${from}–${to}: ${hours.join(" / ")} h for 1 … 7+ segments, at both band edges`, () => {
      for (const edge of [from, to]) {
        for (let s = 1; s <= 8; s++) {
          const expected = hours[Math.min(s, 7) - 1]! * 60;
          expect(usTableBMinutes(minuteOf(edge), s), `${edge}, ${s} segments`).toBe(expected);
          if (s <= 7) expectLimit(edge, s, expected);
        }
      }
    });
  }

  it("§117.13 Table B: 8 segments read the 7+ column end to end (22:00 → 9 h)", () => {
    expectLimit("22:00", 8, 9 * 60);
  });

  it("§117.13 Table B band edge: a 06:59 start with 3 segments allows 12 h, a 07:00 start 13 h", () => {
    expect(usTableBMinutes(minuteOf("06:59"), 3)).toBe(12 * 60);
    expect(usTableBMinutes(minuteOf("07:00"), 3)).toBe(13 * 60);
    expect(fdp("06:59", 12 * 60 + 30, 3)[0]).toMatchObject({ ruleId: "fdp-limit", limit: 720 });
    expect(fdp("07:00", 12 * 60 + 30, 3)).toEqual([]);
  });

  it("§117.13 worked checks: report 07:00 with 3 segments → 13 h; report 04:30 with 5 segments → 9 h", () => {
    expectLimit("07:00", 3, 13 * 60);
    expectLimit("04:30", 5, 9 * 60);
  });

  it("§117.13: the violation's sentence names the trip, the start, the segments, the limit and the section", () => {
    expect(fdp("07:00", 13 * 60 + 10, 3)[0]!.text).toBe(
      "flight duty 1 of trip T100 lasts 13 h 10 min; starting at 07:00 with 3 segments at most 13 h is allowed (14 CFR 117.13)",
    );
  });
});

describe("14 CFR 117.3: a deadhead is not a segment", () => {
  it("§117.3 / §117.13: 05:00 start, 4 operated legs and 1 deadhead reads the 4-segment column (12 h), not the 5-segment one (11.5 h)", () => {
    const route = hops(5).route; // HLV PLM CBS HLV PLM HLV
    const withDeadhead = (minutes: number) => pairing("T200", [duty(at(DAY, "05:00"), route, { minutes, deadheads: [4] })]);
    const allOperated = (minutes: number) => pairing("T200", [duty(at(DAY, "05:00"), route, { minutes })]);
    expect(violations(checkLine(crew(), fdpOnly, items(withDeadhead(720)), ctx))).toEqual([]);
    expect(violations(checkLine(crew(), fdpOnly, items(withDeadhead(721)), ctx))[0]).toMatchObject({ ruleId: "fdp-limit", limit: 720 });
    expect(violations(checkLine(crew(), fdpOnly, items(allOperated(720)), ctx))[0]).toMatchObject({ ruleId: "fdp-limit", measured: 720, limit: 690 });
  });

  it("§117.3 / §117.13: 07:00 start, 2 operated legs and a deadhead home reads the 2-segment column (14 h)", () => {
    const route = hops(3).route; // HLV PLM CBS HLV
    const trip = (minutes: number, deadheads: number[]) => pairing("T201", [duty(at(DAY, "07:00"), route, { minutes, deadheads })]);
    expect(violations(checkLine(crew(), fdpOnly, items(trip(14 * 60, [2])), ctx))).toEqual([]);
    expect(violations(checkLine(crew(), fdpOnly, items(trip(14 * 60, [])), ctx))[0]).toMatchObject({ ruleId: "fdp-limit", limit: 13 * 60 });
  });
});

describe("14 CFR 117.13(b) and 117.3: not acclimated", () => {
  // HLV (-104.9°) to OSY (13.4°) is more than 60° of longitude: another theater (§117.3).
  // Day 1: HLV 07:00 MDT → EMR → OSY, 13 h, released 04:00 Berlin time on day 2.
  const outbound = (date: string) => duty(at(date, "07:00"), [BASE, "EMR", "OSY"], { minutes: 13 * 60, blocks: [210, 480] });
  /** The FDP out of OSY, reporting at `berlinTime` on `date`, 3 segments, home to HLV. */
  const back = (date: string, berlinTime: string, minutes: number) =>
    duty(at(date, berlinTime, BERLIN), ["OSY", "EMR", "CRB", BASE], { minutes, blocks: [400, 80, 80] });
  const check = (p: ReturnType<typeof pairing>) => violations(checkLine(crew(), fdpOnly, items(p), ctx));

  it("§117.13(b) worked check: 07:00 at the home theater's clock with 3 segments, not acclimated → 12.5 h (13 h less 30 min)", () => {
    // Reports at OSY 15:00 CEST = 07:00 MDT, 35 h after arriving: within 72 h and no 36 h free, so not acclimated.
    const trip = (minutes: number) => pairing("T300", [outbound("2027-05-10"), back("2027-05-11", "15:00", minutes)]);
    expect(check(trip(12 * 60 + 30))).toEqual([]);
    const over = check(trip(12 * 60 + 31));
    expect(over).toHaveLength(1);
    expect(over[0]).toMatchObject({ ruleId: "fdp-limit", measured: 751, limit: 750, items: ["T300"] });
    // read at the home theater's clock (07:00 Denver), not Berlin's 15:00 (which would give 12 h)
    expect(over[0]!.text).toContain("starting at 07:00 with 3 segments (not acclimated) at most 12 h 30 min is allowed (14 CFR 117.13)");
  });

  it("§117.3: after 36 consecutive hours free at OSY the crew member is acclimated there; Table B reads Berlin's clock, no reduction", () => {
    // Arrives 04:00 CEST on 11 May; reports 17:00 CEST on 12 May = 37 h free. 17:00 with 3 segments → 11 h.
    const trip = (minutes: number) => pairing("T301", [outbound("2027-05-10"), back("2027-05-12", "17:00", minutes)]);
    expect(check(trip(11 * 60))).toEqual([]);
    expect(check(trip(11 * 60 + 1))[0]).toMatchObject({ ruleId: "fdp-limit", limit: 11 * 60 });
    expect(check(trip(11 * 60 + 1))[0]!.text).toContain("starting at 17:00 with 3 segments at most 11 h is allowed");
  });

  it("§117.3: 35 h 59 min free at OSY is not yet 36 h: still not acclimated (home clock 08:59 → 13 h − 30 min)", () => {
    // Released 04:00 CEST 11 May; report 15:59 CEST 12 May = 35 h 59 min later = 07:59 MDT.
    const trip = pairing("T302", [outbound("2027-05-10"), back("2027-05-12", "15:59", 12 * 60 + 31)]);
    expect(check(trip)[0]).toMatchObject({ ruleId: "fdp-limit", limit: 750 });
  });
});

describe("14 CFR 117.11 Table A — maximum flight time, unaugmented", () => {
  const TABLE_A: Array<[from: string, to: string, hours: number]> = [
    ["00:00", "04:59", 8],
    ["05:00", "19:59", 9],
    ["20:00", "23:59", 8],
  ];
  const rs = only("us-flightcrew", "flight-time-limit");
  const flying = (time: string, blocks: [number, number]) =>
    violations(checkLine(crew(), rs, items(pairing("T400", [duty(at(DAY, time), [BASE, "EMR", BASE], { blocks })])), ctx));

  for (const [from, to, hours] of TABLE_A) {
    it(`§117.11 Table A row ${from}–${to}: ${hours} h of flight time, at both band edges`, () => {
      for (const edge of [from, to]) {
        const limit = hours * 60;
        expect(usTableAMinutes(minuteOf(edge))).toBe(limit);
        expect(flying(edge, [limit / 2, limit / 2]), `${edge} at the limit`).toEqual([]);
        const over = flying(edge, [limit / 2, limit / 2 + 1]);
        expect(over, `${edge} one minute over`).toHaveLength(1);
        expect(over[0]).toMatchObject({ ruleId: "flight-time-limit", measured: limit + 1, limit });
      }
    });
  }

  it("§117.11 / §117.3: deadhead block is not flight time", () => {
    const p = pairing("T401", [duty(at(DAY, "08:00"), [BASE, "EMR", BASE], { blocks: [540, 300], deadheads: [1] })]);
    expect(violations(checkLine(crew(), rs, items(p), ctx))).toEqual([]);
  });
});

describe("14 CFR 117.25 rest", () => {
  const restRule = only("us-flightcrew", "rest-before-fdp");
  const first = oneDuty("T1", at(DAY, "07:00"), 10 * 60); // released 17:00
  const nextDay = addDays(DAY, 1);

  it("§117.25(e): 10 h from release to the next report passes; 9 h 59 min fails with the crew member's sentence", () => {
    expect(violations(checkLine(crew(), restRule, items(first, oneDuty("T2", at(nextDay, "03:00"), 8 * 60)), ctx))).toEqual([]);
    const short = violations(checkLine(crew(), restRule, items(first, oneDuty("T2", at(nextDay, "02:59"), 8 * 60)), ctx));
    expect(short).toEqual([
      {
        ruleId: "rest-before-fdp",
        measured: 599,
        limit: 600,
        unit: "minutes",
        items: ["T1", "T2"],
        text: "rest before trip T2 is 9 h 59 min; at least 10 h is required (14 CFR 117.25(e))",
      },
    ]);
  });

  it("§117.25(e) applies before a flight duty period: rest before ground training is not checked, rest after it is", () => {
    const training = { kind: "training" as const, start: at(nextDay, "02:00"), end: at(nextDay, "10:00") }; // 9 h after T1
    const member = crew({ fixedActivities: [training] });
    expect(violations(checkLine(member, restRule, items(first), ctx))).toEqual([]);
    // an FDP 9 h 59 min after the training's end breaks it
    const after = violations(checkLine(member, restRule, items(first, oneDuty("T3", at(nextDay, "19:59"), 6 * 60)), ctx));
    expect(after).toHaveLength(1);
    expect(after[0]).toMatchObject({ ruleId: "rest-before-fdp", measured: 599, limit: 600, items: ["training", "T3"] });
  });

  it("§117.25(e): rest after a look-back duty (before the period) counts too", () => {
    const member = crew({ lookBack: { duties: [pastDuty(at("2027-04-30", "14:00"), 600, 300)] } }); // released 30 Apr 24:00
    const early = oneDuty("T4", at("2027-05-01", "09:59"), 8 * 60);
    expect(violations(checkLine(member, restRule, items(early), ctx))[0]).toMatchObject({ ruleId: "rest-before-fdp", measured: 599 });
    expect(violations(checkLine(member, restRule, items(oneDuty("T4", at("2027-05-01", "10:00"), 480)), ctx))).toEqual([]);
  });

  describe("§117.25(b): 30 consecutive hours free in the 168 hours before an FDP", () => {
    const rule = only("us-flightcrew", "free-30-in-168");
    // D0 released at R0; then 30 h free; then duties with shorter breaks; the last reports 168 h after R0.
    const d0 = oneDuty("D0", at("2027-05-03", "08:00"), 8 * 60);
    const r0 = d0.dutyPeriods[0]!.release;
    const later = (id: string, hoursAfterR0: number, minutes = 8 * 60) => oneDuty(id, addMinutes(r0, hoursAfterR0 * 60), minutes);
    const week = [d0, later("D1", 30), later("D2", 54), later("D3", 78), later("D4", 102), later("D5", 126), later("D6", 144)];

    it("§117.25(b): exactly 30 h free inside the window before the FDP passes", () => {
      expect(violations(checkLine(crew(), rule, items(...week, later("D7", 168)), ctx))).toEqual([]);
    });

    it("§117.25(b): a report one minute later leaves 29 h 59 min of it inside the window and fails", () => {
      const late = oneDuty("D7", addMinutes(r0, 168 * 60 + 1), 8 * 60);
      const v = violations(checkLine(crew(), rule, items(...week, late), ctx));
      expect(v).toHaveLength(1);
      expect(v[0]).toMatchObject({ ruleId: "free-30-in-168", measured: 1799, limit: 1800, items: ["D7"] });
      expect(v[0]!.text).toBe(
        "the longest time free from duty in the 168 hours before trip D7 is 29 h 59 min; at least 30 h in a row is required (14 CFR 117.25(b))",
      );
    });
  });
});

describe("14 CFR 117.23 cumulative limits", () => {
  it("§117.23(c)(1): 60 h of FDP in 168 h passes, 60 h 1 min fails", () => {
    const rule = only("us-flightcrew", "fdp-60-in-168");
    const six = (lastMinutes: number) =>
      [10, 11, 12, 13, 14, 15].map((d, k) => oneDuty(`W${d}`, at(`2027-05-${d}`, "07:00"), k === 5 ? lastMinutes : 600));
    expect(violations(checkLine(crew(), rule, items(...six(600)), ctx))).toEqual([]);
    const v = violations(checkLine(crew(), rule, items(...six(601)), ctx));
    expect(v).toHaveLength(1);
    expect(v[0]).toMatchObject({ ruleId: "fdp-60-in-168", measured: 3601, limit: 3600, items: ["W15"] });
    expect(v[0]!.text).toBe("with trip W15, flight duty in 168 consecutive hours reaches 60 h 1 min; at most 60 h is allowed (14 CFR 117.23(c)(1))");
  });

  it("§117.23(c)(1): the window is 168 consecutive hours — a duty released exactly 168 h earlier is out, one minute later counts its minute", () => {
    const rule = only("us-flightcrew", "fdp-60-in-168");
    // W10: 14:00–17:00 (or 17:01) on 10 May; W11–W15 and W17: 10 h each from 07:00. W17 is released 17 May 17:00,
    // exactly 168 h after W10's release: its window holds 6 × 10 h = 60 h, plus W10's last minute when W10 ends at 17:01.
    const line = (firstMinutes: number) => [
      oneDuty("W10", at("2027-05-10", "14:00"), firstMinutes),
      ...[11, 12, 13, 14, 15, 17].map((d) => oneDuty(`W${d}`, at(`2027-05-${d}`, "07:00"), 600)),
    ];
    expect(violations(checkLine(crew(), rule, items(...line(180)), ctx))).toEqual([]);
    const v = violations(checkLine(crew(), rule, items(...line(181)), ctx));
    expect(v).toHaveLength(1);
    expect(v[0]).toMatchObject({ ruleId: "fdp-60-in-168", measured: 3601, items: ["W17"] });
  });

  it("§117.23(c)(2): 190 h of FDP in 672 h, look-back duties included: 190 h passes, 190 h 1 min fails", () => {
    const rule = only("us-flightcrew", "fdp-190-in-672");
    const past = Array.from({ length: 18 }, (_, k) => pastDuty(at(addDays("2027-04-12", k), "07:00"), 600, 300));
    const member = crew({ lookBack: { duties: past } });
    expect(violations(checkLine(member, rule, items(oneDuty("M1", at("2027-05-03", "07:00"), 600)), ctx))).toEqual([]);
    expect(violations(checkLine(member, rule, items(oneDuty("M1", at("2027-05-03", "07:00"), 601)), ctx))[0]).toMatchObject({
      ruleId: "fdp-190-in-672",
      measured: 11401,
      limit: 11400,
    });
  });

  it("§117.23(b)(1): 100 h of flight time in 672 h, look-back included: 100 h passes, 100 h 1 min fails", () => {
    const rule = only("us-flightcrew", "flight-100-in-672");
    const past = Array.from({ length: 12 }, (_, k) => pastDuty(at(addDays("2027-04-14", k), "07:00"), 600, 480));
    const member = crew({ lookBack: { duties: past } });
    const trip = (b: number) => pairing("F1", [duty(at("2027-05-03", "07:00"), [BASE, "EMR", BASE], { blocks: [120, b] })]);
    expect(violations(checkLine(member, rule, items(trip(120)), ctx))).toEqual([]);
    expect(violations(checkLine(member, rule, items(trip(121)), ctx))[0]).toMatchObject({ ruleId: "flight-100-in-672", measured: 6001, limit: 6000 });
  });

  it("§117.23(b)(2): 1,000 h in 365 consecutive calendar days from the look-back daily totals; the 366th day back is out", () => {
    const rule = only("us-flightcrew", "flight-1000-in-365-days");
    // The duty reports on 3 May 2027 (base local): the window is 4 May 2026 … 3 May 2027.
    const daily = [
      { date: "2026-05-03", minutes: 600 }, // outside
      ...Array.from({ length: 249 }, (_, k) => ({ date: addDays("2026-05-04", k), minutes: 240 })), // 59,760 min
    ];
    const member = crew({ lookBack: { dailyFlightMinutes: daily } });
    const trip = (b: number) => pairing("Y1", [duty(at("2027-05-03", "07:00"), [BASE, "EMR", BASE], { blocks: [120, b] })]);
    expect(violations(checkLine(member, rule, items(trip(120)), ctx))).toEqual([]);
    const v = violations(checkLine(member, rule, items(trip(121)), ctx));
    expect(v).toHaveLength(1);
    expect(v[0]).toMatchObject({ ruleId: "flight-1000-in-365-days", measured: 60001, limit: 60000 });
  });
});

describe("us-flightcrew preset", () => {
  it("§117.13/§117.11/§117.23/§117.25: the preset holds the reference file's figures", () => {
    const rs = only("us-flightcrew", "rest-before-fdp", "free-30-in-168", "fdp-60-in-168", "fdp-190-in-672", "flight-100-in-672", "flight-1000-in-365-days", "fdp-limit");
    const p = Object.fromEntries(rs.rules.map((r) => [r.id, r.params]));
    expect(p["rest-before-fdp"]).toMatchObject({ minMinutes: 600, before: "fdp" });
    expect(p["free-30-in-168"]).toMatchObject({ freeHours: 30, windowHours: 168 });
    expect(p["fdp-60-in-168"]).toMatchObject({ measure: "fdp", windowHours: 168, maxMinutes: 60 * 60 });
    expect(p["fdp-190-in-672"]).toMatchObject({ measure: "fdp", windowHours: 672, maxMinutes: 190 * 60 });
    expect(p["flight-100-in-672"]).toMatchObject({ measure: "flight", windowHours: 672, maxMinutes: 100 * 60 });
    expect(p["flight-1000-in-365-days"]).toMatchObject({ measure: "flight", windowDays: 365, maxMinutes: 1000 * 60 });
    expect(p["fdp-limit"]).toMatchObject({ notAcclimatedReductionMinutes: 30 });
  });
});

