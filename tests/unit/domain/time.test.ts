import { describe, expect, it } from "vitest";
import {
  addDays,
  addMinutes,
  atLocalTime,
  dayOfWeek,
  instantSchema,
  localDate,
  localDateTimeLabel,
  localDatesTouched,
  localDayMinutes,
  localTime,
  minutesBetween,
  periodDates,
  startOfLocalDay,
  toInstant,
  zoneSchema,
} from "../../../lib/domain/index.ts";

// Daylight-saving dates below follow the rules as remembered (from memory, not
// read from a source): the US changes on the second Sunday of March and the
// first Sunday of November at 02:00 local (Energy Policy Act of 2005); the EU on
// the last Sundays of March and October at 01:00 UTC (Directive 2000/84/EC).
// America/Denver is UTC-7 in winter and UTC-6 in summer; Europe/Berlin UTC+1 / UTC+2.
const DENVER = "America/Denver";
const BERLIN = "Europe/Berlin";

describe("local days across daylight-saving changes", () => {
  it("America/Denver 2027-03-14 lasts 23 hours and 2027-11-07 lasts 25", () => {
    expect(startOfLocalDay("2027-03-14", DENVER)).toBe("2027-03-14T07:00:00Z");
    expect(startOfLocalDay("2027-03-15", DENVER)).toBe("2027-03-15T06:00:00Z");
    expect(localDayMinutes("2027-03-14", DENVER)).toBe(23 * 60);
    expect(startOfLocalDay("2027-11-07", DENVER)).toBe("2027-11-07T06:00:00Z");
    expect(startOfLocalDay("2027-11-08", DENVER)).toBe("2027-11-08T07:00:00Z");
    expect(localDayMinutes("2027-11-07", DENVER)).toBe(25 * 60);
    expect(localDayMinutes("2027-11-08", DENVER)).toBe(24 * 60);
  });

  it("Europe/Berlin 2027-03-28 lasts 23 hours and 2027-10-31 lasts 25", () => {
    expect(startOfLocalDay("2027-03-28", BERLIN)).toBe("2027-03-27T23:00:00Z");
    expect(localDayMinutes("2027-03-28", BERLIN)).toBe(23 * 60);
    expect(startOfLocalDay("2027-10-31", BERLIN)).toBe("2027-10-30T22:00:00Z");
    expect(localDayMinutes("2027-10-31", BERLIN)).toBe(25 * 60);
  });

  it("maps both instants of 01:30 after the fall-back to 01:30 on the same local date", () => {
    // 07:30Z is 01:30 MDT (first pass); 08:30Z is 01:30 MST (second pass).
    for (const instant of ["2027-11-07T07:30:00Z", "2027-11-07T08:30:00Z"]) {
      expect(localDate(instant, DENVER)).toBe("2027-11-07");
      expect(localTime(instant, DENVER)).toBe("01:30");
    }
    expect(localTime("2027-11-07T09:30:00Z", DENVER)).toBe("02:30");
  });

  it("reads a repeated clock time as its first occurrence (RFC 5545 §3.3.5's rule, from memory)", () => {
    expect(atLocalTime("2027-11-07", "01:30", DENVER)).toBe("2027-11-07T07:30:00Z");
    expect(atLocalTime("2027-10-31", "02:30", BERLIN)).toBe("2027-10-31T00:30:00Z");
    expect(atLocalTime("2027-11-07", "02:30", DENVER)).toBe("2027-11-07T09:30:00Z");
  });

  it("moves a clock time the spring-forward gap skips to after the gap", () => {
    expect(atLocalTime("2027-03-14", "02:30", DENVER)).toBe("2027-03-14T09:30:00Z");
    expect(localTime("2027-03-14T09:30:00Z", DENVER)).toBe("03:30");
    expect(atLocalTime("2027-03-14", "01:59", DENVER)).toBe("2027-03-14T08:59:00Z");
    expect(atLocalTime("2027-03-28", "02:30", BERLIN)).toBe("2027-03-28T01:30:00Z");
    expect(localTime("2027-03-28T01:30:00Z", BERLIN)).toBe("03:30");
  });

  it("reads the local date, not the UTC date, near midnight", () => {
    // 18:00 MDT on the 14th is already the 15th in UTC.
    expect(localDate("2027-03-15T00:00:00Z", DENVER)).toBe("2027-03-14");
    expect(localDate("2027-03-15T00:00:00Z", BERLIN)).toBe("2027-03-15");
    expect(localTime("2027-03-15T00:00:00Z", DENVER)).toBe("18:00");
  });
});

