/**
 * trips.csv and legs.csv (docs/csv-format.md) read into pairings: each row
 * checked on its own, then the legs grouped into duty periods and trips and
 * the whole trip checked with lib/domain's pairingSchema, every problem
 * reported at the line and column it comes from. Pure.
 */
import { z } from "zod";
import { localDate, pairingIdSchema, pairingSchema, positions, stationCodeSchema, type Pairing, type Position } from "../domain/index";
import { instantCell, listCell, minutesCell, wholeCell, yesNoCell } from "./cells";
import { readTable, type ImportProblem, type Row } from "./csv-table";

export const TRIP_COLUMNS = {
  required: ["trip", "base", "block_minutes", "credit_minutes", "away_minutes", "need_captain", "need_first_officer", "need_purser", "need_flight_attendant", "requires"],
} as const;

export const LEG_COLUMNS = {
  required: ["trip", "duty", "report_utc", "release_utc", "leg", "flight", "from", "to", "departs_utc", "arrives_utc", "deadhead", "block_minutes"],
  optional: ["equipment"],
} as const;

const tripRow = z.object({
  trip: pairingIdSchema,
  base: stationCodeSchema,
  block_minutes: minutesCell,
  credit_minutes: minutesCell,
  away_minutes: minutesCell,
  need_captain: wholeCell(0, "a number of crew"),
  need_first_officer: wholeCell(0, "a number of crew"),
  need_purser: wholeCell(0, "a number of crew"),
  need_flight_attendant: wholeCell(0, "a number of crew"),
  requires: listCell,
});
type TripRow = z.infer<typeof tripRow>;

const legRow = z.object({
  trip: pairingIdSchema,
  duty: wholeCell(1, "a duty number"),
  report_utc: instantCell,
  release_utc: instantCell,
  leg: wholeCell(1, "a leg number"),
  flight: z.string().min(1, "a leg needs a flight number").max(10, "a flight number has at most 10 characters"),
  from: stationCodeSchema,
  to: stationCodeSchema,
  departs_utc: instantCell,
  arrives_utc: instantCell,
  deadhead: yesNoCell,
  block_minutes: minutesCell,
  equipment: z.string().optional(),
});
type LegRow = z.infer<typeof legRow>;

/** What the files are checked against: the period's base and dates and the stations Bidwright knows. */
export interface TripFilesContext {
  baseCode: string;
  zone: string;
  startDate: string;
  endDate: string;
  stations: ReadonlySet<string>;
}

const LEG_FIELD: Record<string, string> = {
  flightNumber: "flight",
  from: "from",
  to: "to",
  departure: "departs_utc",
  arrival: "arrives_utc",
  deadhead: "deadhead",
  blockMinutes: "block_minutes",
  equipment: "equipment",
};
const DUTY_FIELD: Record<string, string> = { report: "report_utc", release: "release_utc" };
const TRIP_FIELD: Record<string, string> = {
  id: "trip",
  base: "base",
  blockMinutes: "block_minutes",
  creditMinutes: "credit_minutes",
  tafbMinutes: "away_minutes",
  requires: "requires",
};

interface Placed {
  pairing: Pairing;
  tripLine: number;
  /** legs.csv lines per duty period, per leg */
  legLines: number[][];
}

