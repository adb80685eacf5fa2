/**
 * When a period's rows do not make a valid bundle, say which rows: each issue
 * of the parse is prefixed with the table and id of the row its path points
 * into, so a planner (or a developer) can find and fix it.
 */
import type { z } from "zod";
import { AppError, describeIssues } from "../domain/index";
import { groupLabel, type ExportSources, type InstanceSources } from "./period-export-assemble";

type Path = ReadonlyArray<PropertyKey>;

function pairingRow(inst: InstanceSources, rest: Path): string | undefined {
  const [k, field, d, legs, l] = rest;
  const pairing = typeof k === "number" ? inst.pairings[k] : undefined;
  if (!pairing) return undefined;
  const trip = `Pairing ${pairing.code} (row ${pairing.id})`;
  const duty = field === "dutyPeriods" && typeof d === "number" ? pairing.dutyPeriods[d] : undefined;
  if (!duty) return trip;
  const leg = legs === "legs" && typeof l === "number" ? duty.legs[l] : undefined;
  if (!leg) return `DutyPeriod seq ${duty.seq} (row ${duty.id}) of ${trip}`;
  return `Leg seq ${leg.seq} (row ${leg.id}) of DutyPeriod seq ${duty.seq} of ${trip}`;
}

function crewRow(inst: InstanceSources, rest: Path): string | undefined {
  const [k, field, a, b] = rest;
  const member = typeof k === "number" ? inst.crew[k] : undefined;
  if (!member) return undefined;
  const who = `CrewMember ${member.employeeNumber} (row ${member.id})`;
  const at = (index: unknown) => (typeof index === "number" ? index : -1);
  if (field === "fixedActivities") {
    const row = member.activities[at(a)];
    if (row) return `FixedActivity row ${row.id} of ${who}`;
  }
  if (field === "carryIn") {
    const row = member.carryIn[at(a)];
    if (row) return `CarryInTrip ${row.pairingCode} (row ${row.id}) of ${who}`;
  }
  if (field === "lookBack" && a === "duties") {
    const row = member.pastDuties[at(b)];
    if (row) return `PastDuty row ${row.id} of ${who}`;
  }
  if (field === "lookBack" && a === "dailyFlightMinutes") {
    const row = member.dailyFlight[at(b)];
    if (row) return `DailyFlightTotal ${row.date.toISOString().slice(0, 10)} of ${who}`;
  }
  return who;
}

/** The row an issue's path points into, as "Table key (row id)"; the period itself when nothing narrower fits. */
export function rowAt(sources: ExportSources, path: Path): string {
  const periodRow = `BidPeriod "${sources.period.name}" (row ${sources.period.id})`;
  const [top, i, field, ...rest] = path;
  const inst = top === "instances" && typeof i === "number" ? sources.instances[i] : undefined;
  if (!inst) return periodRow;
  const { group } = inst;
  const groupRow = `AwardGroup ${groupLabel(sources.period.base.stationCode, group.position)} (row ${group.id})`;
  switch (field) {
    case "group":
    case "settings":
      return groupRow;
    case "ruleSet":
      return `RuleSet "${group.ruleSet.name}" (row ${group.ruleSet.id}) of ${groupRow}`;
    case "stations": {
      const code = typeof rest[0] === "number" ? inst.stations[rest[0]] : undefined;
      return code ? `Station ${code}` : groupRow;
    }
    case "pairings":
      return pairingRow(inst, rest) ?? groupRow;
    case "crew":
      return crewRow(inst, rest) ?? groupRow;
    case "bids": {
      const submission = typeof rest[0] === "string" ? inst.submissions.get(rest[0]) : undefined;
      return submission
        ? `BidSubmission revision ${submission.revision} (row ${submission.id}) of crew member ${String(rest[0])}`
        : groupRow;
    }
    default:
      return periodRow;
  }
}

/** AppError("invalid") for rows that do not parse as a bundle, one line per issue, each naming its row. */
export function exportError(sources: ExportSources, error: z.ZodError): AppError {
  const texts = describeIssues(error);
  const lines = [...new Set(error.issues.map((issue, k) => `${rowAt(sources, issue.path)}: ${texts[k]}`))];
  const { period } = sources;
  return new AppError("invalid", `bid period "${period.name}" (${period.id}) cannot be exported: ${lines.join("; ")}`, {
    issues: lines,
  });
}
