/**
 * What a rule is to the engine. A rule-set document names rules by id with
 * parameters; the registry (registry.ts) maps each id to an implementation
 * that checks a new duty against what came before it, or the finished line.
 */
import type { z } from "zod";
import type { CrewMember, Pairing, Station } from "../domain/index.ts";
import type { Duty } from "./duty.ts";

/** One broken limit, in numbers and in a sentence a crew member understands. */
export interface Violation {
  ruleId: string;
  /** what was measured and the limit it broke, in `unit` */
  measured: number;
  limit: number;
  unit: "minutes" | "days" | "count";
  /** trip numbers (or activity kinds) involved */
  items: string[];
  text: string;
}

export interface RuleEnv {
  crew: CrewMember;
  /** the base's IANA zone: calendar days and base-local times */
  zone: string;
  stations: ReadonlyMap<string, Station>;
  /** first and last date of the bid period, base local */
  periodStart: string;
  periodEnd: string;
}

/** A duty just added, with everything before it (history included), oldest first. */
export interface DutyCheck<P> {
  env: RuleEnv;
  params: P;
  /** all duties so far, time order; the new one is last */
  duties: readonly Duty[];
  /** flight minutes per base-local date before the period (14 CFR 117.23(b)) */
  dailyFlight: ReadonlyMap<string, number>;
}

/** The finished line. */
export interface LineCheck<P> {
  env: RuleEnv;
  params: P;
  /** the line's own duties (history excluded) */
  duties: readonly Duty[];
  /** history and the line, time order (for runs that start before the period) */
  allDuties: readonly Duty[];
  pairings: readonly Pairing[];
  /** true for a reserve line */
  reserve: boolean;
}

export interface RuleImpl<P = unknown> {
  id: string;
  params: z.ZodType<P>;
  /**
   * Reads only the new duty and the one before it, so `canFollow` may ask it
   * about two trips alone.
   */
  pairwise?: boolean;
  onDuty?(check: DutyCheck<P>): Violation[];
  onLine?(check: LineCheck<P>): Violation[];
}

/** "9 h 10 min", "10 h", "45 min". */
export function hm(minutes: number): string {
  const m = Math.round(minutes);
  const h = Math.floor(m / 60);
  const r = m % 60;
  if (h === 0) return `${r} min`;
  return r === 0 ? `${h} h` : `${h} h ${r} min`;
}
