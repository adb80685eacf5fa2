/**
 * A parsed, checked bundle as the rows to write, with their ids made here so
 * that every table can be written with createMany (one statement per few
 * thousand rows) instead of a nested create per pairing and crew member.
 * Pure: no database; the base's id is filled in when it is known.
 */
import { randomUUID } from "node:crypto";
import { canonicalJson, type Bundle, type Position, type RuleSet, type Station } from "../domain/index";
import { bidReceipt } from "./bid-receipt";
import type { BidPeriodState, Prisma } from "./generated/client";
import type { ActivityRow, DailyFlightRow, DutyPeriodRow, LegRow, PastDutyRow } from "./period-import-bulk";
import { dateColumn } from "./period-export-rows";

/** A value the schemas parsed, as a JSON column value (optional keys that are absent stay absent). */
function json(value: unknown): Prisma.InputJsonValue {
  return JSON.parse(JSON.stringify(value)) as Prisma.InputJsonValue;
}

/** The period row's fields that do not come from the bundle. */
export interface PeriodFields {
  name: string;
  opensAt: Date;
  deadline: Date;
  state: BidPeriodState;
  closedAt: Date | null;
}

/** Every row an import writes, in write order; `place` says where in the bundle a row came from. */
export interface ImportPlan {
  baseCode: string;
  baseName: string;
  stations: Array<{ place: string; station: Station }>;
  period: Omit<Prisma.BidPeriodCreateManyInput, "baseId"> & { id: string };
  crew: Array<{ place: string; row: Omit<Prisma.CrewMemberCreateManyInput, "baseId"> }>;
  pairings: Prisma.PairingCreateManyInput[];
  dutyPeriods: DutyPeriodRow[];
  legs: LegRow[];
  activities: ActivityRow[];
  carryIn: Prisma.CarryInTripCreateManyInput[];
  pastDuties: PastDutyRow[];
  dailyFlight: DailyFlightRow[];
  /** distinct rule-set documents, in order of first use */
  ruleSets: RuleSet[];
  groups: Array<{ position: Position; ruleSet: number; settings: Prisma.InputJsonValue }>;
  bids: Prisma.BidCreateManyInput[];
  submissions: Prisma.BidSubmissionCreateManyInput[];
}

/** A pairing's rows: the Pairing row, its duty periods and their legs, with ids made here. */
export function pairingRows(
  pairing: Bundle["instances"][number]["pairings"][number],
  periodId: string,
): { pairing: Prisma.PairingCreateManyInput & { id: string }; dutyPeriods: DutyPeriodRow[]; legs: LegRow[] } {
  const pairingId = randomUUID();
  const out = {
    pairing: {
      id: pairingId,
      bidPeriodId: periodId,
      code: pairing.id,
      startsAt: new Date(pairing.dutyPeriods[0]!.report),
      endsAt: new Date(pairing.dutyPeriods.at(-1)!.release),
      blockMinutes: pairing.blockMinutes,
      creditMinutes: pairing.creditMinutes,
      tafbMinutes: pairing.tafbMinutes,
      crewNeeded: json(pairing.crewNeeded),
      requires: pairing.requires,
    },
    dutyPeriods: [] as DutyPeriodRow[],
    legs: [] as LegRow[],
  };
  pairing.dutyPeriods.forEach((duty, seq) => {
    const dutyPeriodId = randomUUID();
    out.dutyPeriods.push({ id: dutyPeriodId, pairingId, seq, reportAt: new Date(duty.report), releaseAt: new Date(duty.release) });
    duty.legs.forEach((leg, legSeq) =>
      out.legs.push({
        id: randomUUID(),
        dutyPeriodId,
        seq: legSeq,
        flightNumber: leg.flightNumber,
        fromCode: leg.from,
        toCode: leg.to,
        departsAt: new Date(leg.departure),
        arrivesAt: new Date(leg.arrival),
        deadhead: leg.deadhead,
        blockMinutes: leg.blockMinutes,
        equipment: leg.equipment ?? null,
      }),
    );
  });
  return out;
}

function addPairing(plan: ImportPlan, pairing: Bundle["instances"][number]["pairings"][number], periodId: string): void {
  const rows = pairingRows(pairing, periodId);
  plan.pairings.push(rows.pairing);
  plan.dutyPeriods.push(...rows.dutyPeriods);
  plan.legs.push(...rows.legs);
}

