/**
 * An award group's rule set and award settings (the planning screen's data):
 * a save changes what the period export and a requested run read, and nothing
 * else; a bad rule parameter or setting is refused with the field named and
 * nothing written; a rule set shared with another group is never changed; a
 * published period refuses; each save leaves one audit entry.
 */
import type PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { isAppError, type RuleSet } from "@/lib/domain";
import { requestRun } from "@/lib/db/award-runs";
import { db } from "@/lib/db/client";
import { groupSettings, saveGroupSettings } from "@/lib/db/group-settings";
import type { GroupSettingsInput } from "@/lib/db/group-settings-input";
import { exportPeriod } from "@/lib/db/period-export";
import { startQueue } from "@/lib/jobs/queue";
import { presetRuleSet } from "@/lib/rules";
import { smallScenario } from "@/seed/small-scenario";
import { writeScenario } from "@/seed/write-scenario";
import { truncateAll } from "../support/reset";

const NOW = new Date("2026-12-01T12:00:00Z");
const SHARED_NAME = "Flight deck (US Part 117)";
let periodId = "";
let scheduler = "";
let captains = "";
let officers = "";
let boss: PgBoss;

type View = Awaited<ReturnType<typeof groupSettings>>;

/** The form exactly as the screen would send it for what is stored. */
function formOf(view: View): GroupSettingsInput {
  const s = view.settings;
  return {
    preset: view.ruleSet.document.preset,
    rules: view.ruleSet.rules.map((r) => ({ id: r.id, on: r.on, params: { ...r.params }, text: r.text })),
    settings: {
      mode: s.mode,
      rankDecay: s.rankDecay,
      seniorityWeight: s.seniorityWeight,
      fairnessFloor: s.fairnessFloor ?? null,
      reserve: { min: s.reserve.min, max: s.reserve.max ?? null },
      timeLimitSeconds: s.timeLimitSeconds,
    },
  };
}

function withRule(form: GroupSettingsInput, id: string, change: Partial<GroupSettingsInput["rules"][number]> | ((params: Record<string, unknown>) => void)): GroupSettingsInput {
  return {
    ...form,
    rules: form.rules.map((r) => {
      if (r.id !== id) return r;
      if (typeof change === "function") {
        const params = { ...r.params };
        change(params);
        return { ...r, params: params as typeof r.params };
      }
      return { ...r, ...change };
    }),
  };
}

/** Every row a save may write, to show that a refused one wrote nothing. */
async function rows() {
  return {
    groups: await db().awardGroup.findMany({ orderBy: { id: "asc" }, select: { id: true, ruleSetId: true, settings: true } }),
    ruleSets: await db().ruleSet.findMany({ orderBy: { id: "asc" } }),
    audits: await db().auditEvent.count(),
  };
}

async function refusal(promise: Promise<unknown>) {
  const error = await promise.then(
    () => undefined,
    (e: unknown) => e,
  );
  if (!isAppError(error)) throw new Error(`expected an AppError, got ${String(error)}`);
  return error;
}

const captainsInstance = async () => (await exportPeriod(db(), periodId)).instances.find((i) => i.group.position === "captain")!;
const officersInstance = async () => (await exportPeriod(db(), periodId)).instances.find((i) => i.group.position === "first_officer")!;

