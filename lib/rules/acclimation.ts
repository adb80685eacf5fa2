/**
 * Acclimation per 14 CFR 117.3: a theater is a region within 60° of
 * longitude; a crew member is acclimated to a new theater after 72 hours in it,
 * or after 36 consecutive hours free from duty in it. Until then, limits read
 * the clock of the theater where they were last acclimated (117.13(b)). A line
 * starts acclimated to the base's theater, where its crew live.
 */
import type { Duty } from "./duty.ts";
import type { RuleEnv } from "./rule.ts";

const HOUR = 3_600_000;

export interface Acclimation {
  acclimated: boolean;
  /** the zone whose clock the duty tables read */
  zone: string;
}

const sameTheater = (a: number, b: number) => Math.abs(a - b) <= 60;

/** Answers already given for a duties array (the rules of one engine step ask about the same array). */
const known = new WeakMap<readonly Duty[], Map<number, Acclimation>>();

/** Acclimation at the report of duties[k], walking the duties from the first. */
export function acclimationAt(duties: readonly Duty[], k: number, env: RuleEnv): Acclimation {
  let answers = known.get(duties);
  if (!answers) known.set(duties, (answers = new Map()));
  let found = answers.get(k);
  if (!found) answers.set(k, (found = walk(duties, k, env)));
  return found;
}

function walk(duties: readonly Duty[], k: number, env: RuleEnv): Acclimation {
  const station = (code: string | undefined) => (code ? env.stations.get(code) : undefined);
  const lonOf = (code: string) => station(code)?.longitude ?? station(env.crew.base)?.longitude ?? 0;
  let acclimatedLon = lonOf(env.crew.base);
  let acclimatedZone = env.zone;
  let here = env.crew.base;
  // A stay away from the acclimated theater: where it began, when, and its longest free stretch.
  let stayLon: number | undefined;
  let arrivedAt = Infinity;
  let longestFree = 0;
  for (let i = 0; ; i++) {
    const d = duties[i]!;
    const prev = duties[i - 1];
    if (prev && stayLon !== undefined) longestFree = Math.max(longestFree, d.report - prev.release);
    if (stayLon !== undefined && (d.report - arrivedAt >= 72 * HOUR || longestFree >= 36 * HOUR)) {
      acclimatedLon = lonOf(here);
      acclimatedZone = station(here)?.zone ?? env.zone;
      stayLon = undefined;
    }
    if (i === k) {
      const acclimated = stayLon === undefined;
      return { acclimated, zone: acclimated ? (station(d.from ?? here)?.zone ?? env.zone) : acclimatedZone };
    }
    const next = d.to ?? here;
    const l = lonOf(next);
    if (sameTheater(l, acclimatedLon)) stayLon = undefined; // back in the theater the crew is acclimated to
    else if (stayLon === undefined || !sameTheater(l, stayLon)) {
      // A new stay: measured from where it began, so short hops add up to a theater change.
      stayLon = l;
      arrivedAt = d.release;
      longestFree = 0;
    }
    here = next;
  }
}