function addCrewMember(plan: ImportPlan, member: Bundle["instances"][number]["crew"][number], place: string): string {
  const crewMemberId = randomUUID();
  plan.crew.push({
    place,
    row: {
      id: crewMemberId,
      employeeNumber: member.id,
      name: member.name,
      seniority: member.seniority,
      position: member.position,
      qualifications: member.qualifications,
      carriedWeight: member.carriedWeight,
    },
  });
  for (const a of member.fixedActivities) {
    plan.activities.push({ id: randomUUID(), crewMemberId, kind: a.kind, startsAt: new Date(a.start), endsAt: new Date(a.end), label: a.label ?? "" });
  }
  for (const trip of member.carryIn) {
    plan.carryIn.push({
      crewMemberId,
      pairingCode: trip.pairingId,
      dutyPeriods: json(trip.dutyPeriods),
      startsAt: new Date(trip.dutyPeriods[0]!.report),
      endsAt: new Date(trip.dutyPeriods.at(-1)!.release),
    });
  }
  for (const d of member.lookBack.duties) {
    plan.pastDuties.push({
      id: randomUUID(),
      crewMemberId,
      reportAt: new Date(d.report),
      releaseAt: new Date(d.release),
      flightMinutes: d.flightMinutes,
      segments: d.segments,
      endStation: d.endStation ?? null,
    });
  }
  for (const day of member.lookBack.dailyFlightMinutes) {
    plan.dailyFlight.push({ crewMemberId, date: dateColumn(day.date), minutes: day.minutes });
  }
  return crewMemberId;
}

/** The rows of `bundle` (already parsed and checked by bundleFitProblems). */
export function planImport(bundle: Bundle, fields: PeriodFields): ImportPlan {
  const periodId = bundle.period.id;
  const baseCode = bundle.instances[0]!.group.base;
  const baseStation = bundle.instances.flatMap((inst) => inst.stations).find((s) => s.code === baseCode)!;
  const plan: ImportPlan = {
    baseCode,
    baseName: baseStation.name,
    stations: [],
    period: {
      id: periodId,
      name: fields.name,
      startDate: dateColumn(bundle.period.startDate),
      endDate: dateColumn(bundle.period.endDate),
      zone: bundle.period.zone,
      opensAt: fields.opensAt,
      deadline: fields.deadline,
      state: fields.state,
      closedAt: fields.closedAt,
    },
    crew: [],
    pairings: [],
    dutyPeriods: [],
    legs: [],
    activities: [],
    carryIn: [],
    pastDuties: [],
    dailyFlight: [],
    ruleSets: [],
    groups: [],
    bids: [],
    submissions: [],
  };
  const stations = new Set<string>();
  const pairings = new Set<string>();
  const ruleSetAt = new Map<string, number>();
  bundle.instances.forEach((inst, i) => {
    inst.stations.forEach((station, k) => {
      if (stations.has(station.code)) return;
      stations.add(station.code);
      plan.stations.push({ place: `instances[${i}].stations[${k}]`, station });
    });
    for (const pairing of inst.pairings) {
      if (pairings.has(pairing.id)) continue;
      pairings.add(pairing.id);
      addPairing(plan, pairing, periodId);
    }
    const crewIds = new Map<string, string>();
    inst.crew.forEach((member, k) => crewIds.set(member.id, addCrewMember(plan, member, `instances[${i}].crew[${k}]`)));
    const docKey = canonicalJson(inst.ruleSet);
    if (!ruleSetAt.has(docKey)) ruleSetAt.set(docKey, plan.ruleSets.push(inst.ruleSet) - 1);
    plan.groups.push({ position: inst.group.position, ruleSet: ruleSetAt.get(docKey)!, settings: json(inst.settings) });
    for (const [crewId, wishes] of Object.entries(inst.bids)) {
      const crewMemberId = crewIds.get(crewId)!;
      const receipt = bidReceipt({ crewId, periodId, wishes });
      const stored = json(receipt.bid.wishes);
      plan.bids.push({ crewMemberId, bidPeriodId: periodId, wishes: stored, revision: 1 });
      plan.submissions.push({
        crewMemberId,
        bidPeriodId: periodId,
        revision: 1,
        wishes: stored,
        hash: receipt.hash,
        receiptCode: receipt.receiptCode,
      });
    }
  });
  return plan;
}
