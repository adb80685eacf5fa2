/**
 * An award group's rule set and award settings, as the planning screen reads
 * and saves them.
 *
 * Rule-set rows are shared: the groups of a period, and periods imported from
 * the same bundle, point at one row. A save therefore never changes a RuleSet
 * row. The group is pointed at a row whose document is identical to the one
 * asked for (any row, shared or not), or at a new row named after the group
 * ("<document name> · HLV captains, January 2027", with " (2)", " (3)", … once
 * that is taken). Runs keep their own snapshot of the instance, so earlier
 * runs never change either.
 */
import { AppError, awardSettingsSchema, canonicalJson, ruleSetSchema, type AwardSettings, type Position, type RuleSet } from "../domain/index";
import { PRESET_IDS } from "../rules/index";
import { db } from "./client";
import type { Prisma } from "./generated/client";
import { describeChanges, validateGroupSettings } from "./group-settings-input";
import { presetOptions, ruleRows } from "./group-settings-rows";

type Tx = Prisma.TransactionClient;

const GROUP_NOUN: Record<Position, string> = { captain: "captains", first_officer: "first officers", flight_attendant: "flight attendants", purser: "pursers" };

function storedDocument(row: { id: string; name: string; document: unknown }): RuleSet {
  const parsed = ruleSetSchema.safeParse(row.document);
  if (!parsed.success) throw new AppError("invalid", `rule set "${row.name}" (row ${row.id}) does not read as a rule set: ${parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}`);
  return parsed.data;
}

