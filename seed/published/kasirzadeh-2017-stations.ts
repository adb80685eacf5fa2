/**
 * Station codes for the data set's anonymised airports. Its names (BASE1,
 * AIR17) do not fit our code format (three or four capital letters), so each is
 * given a three-letter code and keeps its own name as the station's name:
 * BASE<n> → "B" + two letters, AIR<n> → "A" + two letters, the two letters
 * counting n − 1 in base 26 (AA = 0, AB = 1, …, AZ = 25, BA = 26). So BASE1 =
 * BAA, BASE2 = BAB, BASE3 = BAC, AIR1 = AAA, AIR26 = AAZ, AIR27 = ABA. The
 * prefixes differ, so no two airports share a code.
 */
import type { Station } from "../../lib/domain/index.ts";
import { inputError, type SourceLine } from "./kasirzadeh-2017-files.ts";

const NAMED = /^(BASE|AIR)(\d+)$/;
const LETTERS = "ABCDEFGHIJKLMNOPQRSTUVWXYZ";
/** Two letters count 0..675, so n runs 1..676. */
const MAX_NUMBER = LETTERS.length * LETTERS.length;

/** The zone every station gets: the data set has one clock for all airports, read here as UTC. */
export const DATA_SET_ZONE = "UTC";

/** Our code for an airport name of the data set, or an error saying where the name was read. */
export function stationCodeFor(name: string, at: SourceLine): string {
  const match = NAMED.exec(name);
  const n = match ? Number(match[2]) : Number.NaN;
  if (!match || !Number.isInteger(n) || n < 1 || n > MAX_NUMBER) {
    throw inputError(at, `airport "${name}" is not BASE<n> or AIR<n> with n from 1 to ${MAX_NUMBER}, so it has no station code`);
  }
  const k = n - 1;
  const letters = `${LETTERS[Math.floor(k / LETTERS.length)]}${LETTERS[k % LETTERS.length]}`;
  return `${match[1] === "BASE" ? "B" : "A"}${letters}`;
}

/**
 * A station of the data set: our code, the original name, zone UTC and
 * longitude 0 — the data carry no places, so acclimation rules see no time-zone
 * crossings, which matches the one clock the data use.
 */
export function stationFor(name: string, at: SourceLine): Station {
  return { code: stationCodeFor(name, at), name, zone: DATA_SET_ZONE, longitude: 0 };
}