describe("an award group's rule set and settings", { timeout: 60_000 }, () => {
  beforeAll(async () => {
    await truncateAll(inject("databaseUrl"));
    ({ periodId } = await writeScenario(db(), smallScenario({ now: NOW })));
    scheduler = (await db().user.findFirstOrThrow({ where: { role: "scheduler" } })).id;
    captains = (await db().awardGroup.findFirstOrThrow({ where: { bidPeriodId: periodId, position: "captain" } })).id;
    officers = (await db().awardGroup.findFirstOrThrow({ where: { bidPeriodId: periodId, position: "first_officer" } })).id;
    boss = await startQueue(inject("databaseUrl"));
  });
  afterAll(async () => {
    await boss?.stop({ graceful: false });
  });

  it("reads the group, its shared rule set, the settings with defaults and the presets", async () => {
    const view = await groupSettings(captains);
    expect(view.period).toMatchObject({ id: periodId, name: "January 2027", state: "open", baseCode: "HLV" });
    expect(view.ruleSet.name).toBe(SHARED_NAME);
    expect(view.ruleSet.sharedWith).toEqual(["HLV first officers, January 2027"]);
    expect(view.ruleSet.document).toEqual(presetRuleSet("us-flightcrew"));
    expect(view.ruleSet.rules.every((r) => r.on)).toBe(true);
    expect(view.settings).toMatchObject({ mode: "strict", rankDecay: 0.8, timeLimitSeconds: 600, reserve: { min: 0 } });
    expect(view.presetIds).toEqual(["us-flightcrew", "us-cabin", "eu-crew"]);
    // A parameter's input follows the check's own schema: a choice offers exactly the values it accepts.
    const cumulative = view.ruleSet.rules.find((r) => r.id === "fdp-60-in-168")!;
    expect(cumulative.fields.find((f) => f.key === "measure")).toEqual({ key: "measure", kind: "choice", options: ["fdp", "duty", "flight"] });
    expect(cumulative.fields.find((f) => f.key === "maxMinutes")).toEqual({ key: "maxMinutes", kind: "integer" });
    expect(cumulative.fields.find((f) => f.key === "check")?.kind).toBe("fixed");
    // Stored JSON loses the document's key order: the inputs follow the check's own order of parameters.
    expect(view.ruleSet.rules.find((r) => r.id === "credit-window")!.fields.map((f) => f.key)).toEqual(["minMinutes", "maxMinutes"]);
  });

  it("saves a valid form: the export and a new run read it, an earlier run and the shared rule set stay as they were", async () => {
    const earlier = await requestRun(boss, { groupId: captains });
    const before = await rows();
    const shared = before.ruleSets.find((r) => r.name === SHARED_NAME)!;
    const officersBefore = await officersInstance();
    const form = formOf(await groupSettings(captains));
    const changed = withRule(
      withRule({ ...form, settings: { ...form.settings, mode: "balanced", fairnessFloor: 0.4, timeLimitSeconds: 90 } }, "credit-window", (p) => {
        p.minMinutes = 3600;
      }),
      "max-days-on",
      { on: false },
    );
    const outcome = await saveGroupSettings(captains, scheduler, changed);
    expect(outcome.ruleSet).toMatchObject({ name: `${SHARED_NAME} · HLV captains, January 2027`, created: true });
    expect(outcome.changes).toEqual(["Mode: strict → balanced", "Time limit: 600 → 90", "Fairness floor: none → 0.4", "rule credit-window, minMinutes: 3900 → 3600", "rule max-days-on: off"]);

    const instance = await captainsInstance();
    expect(instance.settings).toMatchObject({ mode: "balanced", fairnessFloor: 0.4, timeLimitSeconds: 90 });
    expect(instance.ruleSet.rules.map((r) => r.id)).not.toContain("max-days-on");
    expect(instance.ruleSet.rules.find((r) => r.id === "credit-window")?.params.minMinutes).toBe(3600);
    const later = await requestRun(boss, { groupId: captains });
    const [run, first] = await Promise.all([db().awardRun.findUniqueOrThrow({ where: { id: later.runId } }), db().awardRun.findUniqueOrThrow({ where: { id: earlier.runId } })]);
    expect(run.settings).toMatchObject({ mode: "balanced", timeLimitSeconds: 90 });
    expect((run.instance as { ruleSet: RuleSet }).ruleSet.rules.find((r) => r.id === "credit-window")?.params.minMinutes).toBe(3600);
    // The run requested before the save keeps its own snapshot.
    expect(first.settings).toMatchObject({ mode: "strict", timeLimitSeconds: 600 });
    expect((first.instance as { ruleSet: RuleSet }).ruleSet.rules.map((r) => r.id)).toContain("max-days-on");
    expect(later.instanceHash).not.toBe(earlier.instanceHash);

    // The first officers still use the shared row, which is untouched.
    const after = await rows();
    expect(after.ruleSets.find((r) => r.id === shared.id)).toEqual(shared);
    expect(after.groups.find((g) => g.id === officers)).toEqual(before.groups.find((g) => g.id === officers));
    expect(await officersInstance()).toEqual(officersBefore);

    const audits = await db().auditEvent.findMany({ where: { entity: "AwardGroup", entityId: captains } });
    expect(audits).toHaveLength(1);
    expect(audits[0]).toMatchObject({ actorUserId: scheduler, action: "award-group.settings-saved" });
    expect(audits[0]!.detail).toMatchObject({ changes: outcome.changes, ruleSet: { from: { id: shared.id }, to: { id: outcome.ruleSet.id }, created: true } });
  });

  it("refuses a bad rule parameter, naming the rule and the parameter, and writes nothing", async () => {
    const before = await rows();
    const form = formOf(await groupSettings(captains));
    const negative = await refusal(saveGroupSettings(captains, scheduler, withRule(form, "credit-window", (p) => void (p.minMinutes = -5))));
    expect(negative.code).toBe("invalid");
    expect(negative.message).toMatch(/rule \d+ "credit-window": minMinutes: Too small/);
    expect(Object.keys(negative.details?.fields as object)).toEqual(["rules.credit-window"]);
    const word = await refusal(saveGroupSettings(captains, scheduler, withRule(form, "rest-at-base", (p) => void (p.minMinutes = "twelve hours"))));
    expect(word.message).toMatch(/"rest-at-base": minMinutes: Invalid input: expected number, received string/);
    expect(await rows()).toEqual(before);
  });

  it("refuses a bad setting, naming each bad field, and writes nothing", async () => {
    const before = await rows();
    const form = formOf(await groupSettings(captains));
    const tooLong = await refusal(saveGroupSettings(captains, scheduler, { ...form, settings: { ...form.settings, timeLimitSeconds: 100_000 } }));
    expect(tooLong.code).toBe("invalid");
    expect(tooLong.message).toContain("Time limit (settings.timeLimitSeconds): must be at most 86400 seconds");
    // Every bad field at once, a rule among them.
    const many = await refusal(
      saveGroupSettings(captains, scheduler, withRule({ ...form, settings: { ...form.settings, rankDecay: 0, reserve: { min: 4, max: 2 }, seniorityWeight: null } }, "max-days-on", { on: true, params: { days: 0 } })),
    );
    expect(many.message).toContain("Rank decay (settings.rankDecay): must be above 0");
    expect(many.message).toContain("Reserve maximum (settings.reserve.max): the reserve minimum is above the maximum");
    expect(many.message).toContain("Seniority weighting β (settings.seniorityWeight): give a number");
    expect(many.message).toMatch(/"max-days-on": days: Too small/);
    expect(await rows()).toEqual(before);
  });

  it("writes nothing when nothing changed", async () => {
    const before = await rows();
    const outcome = await saveGroupSettings(captains, scheduler, formOf(await groupSettings(captains)));
    expect(outcome.message).toBe("Nothing changed; nothing was saved");
    expect(await rows()).toEqual(before);
  });

  it("reuses a rule set whose document is identical, and names new ones after the group", async () => {
    const count = await db().ruleSet.count();
    const captainsView = await groupSettings(captains);
    // The first officers take the captains' rules: the captains' row is reused as it stands.
    const officersForm = formOf(await groupSettings(officers));
    const same = await saveGroupSettings(officers, scheduler, { ...officersForm, rules: formOf(captainsView).rules });
    expect(same.ruleSet).toEqual({ id: captainsView.ruleSet.id, name: captainsView.ruleSet.name, created: false });
    expect(await db().ruleSet.count()).toBe(count);
    // Back to the preset's own rules: the original shared row again.
    const original = await db().ruleSet.findUniqueOrThrow({ where: { name: SHARED_NAME } });
    const preset = (await groupSettings(captains)).presets.find((p) => p.id === "us-flightcrew")!;
    const back = await saveGroupSettings(officers, scheduler, { ...officersForm, rules: preset.rules.map((r) => ({ id: r.id, on: true, params: r.params, text: r.text })) });
    expect(back.ruleSet.id).toBe(original.id);
    // Two different edits of one group: two rows with readable, different names.
    const one = await saveGroupSettings(officers, scheduler, withRule(officersForm, "max-days-on", (p) => void (p.days = 5)));
    const two = await saveGroupSettings(officers, scheduler, withRule(officersForm, "max-days-on", (p) => void (p.days = 4)));
    expect([one.ruleSet.name, two.ruleSet.name]).toEqual([`${SHARED_NAME} · HLV first officers, January 2027`, `${SHARED_NAME} · HLV first officers, January 2027 (2)`]);
    expect(await db().ruleSet.count()).toBe(count + 2);
    expect((await db().ruleSet.findUniqueOrThrow({ where: { id: original.id } })).document).toEqual(presetRuleSet("us-flightcrew"));
    expect(await db().auditEvent.count({ where: { entityId: officers } })).toBe(4);
  });

  it("allows edits while closed or awarded and refuses them once the period is published", async () => {
    for (const [state, seconds] of [["closed", 120], ["awarded", 150]] as const) {
      await db().bidPeriod.update({ where: { id: periodId }, data: { state } });
      const form = formOf(await groupSettings(captains));
      await saveGroupSettings(captains, scheduler, { ...form, settings: { ...form.settings, timeLimitSeconds: seconds } });
      expect((await captainsInstance()).settings.timeLimitSeconds).toBe(seconds);
    }
    await db().bidPeriod.update({ where: { id: periodId }, data: { state: "published" } });
    expect((await groupSettings(captains)).editable).toBe(false);
    const before = await rows();
    const form = formOf(await groupSettings(captains));
    const refused = await refusal(saveGroupSettings(captains, scheduler, { ...form, settings: { ...form.settings, mode: "strict" } }));
    expect(refused.code).toBe("conflict");
    expect(refused.message).toBe("January 2027 is published: the rule set and settings of its award groups can no longer change; nothing was saved");
    expect(await rows()).toEqual(before);
  });
});
