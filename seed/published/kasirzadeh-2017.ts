/**
 * The published airline network as an instance source: converts the layout of
 * the data set of A. Kasirzadeh, M. Saddoune, F. Soumis, "Airline crew
 * scheduling: models, algorithms, and data sets", EURO Journal on
 * Transportation and Logistics 6 (2017) 111–137 (listOfBases.csv, day_N.csv,
 * initialSolution.in) into our instances, one per base, captains only. The
 * assumptions the files leave open are listed in README.md beside this file.
 *
 * `convertKasirzadeh` is pure (file texts in, instances out); `loadKasirzadeh`
 * is the thin loader that reads a folder first.
 */
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import {
  AppError,
  awardSettingsSchema,
  instanceSchema,
  schemaVersion,
  type BidPeriod,
  type Bundle,
  type CrewMember,
  type Instance,
  type Pairing,
} from "../../lib/domain/index.ts";
import { localDate, monthLabel } from "../../lib/domain/time.ts";
import { rng } from "../random.ts";
import { seededBids, type MakeBids } from "./kasirzadeh-2017-bids.ts";
import { inputError, parseDayFile, parseListOfBases, parseSolution, type RawLeg } from "./kasirzadeh-2017-files.ts";
import { convertPairing } from "./kasirzadeh-2017-pairings.ts";
import { MONTHLY_CREDIT_MAX_MIN, kasirzadehRuleSet } from "./kasirzadeh-2017-rule-set.ts";
import { DATA_SET_ZONE, stationFor } from "./kasirzadeh-2017-stations.ts";

export type { BidInput, MakeBids } from "./kasirzadeh-2017-bids.ts";
export { seededBids } from "./kasirzadeh-2017-bids.ts";
export { inputError, type SourceLine } from "./kasirzadeh-2017-files.ts";
export * from "./kasirzadeh-2017-pairings.ts";
export * from "./kasirzadeh-2017-rule-set.ts";
export { DATA_SET_ZONE, stationCodeFor } from "./kasirzadeh-2017-stations.ts";

/** The texts of one instance folder of the data set. */
export interface KasirzadehFiles {
  listOfBases: string;
  /** File name ("day_1.csv" …) → text. */
  days: Record<string, string>;
  initialSolution: string;
}

/** How to convert. */
export interface KasirzadehOptions {
  /** Seeds the synthetic bids; the same seed gives byte-identical output. */
  seed: number;
  /** Replaces the default seeded bids ({@link seededBids}); return `{}` for no bids. */
  makeBids?: MakeBids;
  /** Names the source in period ids, such as "instance1"; the loader uses the folder's name. */
  label?: string;
}

/**
 * The converted data set. `bases` are our station codes of the crew bases in
 * listOfBases.csv order; `instances[k]` and `bundles[k]` belong to `bases[k]`.
 * A bid period covers one base, so each base is its own bundle of one
 * instance (captains; the data set has pilots of one kind).
 */
export interface KasirzadehData {
  bases: string[];
  instances: Instance[];
  bundles: Bundle[];
}

const DAY_FILE = /^day_(\d+)\.csv$/;

/** FNV-1a of the seed and the base's code, so each base draws its own stream of the same seed. */
function baseSeed(seed: number, code: string): number {
  let hash = 0x811c9dc5;
  for (const char of `${seed}:${code}`) hash = Math.imul(hash ^ char.charCodeAt(0), 0x01000193) >>> 0;
  return hash;
}

function readLegs(days: Record<string, string>, airports: ReadonlySet<string>): Map<string, RawLeg> {
  const names = Object.keys(days).sort((a, b) => Number(DAY_FILE.exec(a)?.[1]) - Number(DAY_FILE.exec(b)?.[1]));
  if (names.length === 0) throw new AppError("invalid", "the data set has no day_N.csv file");
  const legs = new Map<string, RawLeg>();
  for (const name of names) {
    if (!DAY_FILE.test(name)) throw new AppError("invalid", `"${name}" is not a day file name such as day_1.csv`);
    for (const leg of parseDayFile(days[name] ?? "", name, airports)) {
      const first = legs.get(leg.id);
      if (first) throw inputError(leg.at, `leg ${leg.id} is listed again (first in ${first.at.file} line ${first.at.line})`);
      legs.set(leg.id, leg);
    }
  }
  return legs;
}

/**
 * The period all bases share, from the data: its first date is the earliest of
 * the legs' departure dates and the pairings' first report dates, its last the
 * latest departure date (a trip belongs to the period it starts in, so legs
 * arriving on the next day need no extra date). For both published instances
 * this is 2000-01-01..2000-01-31.
 */
function periodDates(legs: Iterable<RawLeg>, pairings: readonly Pairing[]): { startDate: string; endDate: string } {
  const dates = [...legs].map((leg) => localDate(leg.departure, DATA_SET_ZONE));
  const reports = pairings.map((p) => localDate(p.dutyPeriods[0]!.report, DATA_SET_ZONE));
  const sorted = [...dates, ...reports].sort();
  return { startDate: sorted[0]!, endDate: dates.sort().at(-1)! };
}

