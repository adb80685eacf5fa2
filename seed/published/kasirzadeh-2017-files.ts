/**
 * Reads the text of the published data set's three kinds of file
 * (listOfBases.csv, day_N.csv, initialSolution.in; see README.md beside this
 * file) into plain records that remember the file and line they came from, so
 * that every later complaint can say where the bad input is.
 */
import { AppError } from "../../lib/domain/index.ts";
import { canonicalInstant, instantMs } from "../../lib/domain/time.ts";

/** Where a record was read: the file's name and the 1-based line number. */
export interface SourceLine {
  file: string;
  line: number;
}

/** One row of listOfBases.csv. */
export interface RawAirport {
  name: string;
  isBase: boolean;
  pilots: number;
  at: SourceLine;
}

/** One row of a day_N.csv file; instants are UTC (the data's one clock read as UTC). */
export interface RawLeg {
  id: string;
  from: string;
  to: string;
  departure: string;
  arrival: string;
  at: SourceLine;
}

/** One "Pairing i : Base B : …;" line of initialSolution.in, its legs in the published order. */
export interface RawPairing {
  number: number;
  base: string;
  legs: Array<{ id: string; deadhead: boolean }>;
  at: SourceLine;
}

/** The prefix the data set puts before a leg id that is ridden as a deadhead. */
export const DEADHEAD_PREFIX = "TDH_";

/** An error about the input, saying the file and line; `details` carries both for callers. */
export function inputError(at: SourceLine, message: string): AppError {
  return new AppError("invalid", `${at.file} line ${at.line}: ${message}`, { file: at.file, line: at.line });
}

const NAME = /^[A-Za-z0-9_]+$/;

/** The non-blank lines of a text with their 1-based numbers; CRLF and a trailing newline are fine. */
function numberedLines(text: string): Array<{ text: string; line: number }> {
  return text
    .split(/\r?\n/)
    .map((raw, k) => ({ text: raw.trim(), line: k + 1 }))
    .filter((row) => row.text !== "");
}

function fields(text: string, count: number, at: SourceLine, what: string): string[] {
  const cells = text.split(",").map((cell) => cell.trim());
  if (cells.length !== count) {
    throw inputError(at, `expected ${count} comma-separated fields (${what}), found ${cells.length}: "${text}"`);
  }
  cells.forEach((cell, k) => {
    if (cell === "") throw inputError(at, `field ${k + 1} is empty (${what}): "${text}"`);
  });
  return cells;
}

function airportName(name: string, at: SourceLine): string {
  if (!NAME.test(name)) throw inputError(at, `"${name}" is not an airport name (letters, digits and "_")`);
  return name;
}

/** Parses listOfBases.csv: a header row, then `airport, status (1 = crew base), number of pilots`. */
export function parseListOfBases(text: string, file = "listOfBases.csv"): RawAirport[] {
  const [header, ...rows] = numberedLines(text);
  if (!header) throw inputError({ file, line: 1 }, "the file is empty; expected the header airport, status, nbEmployees");
  const names = header.text.split(",").map((cell) => cell.trim().toLowerCase());
  if (names.join(",") !== "airport,status,nbemployees") {
    throw inputError({ file, line: header.line }, `expected the header "airport , status , nbEmployees", found "${header.text}"`);
  }
  const seen = new Map<string, number>();
  return rows.map((row) => {
    const at = { file, line: row.line };
    const [name, status, pilots] = fields(row.text, 3, at, "airport, status, nbEmployees") as [string, string, string];
    airportName(name, at);
    if (status !== "0" && status !== "1") throw inputError(at, `status of ${name} is "${status}"; expected 0 or 1`);
    if (!/^\d+$/.test(pilots)) throw inputError(at, `number of pilots of ${name} is "${pilots}"; expected a whole number`);
    const first = seen.get(name);
    if (first !== undefined) throw inputError(at, `airport ${name} is listed again (first on line ${first})`);
    seen.set(name, row.line);
    return { name, isBase: status === "1", pilots: Number(pilots), at };
  });
}

