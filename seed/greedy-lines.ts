/**
 * A greedy line filler for tests: in seniority order, each crew member takes
 * trips in time order while the line stays within three simple limits — no
 * overlap (with other trips, fixed activities or carry-in), a minimum rest
 * between trips (and around carry-in, training and office duty), and a credit
 * maximum. It builds plausible lines for tests of
 * later parts (scoring, explanations, calendars); it is not an award method
 * and knows nothing of wishes or the legality engine.
 */
import type { Instance, Pairing } from "../lib/domain/index.ts";
import { instantMs } from "../lib/domain/time.ts";

export interface GreedyLimits {
  /** rest from one trip's release to the next trip's report; default 10 h */
  minRestMinutes?: number;
  /** default 85 h */
  maxCreditMinutes?: number;
}

export interface GreedyLines {
  /** crew id → pairing ids, in time order */
  lines: Record<string, string[]>;
  /** pairing id → positions still open in this group */
  open: Record<string, number>;
}

interface Span {
  start: number;
  end: number;
}

const span = (p: Pick<Pairing, "dutyPeriods">): Span => ({
  start: instantMs(p.dutyPeriods[0]!.report),
  end: instantMs(p.dutyPeriods[p.dutyPeriods.length - 1]!.release),
});

export function greedyLines(instance: Instance, limits: GreedyLimits = {}): GreedyLines {
  const rest = (limits.minRestMinutes ?? 600) * 60_000;
  const maxCredit = limits.maxCreditMinutes ?? 85 * 60;
  const position = instance.group.position;
  const need = new Map(instance.pairings.map((p) => [p.id, p.crewNeeded[position] ?? 0]));
  const trips = [...instance.pairings].sort((a, b) => span(a).start - span(b).start || a.id.localeCompare(b.id));
  const lines: Record<string, string[]> = {};
  for (const crew of [...instance.crew].sort((a, b) => a.seniority - b.seniority)) {
    // Fixed activities and carry-in block their time, with rest around carry-in.
    // Training and office days are duty: they need the same rest around them.
    const blocked: Span[] = [
      ...crew.fixedActivities.map((a) => {
        const pad = a.kind === "training" || a.kind === "office" ? rest : 0;
        return { start: instantMs(a.start) - pad, end: instantMs(a.end) + pad };
      }),
      ...crew.carryIn.map((c) => ({ start: span(c).start - rest, end: span(c).end + rest })),
    ];
    const taken: Span[] = [];
    let credit = 0;
    const line: string[] = [];
    for (const p of trips) {
      if ((need.get(p.id) ?? 0) <= 0) continue;
      if (!p.requires.every((q) => crew.qualifications.includes(q))) continue;
      if (credit + p.creditMinutes > maxCredit) continue;
      const s = span(p);
      if (blocked.some((b) => s.start < b.end && b.start < s.end)) continue;
      if (taken.some((t) => s.start < t.end + rest && t.start < s.end + rest)) continue;
      taken.push(s);
      line.push(p.id);
      credit += p.creditMinutes;
      need.set(p.id, need.get(p.id)! - 1);
    }
    lines[crew.id] = line;
  }
  const open = Object.fromEntries([...need.entries()].filter(([, n]) => n > 0));
  return { lines, open };
}
