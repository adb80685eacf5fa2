// Regulation (EU) No 965/2012, Annex III, ORO.FTL (as inserted by Regulation (EU) No 83/2014): check values
// from ../shared/reference/duty-rest-rules.md, section named in each title. Base HLV; "reference time" is the
// local time of the theater the crew member is acclimatised to (here the base's, America/Denver).
import { describe, expect, it } from "vitest";
import { addDays, addMinutes } from "@/lib/domain/time";
import { checkLine, euTableTwoMinutes, type LineResult, type Violation } from "@/lib/rules";
import { BASE, at, context, crew, duty, hops, items, only, pairing, pastDuty } from "@/tests/support/rule-fixtures";

const violations = (r: LineResult): Violation[] => (r.legal ? [] : r.violations);
const ctx = context();
const DAY = "2027-05-12";
const minuteOf = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3));
const hm = (text: string) => minuteOf(text.padStart(5, "0"));

// ORO.FTL.205(b)(1) Table 2, transcribed from the reference file: band edges, limits for 1–2, 3, 4, … 10 sectors.
const TABLE_2: Array<[edges: string[], limits: string[]]> = [
  [["06:00", "13:29"], ["13:00", "12:30", "12:00", "11:30", "11:00", "10:30", "10:00", "9:30", "9:00"]],
  [["13:30", "13:59"], ["12:45", "12:15", "11:45", "11:15", "10:45", "10:15", "9:45", "9:15", "9:00"]],
  [["14:00", "14:29"], ["12:30", "12:00", "11:30", "11:00", "10:30", "10:00", "9:30", "9:00", "9:00"]],
  [["14:30", "14:59"], ["12:15", "11:45", "11:15", "10:45", "10:15", "9:45", "9:15", "9:00", "9:00"]],
  [["15:00", "15:29"], ["12:00", "11:30", "11:00", "10:30", "10:00", "9:30", "9:00", "9:00", "9:00"]],
  [["15:30", "15:59"], ["11:45", "11:15", "10:45", "10:15", "9:45", "9:15", "9:00", "9:00", "9:00"]],
  [["16:00", "16:29"], ["11:30", "11:00", "10:30", "10:00", "9:30", "9:00", "9:00", "9:00", "9:00"]],
  [["16:30", "16:59"], ["11:15", "10:45", "10:15", "9:45", "9:15", "9:00", "9:00", "9:00", "9:00"]],
  [["17:00", "23:59", "00:00", "04:59"], ["11:00", "10:30", "10:00", "9:30", "9:00", "9:00", "9:00", "9:00", "9:00"]],
  [["05:00", "05:14"], ["12:00", "11:30", "11:00", "10:30", "10:00", "9:30", "9:00", "9:00", "9:00"]],
  [["05:15", "05:29"], ["12:15", "11:45", "11:15", "10:45", "10:15", "9:45", "9:15", "9:00", "9:00"]],
  [["05:30", "05:44"], ["12:30", "12:00", "11:30", "11:00", "10:30", "10:00", "9:30", "9:00", "9:00"]],
  [["05:45", "05:59"], ["12:45", "12:15", "11:45", "11:15", "10:45", "10:15", "9:45", "9:15", "9:00"]],
];
const column = (sectors: number) => Math.max(sectors, 2) - 2;

const fdpOnly = only("eu-crew", "fdp-limit");
/** A one-duty trip of `sectors` short legs of 25 min. */
function fdp(time: string, minutes: number, sectors: number) {
  const h = hops(sectors);
  const p = pairing("E100", [duty(at(DAY, time), h.route, { minutes, deadheads: h.deadheads, blocks: h.route.map(() => 25), turn: 15 })]);
  return violations(checkLine(crew(), fdpOnly, items(p), ctx));
}

describe("ORO.FTL.205(b)(1) Table 2 — maximum daily FDP, acclimatised", () => {
  for (const [edges, limits] of TABLE_2) {
    it(`ORO.FTL.205(b)(1) Table 2 row ${edges[0]}–${edges.at(-1)}: ${limits[0]} … ${limits.at(-1)} for 1–2 … 10 sectors, at its edges`, () => {
      for (const edge of edges) {
        for (let sectors = 1; sectors <= 10; sectors++) {
          const limit = hm(limits[column(sectors)]!);
          expect(euTableTwoMinutes(minuteOf(edge), sectors), `${edge}, ${sectors} sectors`).toBe(limit);
          expect(fdp(edge, limit, sectors), `${edge}, ${sectors} sectors at the limit`).toEqual([]);
          const over = fdp(edge, limit + 1, sectors);
          expect(over, `${edge}, ${sectors} sectors, one minute over`).toHaveLength(1);
          expect(over[0]).toMatchObject({ ruleId: "fdp-limit", measured: limit + 1, limit });
        }
      }
    });
  }

  it("ORO.FTL.205(b)(1) Table 2: the 15-minute steps before 06:00 — 05:44 allows 12:30 with 2 sectors, 05:45 12:45, 06:00 13:00", () => {
    expect(fdp("05:44", hm("12:31"), 2)[0]).toMatchObject({ limit: hm("12:30") });
    expect(fdp("05:45", hm("12:31"), 2)).toEqual([]);
    expect(fdp("05:45", hm("12:46"), 2)[0]).toMatchObject({ limit: hm("12:45") });
    expect(fdp("06:00", hm("12:46"), 2)).toEqual([]);
  });

  it("ORO.FTL.205(b)(1): the sentence cites Table 2", () => {
    expect(fdp("13:30", hm("12:50"), 2)[0]!.text).toBe(
      "flight duty 1 of trip E100 lasts 12 h 50 min; starting at 13:30 with 2 segments at most 12 h 45 min is allowed (ORO.FTL.205(b)(1) Table 2)",
    );
  });
});

