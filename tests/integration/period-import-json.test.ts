/**
 * A whole period from the engine's JSON (lib/db/period-json-import.ts): a
 * bundle becomes a period, the same file again changes nothing, its own
 * export uploaded back is recognised too, a different period under the same
 * id is refused, one instance alone makes a one-group period, and a file that
 * is not JSON or breaks the schema is refused with the place of the problem.
 */
import { beforeAll, describe, expect, inject, it } from "vitest";
import { db } from "@/lib/db/client";
import { exportPeriod } from "@/lib/db/period-export";
import { importJsonFile } from "@/lib/db/period-json-import";
import { smallScenario, smallScenarioBundle } from "@/seed/small-scenario";
import { writeUsers } from "@/seed/demo-users";
import { truncateAll } from "../support/reset";

const scenario = smallScenario({ now: new Date("2026-12-01T12:00:00Z") });
const bundle = smallScenarioBundle(scenario);
let actor = "";

describe("importing a period from JSON", () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    // A scheduler only: the crew come with the bundle.
    await writeUsers(db(), scenario.users.filter((u) => !u.crewId));
    actor = (await db().user.findFirstOrThrow({ where: { role: "scheduler" } })).id;
  });

  it("imports a bundle once; the same file, or the period's own export, again changes nothing", async () => {
    const text = JSON.stringify(bundle);
    const first = await importJsonFile(text, "jan.json", actor);
    expect(first).toMatchObject({ periodId: bundle.period.id, changed: true, message: "Imported January 2027: 2 award groups, 36 trips, 12 crew." });
    expect(await db().pairing.count({ where: { bidPeriodId: bundle.period.id } })).toBe(36);
    const again = await importJsonFile(JSON.stringify(bundle, null, 2), "jan (1).json", actor);
    expect(again).toMatchObject({ changed: false, message: "Nothing changed: January 2027 holds this file already." });
    const exported = JSON.stringify(await exportPeriod(db(), bundle.period.id));
    expect((await importJsonFile(exported, "export.json", actor)).changed).toBe(false);
    expect(await db().pairing.count({ where: { bidPeriodId: bundle.period.id } })).toBe(36);
    expect(await db().auditEvent.count({ where: { entityId: bundle.period.id, action: "period.imported-json" } })).toBe(1);
  });

  it("refuses another period under the same id, writing nothing", async () => {
    const other = structuredClone(bundle);
    other.instances[0]!.pairings[0]!.creditMinutes += 60;
    for (const inst of other.instances) for (const p of inst.pairings) if (p.id === other.instances[0]!.pairings[0]!.id) p.creditMinutes = other.instances[0]!.pairings[0]!.creditMinutes;
    await expect(importJsonFile(JSON.stringify(other), "other.json", actor)).rejects.toThrow(`a bid period with the id "${bundle.period.id}" exists already (January 2027) and holds other data; nothing was imported`);
  });

  it("makes a one-group period of an instance alone", async () => {
    const feb = smallScenarioBundle(smallScenario({ seed: 3, now: new Date("2027-01-01T12:00:00Z") }));
    const instance = feb.instances.find((i) => i.group.position === "captain")!;
    // Other crew numbers: the twelve of the scenario are in the database already.
    const crew = instance.crew.map((c, k) => ({ ...c, id: `9${k}`, seniority: 100 + k }));
    const result = await importJsonFile(JSON.stringify({ ...instance, crew }), "captains.json", actor);
    expect(result.message).toBe(`Imported February 2027: 1 award group, ${instance.pairings.length} trips, ${crew.length} crew.`);
    const groups = await db().awardGroup.findMany({ where: { bidPeriodId: instance.period.id } });
    expect(groups.map((g) => g.position)).toEqual(["captain"]);
  });

  it("names the place of a syntax error or a schema problem", async () => {
    await expect(importJsonFile('{"schemaVersion": 1, "period": ', "broken.json", actor)).rejects.toThrow(/^the file broken\.json is not JSON \(.+\): choose a period file written by "Export as JSON" or the generator$/);
    const bad = structuredClone(bundle);
    (bad.instances[1]!.pairings[2]!.dutyPeriods[0]!.legs[0] as { departure: string }).departure = "2027-01-32T08:00:00Z";
    await expect(importJsonFile(JSON.stringify(bad), "bad.json", actor)).rejects.toThrow(/the file bad\.json is not valid: instances\[1\]\.pairings\[2\]\.dutyPeriods\[0\]\.legs\[0\]\.departure: expected a UTC instant/);
  });
});
