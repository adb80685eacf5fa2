/**
 * What a bundle must satisfy, beyond bundleSchema, to be stored, and what of
 * it a later export will not give back.
 *
 * Refused: the database keeps one row per station, trip and crew member for
 * the whole period, so what the instances say about one of them must agree;
 * and it keeps no list of a group's trips (the export gives a group the trips
 * that need its position), so each instance must list exactly those.
 *
 * Stored but noted: crew rows (activities, carry-in, look-back, daily totals)
 * are not tied to a period in the database, so the export picks them by the
 * period's windows (period-windows.ts). A row outside them is a true fact
 * about the crew member and is kept — another period's export may use it —
 * but this period's export leaves it out; the import lists each such row.
 */
import {
  awardGroupKey,
  canonicalJson,
  instantMs,
  type Bundle,
  type Pairing,
  type Position,
  type Station,
} from "../domain/index";
import { bindRules } from "../rules/index";
import { DAILY_FLIGHT_DAYS, LOOK_BACK_DAYS, inWindow, periodWindows } from "./period-windows";

interface Seen<T> {
  place: string;
  value: T;
  json: string;
}

function needed(pairing: Pairing, position: Position): number {
  return pairing.crewNeeded[position] ?? 0;
}

function checkStations(bundle: Bundle, problems: string[]): void {
  const seen = new Map<string, Seen<Station>>();
  bundle.instances.forEach((inst, i) =>
    inst.stations.forEach((station, k) => {
      const place = `instances[${i}].stations[${k}]`;
      const json = canonicalJson(station);
      const first = seen.get(station.code);
      if (!first) seen.set(station.code, { place, value: station, json });
      else if (first.json !== json) {
        problems.push(`${place} "${station.code}" differs from ${first.place}: a station has one name, zone and longitude`);
      }
    }),
  );
}

function checkPairings(bundle: Bundle, problems: string[]): void {
  const seen = new Map<string, Seen<Pairing>>();
  bundle.instances.forEach((inst, i) =>
    inst.pairings.forEach((pairing, k) => {
      const place = `instances[${i}].pairings[${k}]`;
      const json = canonicalJson(pairing);
      const first = seen.get(pairing.id);
      if (!first) {
        seen.set(pairing.id, { place, value: pairing, json });
        return;
      }
      if (first.json === json) return;
      const ours = canonicalJson(pairing.crewNeeded);
      const theirs = canonicalJson(first.value.crewNeeded);
      problems.push(
        ours !== theirs
          ? `${place} "${pairing.id}": crewNeeded ${ours} differs from ${theirs} at ${first.place}`
          : `${place} "${pairing.id}" differs from ${first.place}: a trip number names one trip in a period`,
      );
    }),
  );
  // Membership follows crewNeeded, both ways.
  bundle.instances.forEach((inst, i) => {
    const { position } = inst.group;
    const key = awardGroupKey(inst.group);
    const ids = new Set(inst.pairings.map((pairing) => pairing.id));
    inst.pairings.forEach((pairing, k) => {
      if (needed(pairing, position) === 0) {
        problems.push(
          `instances[${i}].pairings[${k}] "${pairing.id}" needs no ${position} (crewNeeded ${canonicalJson(pairing.crewNeeded)}), so it is not a trip of the group ${key}`,
        );
      }
    });
    for (const [id, first] of seen) {
      const n = needed(first.value, position);
      if (n > 0 && !ids.has(id)) {
        problems.push(`instances[${i}] (${key}) lacks pairing "${id}" of ${first.place}, which needs ${n} ${position}`);
      }
    }
  });
}

function checkCrew(bundle: Bundle, problems: string[]): void {
  const byId = new Map<string, string>();
  const bySeniority = new Map<number, string>();
  bundle.instances.forEach((inst, i) =>
    inst.crew.forEach((member, k) => {
      const place = `instances[${i}].crew[${k}]`;
      const id = byId.get(member.id);
      if (id === undefined) byId.set(member.id, place);
      else problems.push(`${place}.id "${member.id}" repeats ${id}: a crew member holds one position`);
      const senior = bySeniority.get(member.seniority);
      if (senior === undefined) bySeniority.set(member.seniority, place);
      else problems.push(`${place}.seniority ${member.seniority} repeats ${senior}: seniority numbers are unique across the carrier`);
    }),
  );
}

/**
 * The places of crew rows that lie outside the period's windows (each with
 * the reason), which a later export of this period leaves out. Empty for a
 * bundle the export wrote.
 */
export function outsideWindows(bundle: Bundle): string[] {
  const outside: string[] = [];
  const { period } = bundle;
  const w = periodWindows(period);
  const span = `${period.startDate}..${period.endDate}`;
  bundle.instances.forEach((inst, i) =>
    inst.crew.forEach((member, k) => {
      const place = `instances[${i}].crew[${k}]`;
      member.fixedActivities.forEach((a, n) => {
        if (!inWindow.activity(w, instantMs(a.start), instantMs(a.end))) {
          outside.push(`${place}.fixedActivities[${n}] (${a.kind} ${a.start}..${a.end}) does not overlap the period ${span}`);
        }
      });
      member.carryIn.forEach((trip, n) => {
        const start = instantMs(trip.dutyPeriods[0]!.report);
        const release = trip.dutyPeriods.at(-1)!.release;
        if (!inWindow.carryIn(w, start, instantMs(release))) {
          outside.push(`${place}.carryIn[${n}] "${trip.pairingId}" is released ${release}, before the period starts (so it is not a carry-in)`);
        }
      });
      member.lookBack.duties.forEach((duty, n) => {
        if (!inWindow.pastDuty(w, instantMs(duty.report), instantMs(duty.release))) {
          outside.push(`${place}.lookBack.duties[${n}] is released ${duty.release}, more than ${LOOK_BACK_DAYS} days before the period`);
        }
      });
      member.lookBack.dailyFlightMinutes.forEach((day, n) => {
        if (!inWindow.dailyFlight(w, day.date)) {
          outside.push(
            `${place}.lookBack.dailyFlightMinutes[${n}] is dated ${day.date}, more than ${DAILY_FLIGHT_DAYS} days before the period`,
          );
        }
      });
    }),
  );
  return outside;
}

/**
 * The reasons, each naming its place in the bundle, why a bundle that passed
 * bundleSchema cannot be stored as it is: a station, trip number, employee or
 * seniority number that means different things in different instances; a trip
 * missing from (or put into) a group against its crewNeeded. Empty when it can
 * be stored.
 */
export function bundleFitProblems(bundle: Bundle): string[] {
  const problems: string[] = [];
  checkStations(bundle, problems);
  checkPairings(bundle, problems);
  checkCrew(bundle, problems);
  checkRuleSets(bundle, problems);
  return problems;
}

/** Every rule set must bind in the legality engine: a known check for each rule, valid parameters. */
function checkRuleSets(bundle: Bundle, problems: string[]): void {
  bundle.instances.forEach((instance, k) => {
    try {
      bindRules(instance.ruleSet.rules);
    } catch (e) {
      problems.push(`instances[${k}].ruleSet ("${instance.ruleSet.name}"): ${(e as Error).message}`);
    }
  });
}