describe("ORO.FTL.210 cumulative limits", () => {
  it("ORO.FTL.210(a)(1): 60 duty hours in 7 days — ground duty (training) counts; 60 h passes, 60 h 1 min fails", () => {
    const rule = only("eu-crew", "duty-60-in-7-days");
    const trips = [10, 11, 12, 13, 14].map((d) => pairing(`E${d}`, [duty(at(`2027-05-${d}`, "07:00"), [BASE, "PLM", BASE], { minutes: 600 })]));
    const withTraining = (end: string) => crew({ fixedActivities: [{ kind: "training", start: at("2027-05-15", "07:00"), end: at("2027-05-15", end) }] });
    expect(violations(checkLine(withTraining("17:00"), rule, items(...trips), ctx))).toEqual([]);
    const v = violations(checkLine(withTraining("17:01"), rule, items(...trips), ctx));
    expect(v).toHaveLength(1);
    expect(v[0]).toMatchObject({ ruleId: "duty-60-in-7-days", measured: 3601, limit: 3600, items: ["training"] });
  });

  const lookBack = (count: number, firstDate: string, minutes: number, flight: number) =>
    Array.from({ length: count }, (_, k) => pastDuty(at(addDays(firstDate, k), "07:00"), minutes, flight));
  const may3 = (minutes: number) => pairing("E1", [duty(at("2027-05-03", "07:00"), [BASE, "PLM", BASE], { minutes })]);

  it("ORO.FTL.210(a)(2): 110 duty hours in 14 days, look-back included: 110 h passes, 110 h 1 min fails", () => {
    const member = crew({ lookBack: { duties: lookBack(10, "2027-04-20", 600, 300) } });
    const rule = only("eu-crew", "duty-110-in-14-days");
    expect(violations(checkLine(member, rule, items(may3(600)), ctx))).toEqual([]);
    expect(violations(checkLine(member, rule, items(may3(601)), ctx))[0]).toMatchObject({ ruleId: "duty-110-in-14-days", measured: 6601, limit: 6600 });
  });

  it("ORO.FTL.210(a)(3): 190 duty hours in 28 days, look-back included: 190 h passes, 190 h 1 min fails", () => {
    const member = crew({ lookBack: { duties: lookBack(18, "2027-04-12", 600, 300) } });
    const rule = only("eu-crew", "duty-190-in-28-days");
    expect(violations(checkLine(member, rule, items(may3(600)), ctx))).toEqual([]);
    expect(violations(checkLine(member, rule, items(may3(601)), ctx))[0]).toMatchObject({ ruleId: "duty-190-in-28-days", measured: 11401, limit: 11400 });
  });

  it("ORO.FTL.210(b)(1): 100 h of flight time in 28 days, look-back included: 100 h passes, 100 h 1 min fails", () => {
    const member = crew({ lookBack: { duties: lookBack(12, "2027-04-14", 600, 480) } });
    const rule = only("eu-crew", "flight-100-in-28-days");
    const trip = (b: number) => pairing("E2", [duty(at("2027-05-03", "07:00"), [BASE, "EMR", BASE], { blocks: [120, b] })]);
    expect(violations(checkLine(member, rule, items(trip(120)), ctx))).toEqual([]);
    expect(violations(checkLine(member, rule, items(trip(121)), ctx))[0]).toMatchObject({ ruleId: "flight-100-in-28-days", measured: 6001, limit: 6000 });
  });
});

