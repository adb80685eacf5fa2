import { describe, expect, it } from "vitest";
import {
  creditPerDutyDay,
  hasDeadhead,
  isRedEye,
  isRedEyeDuty,
  layoverStations,
  maxLegsInADuty,
  pairingDates,
  pairingEnd,
  pairingLengthDays,
  pairingStart,
} from "../../../lib/domain/index.ts";
import { T101, T202, T303, T404, ZONE } from "./carrier.ts";

describe("pairing facts", () => {
  it("starts at the first report and ends at the last release, in UTC", () => {
    expect(pairingStart(T202)).toBe("2027-03-12T14:00:00Z"); // 07:00 MST
    expect(pairingEnd(T202)).toBe("2027-03-15T00:00:00Z"); // 18:00 MDT
    expect(T202.tafbMinutes).toBe(2 * 24 * 60 + 10 * 60); // 58 h: the spring-forward hour is not lived
  });

  it("occupies every base-local date from report to release, layover days included", () => {
    expect(pairingDates(T202, ZONE)).toEqual(["2027-03-12", "2027-03-13", "2027-03-14"]);
    expect(pairingLengthDays(T202, ZONE)).toBe(3);
    // Reports 22:30 on the 20th, first duty released 04:00 on the 21st.
    expect(pairingDates(T303, ZONE)).toEqual(["2027-03-20", "2027-03-21"]);
    expect(pairingLengthDays(T101, ZONE)).toBe(1);
  });

  it("reads days in the zone it is given", () => {
    // In New York the 18:00 MDT release on the 14th is 20:00 on the 14th; in Berlin it is 01:00 on the 15th.
    expect(pairingDates(T202, "America/New_York").at(-1)).toBe("2027-03-14");
    expect(pairingDates(T202, "Europe/Berlin").at(-1)).toBe("2027-03-15");
  });

  it("lists layover stations in order", () => {
    expect(layoverStations(T202)).toEqual(["QRL", "BXT"]);
    expect(layoverStations(T303)).toEqual(["MRW"]);
    expect(layoverStations(T101)).toEqual([]);
  });

  it("finds deadheads, legs per duty and credit per duty day", () => {
    expect(hasDeadhead(T404)).toBe(true);
    expect(hasDeadhead(T101)).toBe(false);
    expect(maxLegsInADuty(T404)).toBe(3);
    expect(maxLegsInADuty(T202)).toBe(1);
    expect(creditPerDutyDay(T202)).toBe(280);
    expect(creditPerDutyDay(T404)).toBe(360);
    // Operated block only: the deadhead's two hours are left out.
    expect(T404.blockMinutes).toBe(120 + 120 + 360);
  });
});

describe("red-eye (night window 01:00–05:00 base local, common practice)", () => {
  it("calls a flight through the night a red-eye, and day trips not", () => {
    expect(isRedEye(T303, ZONE)).toBe(true);
    expect(isRedEyeDuty(T303.dutyPeriods[1]!, ZONE)).toBe(false);
    for (const day of [T101, T202, T404]) expect(isRedEye(day, ZONE)).toBe(false);
  });

  const duty = (departure: string, arrival: string) => ({
    report: departure,
    release: arrival,
    legs: [{ flightNumber: "LK9", from: "HVN", to: "QRL", departure, arrival, deadhead: false, blockMinutes: 60 }],
  });

  it("counts a leg that only touches the window's edges correctly", () => {
    // 23:30–01:00 MST ends as the window opens; 04:59–06:00 MST starts inside it; 05:00 is after it.
    expect(isRedEyeDuty(duty("2027-03-03T06:30:00Z", "2027-03-03T08:00:00Z"), ZONE)).toBe(false);
    expect(isRedEyeDuty(duty("2027-03-03T11:59:00Z", "2027-03-03T13:00:00Z"), ZONE)).toBe(true);
    expect(isRedEyeDuty(duty("2027-03-03T12:00:00Z", "2027-03-03T13:00:00Z"), ZONE)).toBe(false);
  });

  it("shortens the window on the spring-forward night", () => {
    // 11:15Z–11:45Z is 04:15–04:45 MST on 7 March (in the window) but 05:15–05:45 MDT on 14 March (after it).
    expect(isRedEyeDuty(duty("2027-03-07T11:15:00Z", "2027-03-07T11:45:00Z"), ZONE)).toBe(true);
    expect(isRedEyeDuty(duty("2027-03-14T11:15:00Z", "2027-03-14T11:45:00Z"), ZONE)).toBe(false);
  });
});