describe("localDatesTouched", () => {
  it("counts every local date of the interval, with the end exclusive", () => {
    expect(localDatesTouched("2027-03-12T14:00:00Z", "2027-03-15T00:00:00Z", DENVER)).toEqual([
      "2027-03-12",
      "2027-03-13",
      "2027-03-14",
    ]);
    // Ends at exactly local midnight of the 4th: the 4th stays untouched.
    expect(localDatesTouched("2027-03-03T20:00:00Z", "2027-03-04T07:00:00Z", DENVER)).toEqual(["2027-03-03"]);
    expect(localDatesTouched("2027-03-03T20:00:00Z", "2027-03-04T07:01:00Z", DENVER)).toEqual(["2027-03-03", "2027-03-04"]);
    expect(localDatesTouched("2027-03-03T20:00:00Z", "2027-03-03T20:00:00Z", DENVER)).toEqual(["2027-03-03"]);
  });

  it("spans the 25-hour day as one date", () => {
    expect(localDatesTouched("2027-11-07T06:00:00Z", "2027-11-08T07:00:00Z", DENVER)).toEqual(["2027-11-07"]);
  });
});

describe("calendar arithmetic", () => {
  it("lists the dates of a period, both ends included, across month and year ends", () => {
    expect(periodDates("2027-02-27", "2027-03-02")).toEqual(["2027-02-27", "2027-02-28", "2027-03-01", "2027-03-02"]);
    expect(periodDates("2027-12-31", "2028-01-01")).toEqual(["2027-12-31", "2028-01-01"]);
    expect(periodDates("2027-03-02", "2027-03-01")).toEqual([]);
    expect(periodDates("2027-03-01", "2027-03-31")).toHaveLength(31);
    expect(addDays("2028-02-28", 1)).toBe("2028-02-29");
  });

  it("numbers days of the week the ISO way, 1 = Monday", () => {
    // 2027-03-01 is a Monday and 2027-03-14 a Sunday (from memory: 2027 begins on a Friday).
    expect(dayOfWeek("2027-03-01")).toBe(1);
    expect(dayOfWeek("2027-03-13")).toBe(6);
    expect(dayOfWeek("2027-03-14")).toBe(7);
  });

  it("measures minutes between instants in real time, not clock time", () => {
    // 01:00 MST to 04:00 MDT on the spring-forward night is 2 hours.
    expect(minutesBetween("2027-03-14T08:00:00Z", "2027-03-14T10:00:00Z")).toBe(120);
    expect(minutesBetween(atLocalTime("2027-03-14", "01:00", DENVER), atLocalTime("2027-03-14", "04:00", DENVER))).toBe(120);
    expect(addMinutes("2027-03-14T23:30:00Z", 45)).toBe("2027-03-15T00:15:00Z");
  });
});

describe("instant and zone schemas", () => {
  it("accepts UTC instants ending in Z and writes them one way", () => {
    expect(instantSchema.parse("2027-03-14T08:00:00.000Z")).toBe("2027-03-14T08:00:00Z");
    expect(instantSchema.parse("2027-03-14T08:00:00.250Z")).toBe("2027-03-14T08:00:00.250Z");
    expect(toInstant(new Date(Date.UTC(2027, 2, 14, 8)))).toBe("2027-03-14T08:00:00Z");
  });

  it("refuses offsets, missing Z and impossible dates", () => {
    for (const bad of ["2027-03-14T08:00:00+01:00", "2027-03-14T08:00:00", "2027-02-30T08:00:00Z", "2027-03-14"]) {
      expect(instantSchema.safeParse(bad).success, bad).toBe(false);
    }
  });

  it("knows real IANA zones and refuses invented ones", () => {
    expect(zoneSchema.safeParse("America/Denver").success).toBe(true);
    expect(zoneSchema.safeParse("Europe/Berlin").success).toBe(true);
    const invented = zoneSchema.safeParse("Mars/Olympus_Mons");
    expect(invented.success).toBe(false);
    expect(invented.error?.issues[0]?.message).toContain("Mars/Olympus_Mons");
  });
});

describe("localDateTimeLabel", () => {
  it("names the zone's abbreviation on each side of a DST change (America/Denver, 14 Mar 2027)", () => {
    expect(localDateTimeLabel("2026-12-21T01:00:00Z", "America/Denver")).toBe("Sun, Dec 20, 18:00 MST");
    expect(localDateTimeLabel("2027-03-15T00:00:00Z", "America/Denver")).toBe("Sun, Mar 14, 18:00 MDT");
  });
});
