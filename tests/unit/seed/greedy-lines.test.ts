import { describe, expect, it } from "vitest";
import { instantMs } from "@/lib/domain/time";
import { generatePeriod } from "@/seed/generator/generate-period";
import { greedyLines } from "@/seed/greedy-lines";

const instance = generatePeriod({ crew: 40, seed: 5, positions: ["captain"] }).instances[0]!;
const byId = new Map(instance.pairings.map((p) => [p.id, p]));
const start = (id: string) => instantMs(byId.get(id)!.dutyPeriods[0]!.report);
const end = (id: string) => instantMs(byId.get(id)!.dutyPeriods.at(-1)!.release);

describe("the greedy line filler (a test helper, not an award method)", () => {
  const { lines, open } = greedyLines(instance, { minRestMinutes: 600, maxCreditMinutes: 80 * 60 });

  it("keeps every line within its limits: no overlap, 10 h rest, 80 h credit, qualified, clear of leave and carry-in", () => {
    for (const crew of instance.crew) {
      const line = lines[crew.id]!;
      const credit = line.reduce((t, id) => t + byId.get(id)!.creditMinutes, 0);
      expect(credit).toBeLessThanOrEqual(80 * 60);
      line.slice(1).forEach((id, k) => expect(start(id) - end(line[k]!)).toBeGreaterThanOrEqual(600 * 60_000));
      for (const id of line) {
        expect(byId.get(id)!.requires.every((q) => crew.qualifications.includes(q))).toBe(true);
        for (const a of crew.fixedActivities) expect(start(id) < instantMs(a.end) && instantMs(a.start) < end(id)).toBe(false);
      }
    }
  });

  it("covers each pairing at most as often as it needs, and reports the rest as open", () => {
    const flown = new Map<string, number>();
    for (const line of Object.values(lines)) for (const id of line) flown.set(id, (flown.get(id) ?? 0) + 1);
    for (const p of instance.pairings) expect((flown.get(p.id) ?? 0) + (open[p.id] ?? 0)).toBe(p.crewNeeded.captain);
  });

  it("serves seniority first: the most senior free crew member takes the earliest trip they may fly", () => {
    const senior = [...instance.crew].sort((a, b) => a.seniority - b.seniority).find((c) => !c.carryIn.length && !c.fixedActivities.length)!;
    const more = instance.crew.filter((c) => c.seniority < senior.seniority).flatMap((c) => lines[c.id]!);
    const first = [...instance.pairings]
      .filter((p) => p.requires.every((q) => senior.qualifications.includes(q)) && !more.includes(p.id))
      .sort((a, b) => start(a.id) - start(b.id) || a.id.localeCompare(b.id))[0]!;
    expect(lines[senior.id]![0]).toBe(first.id);
    expect(greedyLines(instance)).toEqual(greedyLines(instance)); // deterministic
  });
});