/** Stored settings with every default filled in; settings that do not parse show as the defaults, with the reason. */
function storedSettings(raw: unknown): { settings: AwardSettings; problem?: string } {
  const parsed = awardSettingsSchema.safeParse(raw ?? {});
  if (parsed.success) return { settings: parsed.data };
  return { settings: awardSettingsSchema.parse({}), problem: parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ") };
}

/**
 * Everything the screen shows for award group `groupId`: the group and its
 * period, the rule set (its row, the other groups that share it, the document
 * and its rules as rows), the settings with defaults, the shipped presets.
 */
export async function groupSettings(groupId: string) {
  const group = await db().awardGroup.findUnique({
    where: { id: groupId },
    include: { ruleSet: true, bidPeriod: { select: { id: true, name: true, state: true, base: { select: { stationCode: true } } } } },
  });
  if (!group) throw new AppError("not_found", "no such award group");
  const sharers = await db().awardGroup.findMany({
    where: { ruleSetId: group.ruleSetId, id: { not: group.id } },
    select: { position: true, bidPeriod: { select: { name: true, base: { select: { stationCode: true } } } } },
    orderBy: [{ bidPeriod: { startDate: "asc" } }, { position: "asc" }],
  });
  const document = storedDocument(group.ruleSet);
  const { settings, problem } = storedSettings(group.settings);
  return {
    group: { id: group.id, position: group.position },
    period: { id: group.bidPeriod.id, name: group.bidPeriod.name, state: group.bidPeriod.state, baseCode: group.bidPeriod.base.stationCode },
    editable: group.bidPeriod.state !== "published",
    ruleSet: {
      id: group.ruleSet.id,
      name: group.ruleSet.name,
      document,
      rules: ruleRows(document),
      sharedWith: sharers.map((s) => `${s.bidPeriod.base.stationCode} ${GROUP_NOUN[s.position]}, ${s.bidPeriod.name}`),
    },
    settings,
    settingsProblem: problem,
    presetIds: PRESET_IDS,
    presets: presetOptions(),
  };
}

/** What a save did, for the screen. */
export interface SaveOutcome {
  message: string;
  periodId: string;
  changes: string[];
  ruleSet: { id: string; name: string; created: boolean };
}

/** The row holding `document`: an identical one if any, else a new row with a free name after the group. */
async function ruleSetRow(tx: Tx, document: RuleSet, nameBase: string): Promise<{ id: string; name: string; created: boolean }> {
  const key = canonicalJson(document);
  const candidates = await tx.ruleSet.findMany({ where: { preset: document.preset }, orderBy: { createdAt: "asc" }, select: { id: true, name: true, document: true } });
  const same = candidates.find((row) => {
    const parsed = ruleSetSchema.safeParse(row.document);
    return parsed.success && canonicalJson(parsed.data) === key;
  });
  if (same) return { id: same.id, name: same.name, created: false };
  const taken = new Set((await tx.ruleSet.findMany({ where: { name: { startsWith: nameBase } }, select: { name: true } })).map((r) => r.name));
  let name = nameBase;
  for (let n = 2; taken.has(name); n++) name = `${nameBase} (${n})`;
  const row = await tx.ruleSet.create({ data: { name, preset: document.preset, document: JSON.parse(JSON.stringify(document)) as Prisma.InputJsonValue }, select: { id: true } });
  return { id: row.id, name, created: true };
}

/**
 * Saves the rule set and award settings the screen sends (`input`, see
 * `groupSettingsInputSchema`) for award group `groupId`, in one transaction
 * under a lock of the group's row (and a shared lock of its period's, so a
 * publish cannot slip in between), with one audit entry listing the changes.
 *
 * Refuses, writing nothing: a published period (AppError "conflict"), and any
 * bad field (AppError "invalid", naming each one). A save that changes
 * nothing writes nothing either.
 */
export async function saveGroupSettings(groupId: string, actorUserId: string, input: unknown): Promise<SaveOutcome> {
  return db().$transaction(async (tx) => {
    // Period first, then group: the order publishing takes them in (it locks the period, then writes the groups).
    await tx.$queryRaw`SELECT p.id FROM "BidPeriod" p JOIN "AwardGroup" g ON g."bidPeriodId" = p.id WHERE g.id = ${groupId} FOR SHARE OF p`;
    const locked = await tx.$queryRaw<{ id: string }[]>`SELECT id FROM "AwardGroup" WHERE id = ${groupId} FOR UPDATE`;
    if (locked.length === 0) throw new AppError("not_found", "no such award group");
    const group = await tx.awardGroup.findUniqueOrThrow({
      where: { id: groupId },
      include: { ruleSet: true, bidPeriod: { select: { name: true, state: true, base: { select: { stationCode: true } } } } },
    });
    const label = `${group.bidPeriod.base.stationCode} ${GROUP_NOUN[group.position]}, ${group.bidPeriod.name}`;
    if (group.bidPeriod.state === "published") {
      throw new AppError("conflict", `${group.bidPeriod.name} is published: the rule set and settings of its award groups can no longer change; nothing was saved`);
    }
    const before = { document: storedDocument(group.ruleSet), settings: storedSettings(group.settings).settings };
    const after = validateGroupSettings(input, { document: before.document, settings: group.settings });
    const changes = describeChanges(before, after);
    // Compared with defaults filled in: `{}` and the defaults written out are the same settings.
    const sameSettings = canonicalJson(JSON.parse(JSON.stringify(before.settings))) === canonicalJson(after.settings);
    const sameDocument = canonicalJson(before.document) === canonicalJson(after.document);
    if (sameDocument && sameSettings) {
      return { message: "Nothing changed; nothing was saved", periodId: group.bidPeriodId, changes: [], ruleSet: { id: group.ruleSet.id, name: group.ruleSet.name, created: false } };
    }
    const row = sameDocument ? { id: group.ruleSet.id, name: group.ruleSet.name, created: false } : await ruleSetRow(tx, after.document, `${after.document.name} · ${label}`);
    await tx.awardGroup.update({ where: { id: groupId }, data: { ruleSetId: row.id, settings: after.settings as Prisma.InputJsonValue } });
    await tx.auditEvent.create({
      data: {
        actorUserId,
        action: "award-group.settings-saved",
        entity: "AwardGroup",
        entityId: groupId,
        detail: {
          changes,
          ruleSet: { from: { id: group.ruleSet.id, name: group.ruleSet.name }, to: { id: row.id, name: row.name }, created: row.created },
          settings: { from: before.settings, to: after.settings },
        } as Prisma.InputJsonValue,
      },
    });
    const what = changes.length > 0 ? changes.join("; ") : "the rule-set document rewritten";
    const where = row.id === group.ruleSet.id ? "" : row.created ? ` The rules are now in a rule set of their own, "${row.name}".` : ` The rules are those of rule set "${row.name}", which is used as it stands.`;
    return { message: `Saved for ${label}: ${what}.${where}`, periodId: group.bidPeriodId, changes, ruleSet: row };
  });
}
