import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { instanceSchema } from "@/lib/domain";
import { generatePeriod } from "@/seed/generator/generate-period";

const tsx = "node_modules/.bin/tsx";

function tinyFile(dir: string): { file: string; instance: ReturnType<typeof instanceSchema.parse> } {
  const generated = generatePeriod({ crew: 3, pairings: 8, days: 7, seed: 31, positions: ["captain"] }).instances[0]!;
  const rules = generated.ruleSet.rules.map((r) => (r.id === "credit-window" ? { ...r, params: { minMinutes: 0, maxMinutes: 30 * 60 } } : r));
  const instance = instanceSchema.parse({ ...generated, ruleSet: { ...generated.ruleSet, rules } });
  const file = path.join(dir, "tiny.json");
  fs.writeFileSync(file, JSON.stringify(instance));
  return { file, instance };
}

describe("npm run award", () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "award-cli-"));

  it("prints coverage, satisfaction, Jain's index, gap and time, and writes the award", () => {
    const { file, instance } = tinyFile(dir);
    const out = path.join(dir, "award.json");
    const text = execFileSync(tsx, ["lib/cli/award.ts", file, "--time-limit", "60", "--out", out], { encoding: "utf8" });
    expect(text).toMatch(/coverage\s+\d+ of \d+ positions; open time [\d.]+ h/);
    expect(text).toMatch(/satisfaction\s+mean [\d.]+, minimum [\d.]+; Jain [\d.]+/);
    expect(text).toMatch(/gap [\d.]+ %/);
    expect(text).toMatch(/time\s+[\d.]+ s/);
    const written = JSON.parse(fs.readFileSync(out, "utf8")) as { award: { lines: { crewId: string }[] } };
    expect(written.award.lines.map((l) => l.crewId).sort()).toEqual(instance.crew.map((c) => c.id).sort());
  }, 120_000);

  it("names the path of a bad field and exits non-zero", () => {
    const { file, instance } = tinyFile(dir);
    const bad = structuredClone(instance) as unknown as { pairings: { dutyPeriods: { report: string }[] }[] };
    bad.pairings[2]!.dutyPeriods[0]!.report = "half past nine";
    fs.writeFileSync(file, JSON.stringify(bad));
    const r = spawnSync(tsx, ["lib/cli/award.ts", file], { encoding: "utf8" });
    expect(r.status).toBe(1);
    expect(r.stderr).toContain("is not a valid instance");
    expect(r.stderr).toContain("pairings[2].dutyPeriods[0].report");
  }, 60_000);

  it("awards in strict seniority with --mode strict, saying how each score was certified", () => {
    const { file, instance } = tinyFile(dir);
    const out = path.join(dir, "strict.json");
    const text = execFileSync(tsx, ["lib/cli/award.ts", file, "--mode", "strict", "--out", out], { encoding: "utf8" });
    expect(text).toContain(", strict)");
    expect(text).toMatch(/seniority\s+each crew member's score certified by: [a-z-]+ \d+/);
    const written = JSON.parse(fs.readFileSync(out, "utf8")) as { award: { lines: { certificate?: { step: number } }[] } };
    expect(written.award.lines.map((l) => l.certificate?.step)).toEqual(instance.crew.map((_, k) => k + 1));
  }, 120_000);

  it("refuses an unknown mode, saying which ones exist", () => {
    const { file } = tinyFile(dir);
    const r = spawnSync(tsx, ["lib/cli/award.ts", file, "--mode", "fastest"], { encoding: "utf8" });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--mode must be strict or balanced/);
  }, 60_000);
});