describe("ORO.FTL.235 rest", () => {
  const rule = only("eu-crew", "rest-at-and-away");
  const check = (...ps: ReturnType<typeof pairing>[]) => violations(checkLine(crew(), rule, items(...ps), ctx));
  const oneAt = (id: string, report: string, minutes: number) => pairing(id, [duty(report, [BASE, "PLM", BASE], { minutes })]);
  /** A two-day trip laying over at PLM (away from base): first duty `first` min, then `rest` min of rest. */
  const layover = (first: number, rest: number) => {
    const d1 = duty(at(DAY, "07:00"), [BASE, "PLM"], { minutes: first });
    return pairing("E300", [d1, duty(addMinutes(d1.release, rest), ["PLM", BASE], { minutes: 300 })]);
  };

  it("ORO.FTL.235(a): at home base 12 h passes, 11 h 59 min fails", () => {
    const t1 = oneAt("E1", at(DAY, "07:00"), 600); // released 17:00 at HLV
    expect(check(t1, oneAt("E2", at(addDays(DAY, 1), "05:00"), 480))).toEqual([]);
    expect(check(t1, oneAt("E2", at(addDays(DAY, 1), "04:59"), 480))).toEqual([
      {
        ruleId: "rest-at-and-away",
        measured: 719,
        limit: 720,
        unit: "minutes",
        items: ["E1", "E2"],
        text: "rest before trip E2 is 11 h 59 min; at least 12 h is required (ORO.FTL.235(a)/(b))",
      },
    ]);
  });

  it("ORO.FTL.235(a): at home base at least as long as the preceding duty — after 13 h of duty, 12 h 59 min fails", () => {
    const t1 = oneAt("E1", at(DAY, "06:00"), 780); // released 19:00
    expect(check(t1, oneAt("E2", at(addDays(DAY, 1), "08:00"), 480))).toEqual([]);
    expect(check(t1, oneAt("E2", at(addDays(DAY, 1), "07:59"), 480))[0]).toMatchObject({ measured: 779, limit: 780 });
  });

  it("ORO.FTL.235(b): away from home base 10 h passes, 9 h 59 min fails", () => {
    expect(check(layover(480, 600))).toEqual([]);
    expect(check(layover(480, 599))[0]).toMatchObject({ ruleId: "rest-at-and-away", measured: 599, limit: 600, items: ["E300"] });
  });

  it("ORO.FTL.235(b): away, at least as long as the preceding duty — after 11 h of duty, 10 h 59 min fails", () => {
    expect(check(layover(660, 660))).toEqual([]);
    expect(check(layover(660, 659))[0]).toMatchObject({ measured: 659, limit: 660 });
  });
});

describe("ORO.FTL.210(b)(2)/(3) yearly flight time and ORO.FTL.235(d) recovery rest", () => {
  const daily = (from: string, days: number, minutes: number) => Array.from({ length: days }, (_, k) => ({ date: addDays(from, k), minutes }));
  const trip = (b: number) => pairing("E3", [duty(at("2027-05-03", "07:00"), [BASE, "EMR", BASE], { blocks: [120, b] })]);

  it("ORO.FTL.210(b)(2): 900 h in the calendar year — flying before 1 January does not count", () => {
    // 120 days × 445 min from 1 January = 890 h; the trip adds 10 h (exactly 900 h) or 10 h 1 min. December's flying is last year's.
    const member = crew({ lookBack: { dailyFlightMinutes: [...daily("2026-12-01", 31, 480), ...daily("2027-01-01", 120, 445)] } });
    const rule = only("eu-crew", "flight-900-in-calendar-year");
    expect(violations(checkLine(member, rule, items(trip(480)), ctx))).toEqual([]); // 890 h + 10 h = 900 h
    expect(violations(checkLine(member, rule, items(trip(481)), ctx))[0]).toMatchObject({ ruleId: "flight-900-in-calendar-year", measured: 54001, limit: 54000 });
  });

  it("ORO.FTL.210(b)(3): 1,000 h in 12 consecutive months (read as 365 days), look-back daily totals included", () => {
    // 364 days before 3 May 2027 at 160 min = 970 h 40 min; the trip brings 29 h 20 min more at most.
    const member = crew({ lookBack: { dailyFlightMinutes: daily("2026-05-04", 364, 160) } });
    const rule = only("eu-crew", "flight-1000-in-12-months");
    const big = (b: number) => pairing("E4", [duty(at("2027-05-03", "07:00"), [BASE, "EMR", BASE], { blocks: [1000, b] })]);
    expect(violations(checkLine(member, rule, items(big(760)), ctx))).toEqual([]); // 58,240 + 1,760 = 60,000
    expect(violations(checkLine(member, rule, items(big(761)), ctx))[0]).toMatchObject({ ruleId: "flight-1000-in-12-months", measured: 60001, limit: 60000 });
  });

  it("ORO.FTL.235(d): at most 168 h from the end of a 36 h rest with 2 local nights to the start of the next", () => {
    const rule = only("eu-crew", "recovery-rest");
    // Rest from 2 May 18:00 to 4 May 07:00 local (37 h, nights of 2–3 and 3–4 May); then a duty each day.
    const first = pairing("R1", [duty(at("2027-05-02", "08:00"), [BASE, "PLM", BASE], { minutes: 600 })]);
    const daily = (days: number[]) => days.map((d) => pairing(`R${d}`, [duty(at(`2027-05-${String(d).padStart(2, "0")}`, "07:00"), [BASE, "PLM", BASE], { minutes: 600 })]));
    // The 10 May duty is released at 17:00, 154 h after the rest: the next rest can still start in time.
    expect(violations(checkLine(crew(), rule, items(first, ...daily([4, 5, 6, 7, 8, 9, 10])), ctx))).toEqual([]);
    // The 11 May duty reports at 168 h but is released at 178 h: no rest can start within 168 h.
    const v = violations(checkLine(crew(), rule, items(first, ...daily([4, 5, 6, 7, 8, 9, 10, 11])), ctx));
    expect(v[0]).toMatchObject({ ruleId: "recovery-rest", items: ["R11"], measured: 178 * 60, limit: 168 * 60 });
  });
});
