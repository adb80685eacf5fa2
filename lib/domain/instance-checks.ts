import type { z } from "zod";
import type { Instance } from "./instance.ts";
import { pairingLegs, pairingStart } from "./pairing-facts.ts";
import { daysBetween, instantMs, localDate, startOfLocalDay } from "./time.ts";

type Fail = (path: Array<string | number>, message: string) => void;

function firstIndexes<T>(items: readonly T[], key: (item: T) => string | number): Map<string | number, number> {
  const first = new Map<string | number, number>();
  items.forEach((item, k) => {
    if (!first.has(key(item))) first.set(key(item), k);
  });
  return first;
}

/**
 * The cross checks of an instance, each message saying what is wrong and where:
 * unique station codes, pairing ids, crew ids and seniority numbers; pairings
 * and crew of the group's base (and crew of its position); every leg between
 * stations of the instance; the period's zone is the base's; each pairing
 * starts inside the period (a trip belongs to the period it starts in); carry-in
 * and look-back lie before the period; bids belong to crew of the instance and
 * name no one as their own buddy; the reserve minimum fits the crew.
 * A buddy outside the group and a wish naming an unknown trip are allowed: they
 * can only score 0, and the explanation says the wish was not granted.
 */
export function checkInstance(instance: Instance, ctx: z.RefinementCtx): void {
  const fail: Fail = (path, message) => ctx.addIssue({ code: "custom", path, message });
  checkStations(instance, fail);
  checkPairings(instance, fail);
  checkCrew(instance, fail);
  checkBids(instance, fail);
  const { min } = instance.settings.reserve;
  if (min > instance.crew.length) {
    fail(["settings", "reserve", "min"], `settings.reserve.min ${min} is more than the ${instance.crew.length} crew of this group`);
  }
}

function checkStations({ stations, group, period }: Instance, fail: Fail): void {
  const stationAt = firstIndexes(stations, (station) => station.code);
  stations.forEach((station, k) => {
    const first = stationAt.get(station.code);
    if (first !== k) fail(["stations", k, "code"], `stations[${k}].code "${station.code}" repeats stations[${first}]`);
  });
  const base = stations.find((station) => station.code === group.base);
  if (!base) fail(["group", "base"], `group.base "${group.base}" is not a station of this instance`);
  else if (base.zone !== period.zone) {
    fail(["period", "zone"], `period.zone "${period.zone}" is not the zone "${base.zone}" of the base ${base.code}`);
  }
}

function checkPairings({ pairings, stations, group, period }: Instance, fail: Fail): void {
  const known = new Set(stations.map((station) => station.code));
  const pairingAt = firstIndexes(pairings, (pairing) => pairing.id);
  pairings.forEach((pairing, k) => {
    const where = `pairings[${k}]`;
    const first = pairingAt.get(pairing.id);
    if (first !== k) fail(["pairings", k, "id"], `${where}.id "${pairing.id}" repeats pairings[${first}]`);
    if (pairing.base !== group.base) {
      fail(["pairings", k, "base"], `${where}.base "${pairing.base}" is not the group's base ${group.base}`);
    }
    const codes = new Set(pairingLegs(pairing).flatMap((leg) => [leg.from, leg.to]));
    for (const code of [...codes].filter((c) => !known.has(c))) {
      fail(["pairings", k, "dutyPeriods"], `${where} "${pairing.id}" flies to or from "${code}", which is not a station of this instance`);
    }
    const starts = localDate(pairingStart(pairing), period.zone);
    if (daysBetween(period.startDate, starts) < 0 || daysBetween(starts, period.endDate) < 0) {
      fail(
        ["pairings", k, "dutyPeriods", 0, "report"],
        `${where} "${pairing.id}" starts on ${starts}, outside the period ${period.startDate}..${period.endDate}`,
      );
    }
  });
}

function checkCrew({ crew, group, period }: Instance, fail: Fail): void {
  const periodStart = instantMs(startOfLocalDay(period.startDate, period.zone));
  const crewAt = firstIndexes(crew, (member) => member.id);
  const seniorityAt = firstIndexes(crew, (member) => member.seniority);
  crew.forEach((member, k) => {
    const where = `crew[${k}]`;
    const first = crewAt.get(member.id);
    if (first !== k) fail(["crew", k, "id"], `${where}.id "${member.id}" repeats crew[${first}]`);
    const senior = seniorityAt.get(member.seniority);
    if (senior !== k) fail(["crew", k, "seniority"], `${where}.seniority ${member.seniority} repeats crew[${senior}]`);
    if (member.base !== group.base) {
      fail(["crew", k, "base"], `${where}.base "${member.base}" is not the group's base ${group.base}`);
    }
    if (member.position !== group.position) {
      fail(["crew", k, "position"], `${where}.position "${member.position}" is not the group's position ${group.position}`);
    }
    member.carryIn.forEach((trip, t) => {
      const report = trip.dutyPeriods[0]?.report;
      if (report !== undefined && instantMs(report) >= periodStart) {
        fail(["crew", k, "carryIn", t], `${where}.carryIn[${t}] "${trip.pairingId}" starts ${report}, not before the period`);
      }
    });
    member.lookBack.duties.forEach((duty, d) => {
      if (instantMs(duty.report) >= periodStart) {
        fail(["crew", k, "lookBack", "duties", d], `${where}.lookBack.duties[${d}] reports ${duty.report}, not before the period`);
      }
    });
    member.lookBack.dailyFlightMinutes.forEach((day, d) => {
      if (daysBetween(day.date, period.startDate) <= 0) {
        const path = ["crew", k, "lookBack", "dailyFlightMinutes", d];
        fail(path, `${where}.lookBack.dailyFlightMinutes[${d}] is dated ${day.date}, not before the period`);
      }
    });
  });
}

function checkBids({ bids, crew }: Instance, fail: Fail): void {
  const crewIds = new Set(crew.map((member) => member.id));
  for (const [crewId, wishes] of Object.entries(bids)) {
    if (!crewIds.has(crewId)) fail(["bids", crewId], `bids["${crewId}"] is for a crew member not in this instance`);
    wishes.forEach((wish, rank) => {
      if (wish.kind === "buddy" && wish.crewId === crewId) {
        fail(["bids", crewId, rank, "crewId"], `bids["${crewId}"][${rank}] names the crew member as their own buddy`);
      }
    });
  }
}