/** Reads trips.csv and legs.csv; `pairings` is empty whenever `problems` is not. */
export function readTripFiles(tripsText: string, legsText: string, ctx: TripFilesContext): { pairings: Pairing[]; problems: ImportProblem[] } {
  const trips = readTable("trips.csv", tripsText, TRIP_COLUMNS, tripRow);
  const legs = readTable("legs.csv", legsText, LEG_COLUMNS, legRow);
  const problems = [...trips.problems, ...legs.problems];
  // A file that could not be read as a table (too big, no header, bad columns) is reported alone.
  if (trips.unread || legs.unread) return { pairings: [], problems };
  if (trips.rows.length === 0 && trips.rejected.length === 0) {
    // The files say what the period holds: an empty trips.csv (a template, say) would remove every trip.
    problems.push({ file: "trips.csv", message: "the file holds no trips, only its header: a period's trips come from it, so importing it would remove them all" });
    return { pairings: [], problems };
  }
  const byTrip = tripsById(trips.rows, ctx, problems);
  // A trip whose own row was refused is reported there; its legs are not reported again as belonging to no trip.
  const refusedTrips = new Set(trips.rejected.map((r) => r.value.trip));
  const legsOf = legsByTrip(
    legs.rows.filter((r) => !refusedTrips.has(r.value.trip)),
    byTrip,
    ctx,
    problems,
  );
  // A trip with a rejected row is reported by that row alone: putting it together without the row would only add noise.
  const incomplete = new Set([...trips.rejected, ...legs.rejected, ...legsOf.rejected].map((r) => r.value.trip));
  const placed: Placed[] = [];
  for (const [id, trip] of byTrip) {
    if (incomplete.has(id)) continue;
    const rows = legsOf.get(id);
    if (!rows || rows.length === 0) {
      problems.push({ file: "trips.csv", line: trip.line, column: "trip", message: `trip ${id} has no legs in legs.csv` });
      continue;
    }
    const built = buildPairing(trip, rows, problems);
    if (built) placed.push(built);
  }
  for (const p of placed) checkPairing(p, ctx, problems);
  problems.sort((a, b) => a.file.localeCompare(b.file) || (a.line ?? 0) - (b.line ?? 0));
  return { pairings: problems.length > 0 ? [] : placed.map((p) => p.pairing), problems };
}

function tripsById(rows: Row<TripRow>[], ctx: TripFilesContext, problems: ImportProblem[]): Map<string, Row<TripRow>> {
  const byId = new Map<string, Row<TripRow>>();
  for (const row of rows) {
    const first = byId.get(row.value.trip);
    if (first) {
      problems.push({ file: "trips.csv", line: row.line, column: "trip", message: `trip ${row.value.trip} appears twice (first on line ${first.line}); a trip number is unique in the period` });
      continue;
    }
    byId.set(row.value.trip, row);
    if (row.value.base !== ctx.baseCode) {
      problems.push({ file: "trips.csv", line: row.line, column: "base", message: `trip ${row.value.trip} is based at ${row.value.base}, but this period is for ${ctx.baseCode}` });
    }
    if (positions.every((p) => row.value[`need_${p}`] === 0)) {
      problems.push({ file: "trips.csv", line: row.line, column: "need_captain", message: `trip ${row.value.trip} needs no crew in any position` });
    }
  }
  return byId;
}

function legsByTrip(
  rows: Row<LegRow>[],
  trips: Map<string, Row<TripRow>>,
  ctx: TripFilesContext,
  problems: ImportProblem[],
): Map<string, Row<LegRow>[]> & { rejected: Array<Row<{ trip: string }>> } {
  const byTrip = Object.assign(new Map<string, Row<LegRow>[]>(), { rejected: [] as Array<Row<{ trip: string }>> });
  for (const row of rows) {
    const leg = row.value;
    let ok = true;
    if (!trips.has(leg.trip)) {
      problems.push({ file: "legs.csv", line: row.line, column: "trip", message: `trip ${leg.trip} is not in trips.csv` });
      ok = false;
    }
    for (const column of ["from", "to"] as const) {
      if (!ctx.stations.has(leg[column])) {
        problems.push({ file: "legs.csv", line: row.line, column, message: `Bidwright does not know station ${leg[column]}, so it has no time zone for it: check the code (new stations come with a JSON import of a period that uses them)` });
        ok = false;
      }
    }
    if (!ok) {
      byTrip.rejected.push(row);
      continue;
    }
    const list = byTrip.get(leg.trip) ?? [];
    list.push(row);
    byTrip.set(leg.trip, list);
  }
  return byTrip;
}

