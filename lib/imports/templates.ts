/** The CSV templates a scheduler downloads: each file's header row, with the optional columns, in the order the generator writes. */
import { stringify } from "csv-stringify/sync";
import { ACTIVITY_COLUMNS, CREW_COLUMNS } from "./crew-files";
import { LEG_COLUMNS, TRIP_COLUMNS } from "./trip-files";

const header = (c: { required: readonly string[]; optional?: readonly string[] }) => stringify([[...c.required, ...(c.optional ?? [])]]);

export const TEMPLATES = {
  "trips.csv": header(TRIP_COLUMNS),
  "legs.csv": header(LEG_COLUMNS),
  "crew.csv": header(CREW_COLUMNS),
  "activities.csv": header(ACTIVITY_COLUMNS),
} as const;

/** What each file holds, for the import page. */
export const FILE_HELP: Record<keyof typeof TEMPLATES, string> = {
  "trips.csv": "One row per trip: its number, base, block, credit and time away in minutes, crew needed per position, required qualifications.",
  "legs.csv": "One row per leg, in order: trip, duty number with its report and release (UTC), leg number, flight, stations, departure and arrival (UTC), deadhead, block.",
  "crew.csv": "One row per crew member: employee number, name, seniority (1 = most senior), base, position, qualifications.",
  "activities.csv": "Leave, training and other fixed activities: employee number, kind, start and end (UTC), label.",
};