function periodName(startDate: string, endDate: string, baseName: string): string {
  const oneMonth = endDate.slice(0, 7) === startDate.slice(0, 7);
  return `${oneMonth ? monthLabel(startDate) : `${startDate} to ${endDate}`}, ${baseName}`;
}

function crewOf(code: string, baseName: string, pilots: number): CrewMember[] {
  return Array.from({ length: pilots }, (_, k) => ({
    id: `${code}${String(k + 1).padStart(3, "0")}`,
    name: `${baseName} pilot ${k + 1}`,
    seniority: k + 1,
    base: code,
    position: "captain" as const,
    qualifications: [],
    fixedActivities: [],
    carryIn: [],
    lookBack: { duties: [], dailyFlightMinutes: [] },
    carriedWeight: 1,
  }));
}

function checked(instance: Instance): Instance {
  const result = instanceSchema.safeParse(instance);
  if (!result.success) {
    const issues = result.error.issues.slice(0, 5).map((issue) => `${issue.path.join(".")}: ${issue.message}`);
    throw new AppError("invalid", `the converted instance of base ${instance.group.base} does not parse: ${issues.join("; ")}`);
  }
  return instance;
}

/**
 * Converts one instance folder's texts into one instance per crew base (status
 * 1 in listOfBases.csv), in listOfBases.csv order. Throws an AppError
 * ("invalid") naming the file and line of bad input: a malformed row, an
 * airport listOfBases.csv does not know, a leg listed twice, a pairing naming
 * an unknown leg or a base that is not one, legs that do not join up.
 */
export function convertKasirzadeh(files: KasirzadehFiles, options: KasirzadehOptions): KasirzadehData {
  if (!Number.isSafeInteger(options.seed)) throw new AppError("invalid", `seed ${options.seed} is not a whole number`);
  const airports = parseListOfBases(files.listOfBases);
  const stationOf = new Map(airports.map((airport) => [airport.name, stationFor(airport.name, airport.at)]));
  const codeOf = (name: string) => stationOf.get(name)!.code;
  const legs = readLegs(files.days, new Set(stationOf.keys()));
  const bases = airports.filter((airport) => airport.isBase);
  const rawPairings = parseSolution(files.initialSolution).sort((a, b) => a.number - b.number);
  const pairings = rawPairings.map((raw) => {
    if (!bases.some((base) => base.name === raw.base)) {
      throw inputError(raw.at, `pairing ${raw.number} has base ${raw.base}, which listOfBases.csv does not mark as a crew base (status 1)`);
    }
    return convertPairing(raw, legs, codeOf);
  });
  const { startDate, endDate } = periodDates(legs.values(), pairings);
  const makeBids = options.makeBids ?? seededBids;
  const label = options.label ?? "published";
  const settings = awardSettingsSchema.parse({});

  const instances = bases.map((base): Instance => {
    const code = codeOf(base.name);
    const own = pairings.filter((p) => p.base === code);
    const touched = new Set([code, ...own.flatMap((p) => p.dutyPeriods.flatMap((d) => d.legs.flatMap((l) => [l.from, l.to])))]);
    const stations = [...stationOf.values()].filter((s) => touched.has(s.code)).sort((a, b) => a.code.localeCompare(b.code));
    const period: BidPeriod = {
      id: `kasirzadeh-2017-${label}-${code}`,
      name: periodName(startDate, endDate, base.name),
      startDate,
      endDate,
      zone: DATA_SET_ZONE,
    };
    const crew = crewOf(code, base.name, base.pilots);
    const bids = makeBids({ base: code, period, crew, pairings: own, creditMaxMinutes: MONTHLY_CREDIT_MAX_MIN, rng: rng(baseSeed(options.seed, code)) });
    return checked({
      schemaVersion,
      period,
      group: { base: code, position: "captain" },
      stations,
      pairings: own,
      crew,
      bids,
      ruleSet: kasirzadehRuleSet(),
      settings: structuredClone(settings),
    });
  });
  return {
    bases: instances.map((instance) => instance.group.base),
    instances,
    bundles: instances.map((instance) => ({ schemaVersion, period: instance.period, instances: [instance] })),
  };
}

/** Reads one instance folder of the data set (listOfBases.csv, every day_N.csv, initialSolution.in). */
export function readKasirzadehFolder(dir: string): KasirzadehFiles {
  const read = (name: string) => {
    try {
      return readFileSync(path.join(dir, name), "utf8");
    } catch (error) {
      throw new AppError("invalid", `cannot read ${name} in ${dir}: ${(error as Error).message}`);
    }
  };
  const dayNames = readdirSync(dir).filter((name) => DAY_FILE.test(name));
  return {
    listOfBases: read("listOfBases.csv"),
    days: Object.fromEntries(dayNames.map((name) => [name, read(name)])),
    initialSolution: read("initialSolution.in"),
  };
}

/** Reads and converts one instance folder; the folder's name labels the periods unless `options.label` says otherwise. */
export function loadKasirzadeh(dir: string, options: KasirzadehOptions): KasirzadehData {
  return convertKasirzadeh(readKasirzadehFolder(dir), { label: path.basename(path.resolve(dir)), ...options });
}