function buildPairing(trip: Row<TripRow>, rows: Row<LegRow>[], problems: ImportProblem[]): Placed | undefined {
  const duties = new Map<number, Row<LegRow>[]>();
  for (const row of rows) {
    const list = duties.get(row.value.duty) ?? [];
    list.push(row);
    duties.set(row.value.duty, list);
  }
  const before = problems.length;
  const numbers = [...duties.keys()].sort((a, b) => a - b);
  numbers.forEach((n, k) => {
    if (n !== k + 1) {
      const row = duties.get(n)![0]!;
      problems.push({ file: "legs.csv", line: row.line, column: "duty", message: `trip ${trip.value.trip} has duty ${n} but no duty ${k + 1}: number its duties 1, 2, 3 …` });
    }
  });
  const dutyPeriods: Pairing["dutyPeriods"] = [];
  const legLines: number[][] = [];
  for (const n of numbers) {
    const legs = duties.get(n)!;
    const seen = new Map<number, number>();
    for (const row of legs) {
      const first = seen.get(row.value.leg);
      if (first !== undefined) problems.push({ file: "legs.csv", line: row.line, column: "leg", message: `trip ${trip.value.trip} duty ${n} has leg ${row.value.leg} twice (first on line ${first})` });
      else seen.set(row.value.leg, row.line);
    }
    const ordered = [...legs].sort((a, b) => a.value.leg - b.value.leg);
    ordered.forEach((row, k) => {
      if (row.value.leg !== k + 1 && seen.get(row.value.leg) === row.line) {
        problems.push({ file: "legs.csv", line: row.line, column: "leg", message: `trip ${trip.value.trip} duty ${n} has leg ${row.value.leg} but no leg ${k + 1}` });
      }
    });
    const head = ordered[0]!;
    for (const row of ordered.slice(1)) {
      for (const column of ["report_utc", "release_utc"] as const) {
        if (row.value[column] !== head.value[column]) {
          problems.push({ file: "legs.csv", line: row.line, column, message: `differs from line ${head.line}: every leg of a duty period repeats its report and release` });
        }
      }
    }
    dutyPeriods.push({
      report: head.value.report_utc,
      release: head.value.release_utc,
      legs: ordered.map(({ value: l }) => ({
        flightNumber: l.flight,
        from: l.from,
        to: l.to,
        departure: l.departs_utc,
        arrival: l.arrives_utc,
        deadhead: l.deadhead,
        blockMinutes: l.block_minutes,
        ...(l.equipment ? { equipment: l.equipment } : {}),
      })),
    });
    legLines.push(ordered.map((r) => r.line));
  }
  if (problems.length > before) return undefined;
  const t = trip.value;
  const crewNeeded: Partial<Record<Position, number>> = {};
  for (const p of positions) if (t[`need_${p}`] > 0) crewNeeded[p] = t[`need_${p}`];
  const pairing = {
    id: t.trip,
    base: t.base,
    dutyPeriods,
    blockMinutes: t.block_minutes,
    creditMinutes: t.credit_minutes,
    tafbMinutes: t.away_minutes,
    crewNeeded,
    requires: t.requires,
  };
  return { pairing: pairing as Pairing, tripLine: trip.line, legLines };
}

/** pairingSchema's checks (legs in sequence, duties in order, back at base), each at its line and column. */
function checkPairing(placed: Placed, ctx: TripFilesContext, problems: ImportProblem[]): void {
  const parsed = pairingSchema.safeParse(placed.pairing);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) problems.push(placeIssue(issue.path, issue.message, placed));
    return;
  }
  placed.pairing = parsed.data;
  const first = parsed.data.dutyPeriods[0]!;
  const day = localDate(first.report, ctx.zone);
  if (day < ctx.startDate || day > ctx.endDate) {
    problems.push({
      file: "legs.csv",
      line: placed.legLines[0]![0],
      column: "report_utc",
      message: `trip ${parsed.data.id} reports on ${day} (${ctx.zone}), outside the period ${ctx.startDate} to ${ctx.endDate}`,
    });
  }
}

function placeIssue(path: readonly PropertyKey[], message: string, placed: Placed): ImportProblem {
  const [top, d, sub, l, field] = path;
  if (top === "dutyPeriods" && typeof d === "number") {
    const lines = placed.legLines[d] ?? placed.legLines[0]!;
    if (sub === "legs" && typeof l === "number") return { file: "legs.csv", line: lines[l] ?? lines[0], column: LEG_FIELD[String(field)], message };
    if (sub === "legs") return { file: "legs.csv", line: lines.at(-1), message };
    return { file: "legs.csv", line: lines[0], column: DUTY_FIELD[String(sub)], message };
  }
  if (top === "crewNeeded") return { file: "trips.csv", line: placed.tripLine, column: `need_${String(d)}`, message };
  return { file: "trips.csv", line: placed.tripLine, column: TRIP_FIELD[String(top)], message };
}
