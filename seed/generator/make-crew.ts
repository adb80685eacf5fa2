/**
 * Generated crew of one base: seniority lists (pilots share one list, cabin
 * crew another, as is common practice), qualifications, leave and training,
 * carry-in trips from the previous period, and a year of history for the
 * rolling limits.
 */
import type { CarryIn, CrewMember, FixedActivity, Position } from "../../lib/domain/index.ts";
import { addDays, addMinutes, atLocalTime, instantMs, localDate, startOfLocalDay } from "../../lib/domain/time.ts";
import { OCEANIC_QUALIFICATION } from "../carrier.ts";
import { makePairing } from "../pairing-factory.ts";
import type { Rng } from "../random.ts";
import { crewName } from "./names.ts";
import type { GeneratorParams } from "./params.ts";

const DAY_MS = 86_400_000;

const PILOT = new Set<Position>(["captain", "first_officer"]);

export interface CrewContext {
  params: GeneratorParams;
  zone: string;
  endDate: string;
  flightNo: () => number;
}

/** Every position's crew, seniority numbers unique across the carrier. */
export function makeCrew(ctx: CrewContext, r: Rng): CrewMember[] {
  const { params } = ctx;
  const used = new Set<string>();
  const employeeNumber = () => {
    for (;;) {
      const id = String(r.int(10000, 99999));
      if (!used.has(id)) return used.add(id), id;
    }
  };
  const drafts = params.positions.flatMap((position) =>
    Array.from({ length: params.crew }, () => ({
      position,
      // Captains tend to be senior on the shared pilot list.
      hire: r.next() + (position === "first_officer" ? 0.6 : 0) + (position === "flight_attendant" ? 0.4 : 0),
    })),
  );
  const lists = [drafts.filter((d) => PILOT.has(d.position)), drafts.filter((d) => !PILOT.has(d.position))];
  const crew: CrewMember[] = [];
  lists.forEach((list, k) => {
    let seniority = k === 0 ? 0 : 5000;
    for (const d of [...list].sort((a, b) => a.hire - b.hire)) {
      seniority += r.next() < 0.15 ? r.int(2, 4) : 1; // gaps where people retired or left
      crew.push(makeMember(ctx, r, employeeNumber(), seniority, d.position));
    }
  });
  return crew.sort((a, b) => a.seniority - b.seniority);
}

function makeMember(ctx: CrewContext, r: Rng, id: string, seniority: number, position: Position): CrewMember {
  const { params, zone } = ctx;
  const qualifications = ["A220"];
  if (r.next() < 0.7) qualifications.push(OCEANIC_QUALIFICATION);
  if (!PILOT.has(position)) {
    if (r.next() < 0.25) qualifications.push("lang:de");
    if (r.next() < 0.15) qualifications.push("lang:es");
  }
  const fixedActivities: FixedActivity[] = [];
  if (r.next() < 0.15) {
    const first = addDays(params.startDate, r.int(0, params.days - 6));
    const length = r.int(5, 10);
    fixedActivities.push({ kind: "vacation", start: startOfLocalDay(first, zone), end: startOfLocalDay(addDays(first, length), zone), label: "Annual leave" });
  }
  if (r.next() < 0.08) {
    const day = addDays(params.startDate, r.int(0, params.days - 1));
    const start = atLocalTime(day, "08:00", zone);
    const clash = fixedActivities.some((a) => a.start <= addMinutes(start, 540) && start <= a.end);
    if (!clash) fixedActivities.push({ kind: "training", start, end: addMinutes(start, 540), label: "Recurrent training" });
  }
  const carryIn: CarryIn[] = [];
  if (r.next() < 0.1) {
    const days = r.int(2, 3);
    const p = makePairing(
      { id: `C${id}`, base: params.base, startDate: addDays(params.startDate, -r.int(1, days - 1)), days, firstDeparture: "09:30", crewNeeded: { [position]: 1 } },
      r,
      ctx.flightNo,
    );
    carryIn.push({ pairingId: p.id, dutyPeriods: p.dutyPeriods });
  }
  // Leave or training drawn within a day of the carry-in trip would overlap it or cut short the rest after it
  // (a schedule nobody could hold): it is dropped. Drawn before the trip, so every other draw stays as it was.
  const keep = (a: FixedActivity) =>
    carryIn.every((c) => {
      const from = instantMs(c.dutyPeriods[0]!.report) - DAY_MS;
      const to = instantMs(c.dutyPeriods.at(-1)!.release) + DAY_MS;
      return instantMs(a.end) <= from || instantMs(a.start) >= to;
    });
  const historyEnd = carryIn[0] ? localDate(carryIn[0].dutyPeriods[0]!.report, zone) : params.startDate;
  return {
    id,
    name: crewName(r),
    seniority,
    base: params.base,
    position,
    qualifications,
    fixedActivities: fixedActivities.filter(keep).sort((a, b) => a.start.localeCompare(b.start)),
    carryIn,
    lookBack: makeHistory(r, zone, params.startDate, historyEnd),
    carriedWeight: 1,
  };
}

/**
 * A year of flying before the period, stopping at `end` (exclusive; a carry-in trip starts there): blocks of 2–4 duty days and 2–5
 * days off, 2.5–7 h of flight time a day. Gives about 700–900 h a year, inside
 * 14 CFR 117.23(b)'s 1,000 h. The last 28 days' duties are listed one by one.
 */
function makeHistory(r: Rng, zone: string, periodStart: string, end: string): CrewMember["lookBack"] {
  const duties: CrewMember["lookBack"]["duties"] = [];
  const dailyFlightMinutes: CrewMember["lookBack"]["dailyFlightMinutes"] = [];
  // The windows rolling limits read: 365 days of daily totals, 28 days of duties, before the period.
  const first = addDays(periodStart, -365);
  const recent = addDays(periodStart, -28);
  let day = addDays(first, r.int(0, 4));
  while (day < addDays(end, -1)) {
    const on = r.int(2, 4);
    for (let k = 0; k < on && day < addDays(end, -1); k++, day = addDays(day, 1)) {
      const flight = r.int(30, 84) * 5;
      const segments = r.int(1, 4);
      const report = atLocalTime(day, `${String(r.int(6, 12)).padStart(2, "0")}:${r.pick(["00", "15", "30", "45"])}`, zone);
      dailyFlightMinutes.push({ date: day, minutes: flight });
      if (day >= recent) duties.push({ report, release: addMinutes(report, flight + 90 + segments * 40), flightMinutes: flight, segments });
    }
    day = addDays(day, r.int(2, 5));
  }
  return { duties, dailyFlightMinutes };
}
