/** Small helpers the rule implementations share. */
import { z } from "zod";
import { minuteOfLocalDay } from "../../domain/time.ts";
import { describeSource, type Duty } from "../duty.ts";

export const MINUTE = 60_000;
export const HOUR = 60 * MINUTE;

/** The optional citation a rule's sentence ends with, e.g. "14 CFR 117.25(e)". */
export const reference = z.string().optional();
export const cite = (ref: string | undefined) => (ref ? ` (${ref})` : "");

/** The trip numbers behind some duties, each once. */
export function itemsOf(...duties: (Duty | undefined)[]): string[] {
  return [...new Set(duties.flatMap((d) => (d ? [d.source.id] : [])))];
}

export const name = (d: Duty) => describeSource(d.source);

/** Minutes of `d` inside [from, to] (epoch ms). */
export function overlapMinutes(d: Duty, from: number, to: number): number {
  return Math.max(0, Math.min(d.release, to) - Math.max(d.report, from)) / MINUTE;
}

/** The longest free stretch inside [from, to] between the given duties (time order), in minutes. */
export function longestFree(duties: readonly Duty[], from: number, to: number): number {
  let best = 0;
  let cursor = from;
  for (const d of duties) {
    if (d.release <= from) continue;
    if (d.report >= to) break;
    best = Math.max(best, d.report - cursor);
    cursor = Math.max(cursor, d.release);
  }
  return Math.max(best, to - cursor) / MINUTE;
}

/** Minutes after local midnight of an instant (epoch ms) in `zone`. */
export function minuteOfDay(ms: number, zone: string): number {
  return minuteOfLocalDay(ms, zone);
}
