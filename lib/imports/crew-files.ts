/**
 * crew.csv and activities.csv (docs/csv-format.md) read into crew members and
 * their fixed activities, each problem at its line and column. Pure: what the
 * database already holds comes in through the context.
 */
import { z } from "zod";
import { crewIdSchema, fixedActivitySchema, overlaps, positionSchema, stationCodeSchema, type FixedActivity, type Position } from "../domain/index";
import { instantCell, listCell, wholeCell } from "./cells";
import { readTable, type ImportProblem } from "./csv-table";

export const CREW_COLUMNS = {
  required: ["employee_number", "name", "seniority", "base", "position", "qualifications"],
} as const;

export const ACTIVITY_COLUMNS = {
  required: ["employee_number", "kind", "start_utc", "end_utc"],
  optional: ["label"],
} as const;

const crewRow = z.object({
  employee_number: crewIdSchema,
  name: z.string().min(1, "a crew member needs a name").max(120, "a name has at most 120 characters"),
  seniority: wholeCell(1, "a seniority number"),
  base: stationCodeSchema,
  position: z.string().transform((s, ctx) => {
    const parsed = positionSchema.safeParse(s);
    if (parsed.success) return parsed.data;
    ctx.addIssue({ code: "custom", message: `"${s}" is not a position: use captain, first_officer, purser or flight_attendant` });
    return z.NEVER;
  }),
  qualifications: listCell,
});

const activityRow = z.object({
  employee_number: crewIdSchema,
  kind: z.string().transform((s, ctx) => {
    const parsed = fixedActivitySchema.shape.kind.safeParse(s);
    if (parsed.success) return parsed.data;
    ctx.addIssue({ code: "custom", message: `"${s}" is not an activity kind: use vacation, training, medical, office or other` });
    return z.NEVER;
  }),
  start_utc: instantCell,
  end_utc: instantCell,
  label: z.string().max(120, "a label has at most 120 characters").optional(),
});

/** A crew member as the import stores them. */
export interface CrewFileMember {
  line: number;
  employeeNumber: string;
  name: string;
  seniority: number;
  position: Position;
  qualifications: string[];
}

/** What the files are checked against. */
export interface CrewFilesContext {
  baseCode: string;
  /** the period's span as UTC instants: activities outside it are refused */
  periodStart: string;
  periodEnd: string;
  /** every crew member of the carrier, by employee number */
  known: ReadonlyMap<string, { seniority: number; baseCode: string }>;
}

export interface CrewFiles {
  /** absent when no crew.csv was given */
  crew?: CrewFileMember[];
  /** absent when no activities.csv was given; by employee number */
  activities?: Map<string, FixedActivity[]>;
  problems: ImportProblem[];
}

/** Reads crew.csv and/or activities.csv (either may be absent). */
export function readCrewFiles(crewText: string | undefined, activitiesText: string | undefined, ctx: CrewFilesContext): CrewFiles {
  const problems: ImportProblem[] = [];
  const out: CrewFiles = { problems };
  const refusedCrew: string[] = [];
  if (crewText !== undefined) {
    const table = readTable("crew.csv", crewText, CREW_COLUMNS, crewRow);
    problems.push(...table.problems);
    refusedCrew.push(...table.rejected.map((r) => r.value.employee_number ?? ""));
    const byNumber = new Map<string, number>();
    const bySeniority = new Map<number, { line: number; employee: string }>();
    const crew: CrewFileMember[] = [];
    for (const { line, value: c } of table.rows) {
      const first = byNumber.get(c.employee_number);
      if (first !== undefined) {
        problems.push({ file: "crew.csv", line, column: "employee_number", message: `employee ${c.employee_number} appears twice (first on line ${first})` });
        continue;
      }
      byNumber.set(c.employee_number, line);
      const senior = bySeniority.get(c.seniority);
      if (senior) problems.push({ file: "crew.csv", line, column: "seniority", message: `seniority ${c.seniority} is also employee ${senior.employee}'s (line ${senior.line}); seniority numbers are unique` });
      else bySeniority.set(c.seniority, { line, employee: c.employee_number });
      if (c.base !== ctx.baseCode) problems.push({ file: "crew.csv", line, column: "base", message: `employee ${c.employee_number} is based at ${c.base}, but this period is for ${ctx.baseCode}` });
      const known = ctx.known.get(c.employee_number);
      if (known && known.baseCode !== ctx.baseCode) {
        problems.push({ file: "crew.csv", line, column: "base", message: `employee ${c.employee_number} is on the crew list of ${known.baseCode}; an import does not move crew between bases` });
      }
      crew.push({ line, employeeNumber: c.employee_number, name: c.name, seniority: c.seniority, position: c.position, qualifications: c.qualifications });
    }
    // A seniority number held in the database by someone this file does not renumber.
    const inFile = new Set(crew.map((c) => c.employeeNumber));
    const holders = new Map<number, string>();
    for (const [number, k] of ctx.known) if (!inFile.has(number)) holders.set(k.seniority, number);
    for (const c of crew) {
      const holder = holders.get(c.seniority);
      if (holder !== undefined) {
        problems.push({ file: "crew.csv", line: c.line, column: "seniority", message: `seniority ${c.seniority} belongs to employee ${holder}, who is not in this file` });
      }
    }
    out.crew = crew;
  }
  if (activitiesText !== undefined) {
    const table = readTable("activities.csv", activitiesText, ACTIVITY_COLUMNS, activityRow);
    problems.push(...table.problems);
    const inFile = new Set(out.crew?.map((c) => c.employeeNumber));
    // A crew member whose crew.csv row was refused is reported there, not again for each activity.
    const refused = new Set(refusedCrew);
    const activities = new Map<string, FixedActivity[]>();
    for (const { line, value: a } of table.rows) {
      if (refused.has(a.employee_number)) continue;
      const known = ctx.known.get(a.employee_number);
      if (!inFile.has(a.employee_number) && (!known || known.baseCode !== ctx.baseCode)) {
        problems.push({ file: "activities.csv", line, column: "employee_number", message: `employee ${a.employee_number} is neither in crew.csv nor on the crew list of ${ctx.baseCode}` });
        continue;
      }
      const parsed = fixedActivitySchema.safeParse({ kind: a.kind, start: a.start_utc, end: a.end_utc, ...(a.label ? { label: a.label } : {}) });
      if (!parsed.success) {
        for (const issue of parsed.error.issues) problems.push({ file: "activities.csv", line, column: issue.path[0] === "end" ? "end_utc" : issue.path[0] === "start" ? "start_utc" : undefined, message: issue.message });
        continue;
      }
      if (!overlaps(parsed.data.start, parsed.data.end, ctx.periodStart, ctx.periodEnd)) {
        problems.push({ file: "activities.csv", line, column: "start_utc", message: `the activity (${parsed.data.start} to ${parsed.data.end}) does not touch this period (${ctx.periodStart} to ${ctx.periodEnd})` });
        continue;
      }
      const list = activities.get(a.employee_number) ?? [];
      list.push(parsed.data);
      activities.set(a.employee_number, list);
    }
    out.activities = activities;
  }
  problems.sort((a, b) => a.file.localeCompare(b.file) || (a.line ?? 0) - (b.line ?? 0));
  if (problems.length > 0) {
    delete out.crew;
    delete out.activities;
  }
  return out;
}