function instantOf(date: string, time: string, at: SourceLine, what: string): string {
  const text = `${date}T${time}`;
  const ms = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/.test(text) ? Date.parse(`${text}:00Z`) : Number.NaN;
  // Date.parse rolls 2000-02-30 over to March; reading it back catches that.
  if (Number.isNaN(ms) || new Date(ms).toISOString().slice(0, 16) !== text) {
    throw inputError(at, `${what} "${date} ${time}" is not a date YYYY-MM-DD and a time HH:MM`);
  }
  return canonicalInstant(`${text}:00Z`);
}

/**
 * Parses one day_N.csv file: lines starting with "#" are comments (the header),
 * each other line is `leg id, from, date, time, to, date, time`. `airports` are
 * the names listOfBases.csv knows; a leg between others is refused.
 */
export function parseDayFile(text: string, file: string, airports: ReadonlySet<string>): RawLeg[] {
  return numberedLines(text)
    .filter((row) => !row.text.startsWith("#"))
    .map((row) => {
      const at = { file, line: row.line };
      const what = "leg id, departure airport, date, time, arrival airport, date, time";
      const [id, from, depDate, depTime, to, arrDate, arrTime] = fields(row.text, 7, at, what) as [
        string, string, string, string, string, string, string,
      ];
      if (!NAME.test(id) || id.startsWith(DEADHEAD_PREFIX)) {
        throw inputError(at, `"${id}" is not a leg id (letters, digits and "_", not starting ${DEADHEAD_PREFIX})`);
      }
      for (const airport of [from, to]) {
        if (!airports.has(airportName(airport, at))) throw inputError(at, `leg ${id} uses airport ${airport}, which listOfBases.csv does not list`);
      }
      const departure = instantOf(depDate, depTime, at, `departure of leg ${id}`);
      const arrival = instantOf(arrDate, arrTime, at, `arrival of leg ${id}`);
      if (instantMs(arrival) <= instantMs(departure)) {
        throw inputError(at, `leg ${id} arrives ${arrDate} ${arrTime}, not after it departs ${depDate} ${depTime}`);
      }
      return { id, from, to, departure, arrival, at };
    });
}

const PAIRING = /^Pairing\s+(\d+)\s*:\s*Base\s+(\S+)\s*:\s*(.*);$/;

/**
 * Parses initialSolution.in: `Solution = {`, then one `Pairing i : Base B :
 * LEG_…, TDH_LEG_…;` line per pairing, then `};`. Leg ids are checked against
 * the day files later, where the legs are known.
 */
export function parseSolution(text: string, file = "initialSolution.in"): RawPairing[] {
  const seen = new Map<number, number>();
  const pairings: RawPairing[] = [];
  for (const row of numberedLines(text)) {
    const at = { file, line: row.line };
    if (/^Solution\s*=\s*\{$/.test(row.text) || /^\};?$/.test(row.text)) continue;
    const match = PAIRING.exec(row.text);
    if (!match) throw inputError(at, `expected "Pairing <n> : Base <airport> : <leg>, <leg>, …;", found "${row.text}"`);
    const [, digits, base, list] = match as unknown as [string, string, string, string];
    const number = Number(digits);
    const first = seen.get(number);
    if (first !== undefined) throw inputError(at, `pairing ${number} appears again (first on line ${first})`);
    seen.set(number, row.line);
    const legs = list.split(",").map((cell, k) => {
      const name = cell.trim();
      if (name === "") throw inputError(at, `pairing ${number}: leg ${k + 1} of the list is empty`);
      const deadhead = name.startsWith(DEADHEAD_PREFIX);
      const id = deadhead ? name.slice(DEADHEAD_PREFIX.length) : name;
      if (!NAME.test(id)) throw inputError(at, `pairing ${number}: "${name}" is not a leg id`);
      return { id, deadhead };
    });
    pairings.push({ number, base: airportName(base, at), legs, at });
  }
  return pairings;
}
