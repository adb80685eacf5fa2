// A small fictional carrier for the domain tests: base HVN ("Haven Field") in
// America/Denver and three outstations with invented names. Times are written
// as base-local clock times and turned into UTC instants by the time module.
import {
  atLocalTime,
  minutesBetween,
  type Pairing,
  pairingSchema,
  type Station,
} from "../../../lib/domain/index.ts";

export const ZONE = "America/Denver";

export const stations: Station[] = [
  { code: "HVN", name: "Haven Field", zone: "America/Denver", longitude: -104.9 },
  { code: "QRL", name: "Quarry Lake", zone: "America/Los_Angeles", longitude: -118.3 },
  { code: "BXT", name: "Bexton Municipal", zone: "America/Chicago", longitude: -90.2 },
  { code: "MRW", name: "Marrow Point", zone: "America/New_York", longitude: -75.1 },
];

/** "2027-03-12 07:00" base local → UTC instant. */
export function local(dateTime: string): string {
  const [date = "", time = ""] = dateTime.split(" ");
  return atLocalTime(date, time, ZONE);
}

type LegSpec = [flight: string, from: string, to: string, departs: string, arrives: string, deadhead?: "deadhead"];
interface DutySpec {
  report: string;
  release: string;
  legs: LegSpec[];
}

/** A pairing from base-local times; block is the scheduled flight time of operated legs. */
export function trip(id: string, duties: DutySpec[], creditMinutes: number, extra: Partial<Pairing> = {}): Pairing {
  const dutyPeriods = duties.map((duty) => ({
    report: local(duty.report),
    release: local(duty.release),
    legs: duty.legs.map(([flightNumber, from, to, departs, arrives, deadhead]) => ({
      flightNumber,
      from,
      to,
      departure: local(departs),
      arrival: local(arrives),
      deadhead: deadhead === "deadhead",
      blockMinutes: minutesBetween(local(departs), local(arrives)),
    })),
  }));
  const legs = dutyPeriods.flatMap((duty) => duty.legs);
  return pairingSchema.parse({
    id,
    base: "HVN",
    dutyPeriods,
    blockMinutes: legs.filter((leg) => !leg.deadhead).reduce((sum, leg) => sum + leg.blockMinutes, 0),
    creditMinutes,
    tafbMinutes: minutesBetween(dutyPeriods[0]?.report ?? "", dutyPeriods.at(-1)?.release ?? ""),
    crewNeeded: { captain: 1, first_officer: 1 },
    requires: [],
    ...extra,
  });
}

/** Wednesday 3 March: a one-day out-and-back, reporting 06:00. */
export const T101 = trip(
  "T101",
  [
    {
      report: "2027-03-03 06:00",
      release: "2027-03-03 14:00",
      legs: [
        ["LK101", "HVN", "QRL", "2027-03-03 07:00", "2027-03-03 09:30"],
        ["LK102", "QRL", "HVN", "2027-03-03 10:30", "2027-03-03 13:00"],
      ],
    },
  ],
  300,
);

/** Friday 12 – Sunday 14 March: three days over the spring-forward night; released 18:00 MDT = 00:00Z on the 15th. */
export const T202 = trip(
  "T202",
  [
    { report: "2027-03-12 07:00", release: "2027-03-12 11:00", legs: [["LK201", "HVN", "QRL", "2027-03-12 08:00", "2027-03-12 10:30"]] },
    { report: "2027-03-13 09:00", release: "2027-03-13 14:30", legs: [["LK203", "QRL", "BXT", "2027-03-13 10:00", "2027-03-13 14:00"]] },
    { report: "2027-03-14 15:00", release: "2027-03-14 18:00", legs: [["LK205", "BXT", "HVN", "2027-03-14 16:00", "2027-03-14 17:30"]] },
  ],
  840,
);

/** Saturday 20 – Sunday 21 March: a red-eye out over local midnight, laying over at MRW. */
export const T303 = trip(
  "T303",
  [
    { report: "2027-03-20 22:30", release: "2027-03-21 04:00", legs: [["LK301", "HVN", "MRW", "2027-03-20 23:30", "2027-03-21 03:30"]] },
    { report: "2027-03-21 16:00", release: "2027-03-21 21:30", legs: [["LK302", "MRW", "HVN", "2027-03-21 17:00", "2027-03-21 21:00"]] },
  ],
  600,
);

/** Wednesday 24 – Thursday 25 March: three legs on day one, the last a deadhead. */
export const T404 = trip(
  "T404",
  [
    {
      report: "2027-03-24 09:00",
      release: "2027-03-24 18:30",
      legs: [
        ["LK401", "HVN", "BXT", "2027-03-24 10:00", "2027-03-24 12:00"],
        ["LK402", "BXT", "MRW", "2027-03-24 13:00", "2027-03-24 15:00"],
        ["LK777", "MRW", "BXT", "2027-03-24 16:00", "2027-03-24 18:00", "deadhead"],
      ],
    },
    { report: "2027-03-25 10:00", release: "2027-03-25 17:30", legs: [["LK404", "BXT", "HVN", "2027-03-25 11:00", "2027-03-25 17:00"]] },
  ],
  720,
);

export const allTrips = [T101, T202, T303, T404];
