/**
 * What the rule-set and settings screen sends, and how it becomes a rule-set
 * document and award settings: every field checked (the structure by zod, each
 * rule's parameters by lib/rules' `bindRules`, the settings by
 * `awardSettingsSchema`), every problem named with the field it is in, and
 * the changes against what is stored listed in words for the audit.
 */
import { z } from "zod";
import { AppError, awardSettingsSchema, canonicalJson, ruleSchema, ruleSetSchema, type AwardSettings, type Rule, type RuleSet } from "../domain/index";
import { PRESET_IDS, bindRules, presetRuleSet, type PresetId } from "../rules/index";

const paramValue = z.union([z.number(), z.string(), z.boolean()]).nullable();
/** An empty number input arrives as null: required settings refuse it, the floor and the reserve maximum read it as "none". */
const maybeNumber = z.number().nullable();

/** The screen's form as sent: the preset, every rule listed (in force or not), the award settings it edits. */
export const groupSettingsInputSchema = z.strictObject({
  preset: z.string().trim().min(1, "choose a preset"),
  rules: z
    .array(z.strictObject({ id: z.string(), on: z.boolean(), params: z.record(z.string(), paramValue), text: z.string() }))
    .max(200),
  settings: z.strictObject({
    mode: z.string(),
    rankDecay: maybeNumber,
    seniorityWeight: maybeNumber,
    fairnessFloor: maybeNumber,
    reserve: z.strictObject({ min: maybeNumber, max: maybeNumber }),
    timeLimitSeconds: maybeNumber,
  }),
});

/** The screen's form as sent. */
export type GroupSettingsInput = z.input<typeof groupSettingsInputSchema>;

/** Plain names of the settings, for messages and the audit. */
export const SETTING_LABEL: Record<string, string> = {
  mode: "Mode",
  rankDecay: "Rank decay",
  baseLineValue: "Line value",
  seniorityWeight: "Seniority weighting β",
  fairnessFloor: "Fairness floor",
  reserve: "Reserve lines",
  "reserve.min": "Reserve minimum",
  "reserve.max": "Reserve maximum",
  timeLimitSeconds: "Time limit",
  iterationLimit: "Iteration limit",
  seed: "Seed",
};

type Problems = Record<string, string>;

const UNIT: Record<string, string> = { timeLimitSeconds: " seconds" };

/** Zod's bounds in words ("must be at most 86400 seconds"); other messages as they are. */
function plain(issue: z.core.$ZodIssue): string {
  const unit = UNIT[issue.path.map(String).join(".")] ?? "";
  if (issue.code === "too_big" && issue.origin === "number") return `must be ${issue.inclusive ? "at most" : "below"} ${String(issue.maximum)}${unit}`;
  if (issue.code === "too_small" && issue.origin === "number") return `must be ${issue.inclusive ? "at least" : "above"} ${String(issue.minimum)}${unit}`;
  if (issue.code === "invalid_type" && issue.expected === "number") return "give a number";
  return issue.message;
}

function settingProblem(problems: Problems, path: readonly PropertyKey[], message: string) {
  const key = path.map(String).join(".");
  const label = SETTING_LABEL[key] ?? SETTING_LABEL[String(path[0])] ?? key;
  problems[`settings.${key}`] = `${label} (settings.${key}): ${message}`;
}

function ruleProblem(problems: Problems, k: number, id: string, message: string) {
  const key = `rules.${id || k}`;
  problems[key] = problems[key] ? `${problems[key]}; ${message}` : `rule ${k + 1} "${id}": ${message}`;
}

const withoutUndefined = <T extends object>(o: T): T => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;

/**
 * The rule-set document and the settings the form asks for, or AppError
 * ("invalid") naming each bad field (`details.fields`: field → message).
 * Settings the screen does not edit (line value, iteration limit, seed) keep
 * their stored values; in strict seniority no fairness floor is kept (the
 * engine leaves it aside there).
 */
export function validateGroupSettings(raw: unknown, stored: { document: RuleSet; settings: unknown }): { document: RuleSet; settings: AwardSettings } {
  const shape = groupSettingsInputSchema.safeParse(raw);
  if (!shape.success) {
    const fields: Problems = {};
    for (const issue of shape.error.issues) {
      const path = issue.path.map(String).join(".");
      fields[path || "form"] = `${path || "the form"}: ${issue.message}`;
    }
    throw new AppError("invalid", `the form is malformed; nothing was saved: ${Object.values(fields).join("; ")}`, { fields });
  }
  const input = shape.data;
  const problems: Problems = {};

  // Name and description follow the preset: the stored ones while it stays, the new preset's when it changes.
  let head: Pick<RuleSet, "name" | "preset" | "description"> | undefined;
  if (input.preset === stored.document.preset) head = { name: stored.document.name, preset: stored.document.preset, description: stored.document.description };
  else if ((PRESET_IDS as string[]).includes(input.preset)) {
    const preset = presetRuleSet(input.preset as PresetId);
    head = { name: preset.name, preset: preset.preset, description: preset.description };
  } else problems.preset = `Preset (preset): "${input.preset}" is not one of ${PRESET_IDS.join(", ")}`;

  const rules: Rule[] = [];
  input.rules.forEach((row, k) => {
    if (!row.on) return;
    const rule = ruleSchema.safeParse({ id: row.id, params: row.params, text: row.text });
    if (!rule.success) {
      for (const issue of rule.error.issues) {
        const where = issue.path[0] === "params" ? `parameter ${issue.path.slice(1).map(String).join(".")}` : issue.path[0] === "text" ? "the sentence" : "the id";
        ruleProblem(problems, k, row.id, `${where}: ${issue.message}`);
      }
      return;
    }
    try {
      bindRules([rule.data]);
    } catch (e) {
      // bindRules names the rule and the parameter; its index is of this one-rule list, so it is put right.
      ruleProblem(problems, k, row.id, (e as Error).message.replace(/^rules\[0\] "[^"]*": /, ""));
      return;
    }
    rules.push(rule.data);
  });
  let document: RuleSet | undefined;
  if (head) {
    const parsed = ruleSetSchema.safeParse({ ...withoutUndefined(head), rules });
    if (parsed.success) document = parsed.data;
    else for (const issue of parsed.error.issues) problems[`ruleSet.${issue.path.join(".")}`] = `Rule set: ${issue.message}`;
  }

  const s = input.settings;
  for (const key of ["rankDecay", "seniorityWeight", "timeLimitSeconds"] as const) if (s[key] === null) settingProblem(problems, [key], "give a number");
  if (s.reserve.min === null) settingProblem(problems, ["reserve", "min"], "give a number (0 for none)");
  const base = awardSettingsSchema.safeParse(stored.settings ?? {});
  const merged = withoutUndefined({
    ...(base.success ? base.data : {}),
    mode: s.mode,
    rankDecay: s.rankDecay ?? undefined,
    seniorityWeight: s.seniorityWeight ?? undefined,
    fairnessFloor: s.mode === "balanced" && s.fairnessFloor !== null ? s.fairnessFloor : undefined,
    reserve: withoutUndefined({ min: s.reserve.min ?? undefined, max: s.reserve.max ?? undefined }),
    timeLimitSeconds: s.timeLimitSeconds ?? undefined,
  });
  const settings = awardSettingsSchema.safeParse(merged);
  if (!settings.success) for (const issue of settings.error.issues) settingProblem(problems, issue.path, plain(issue));

  if (Object.keys(problems).length > 0 || !document || !settings.success) {
    throw new AppError("invalid", `nothing was saved: ${Object.values(problems).join("; ")}`, { fields: problems });
  }
  return { document, settings: withoutUndefined(settings.data) };
}

const show = (v: unknown) => (v === undefined ? "none" : typeof v === "object" ? canonicalJson(v) : String(v));

/** What differs between two states of a group, one phrase per change: settings, preset, rules switched on or off, parameters, sentences. */
export function describeChanges(before: { document: RuleSet; settings: AwardSettings }, after: { document: RuleSet; settings: AwardSettings }): string[] {
  const changes: string[] = [];
  const keys = [...new Set([...Object.keys(before.settings), ...Object.keys(after.settings)])] as (keyof AwardSettings)[];
  for (const key of keys) {
    const [a, b] = [before.settings[key], after.settings[key]];
    if (show(a) !== show(b)) changes.push(`${SETTING_LABEL[key] ?? key}: ${show(a)} → ${show(b)}`);
  }
  if (before.document.preset !== after.document.preset) changes.push(`preset: ${before.document.preset} → ${after.document.preset}`);
  const old = new Map(before.document.rules.map((r) => [r.id, r]));
  const now = new Map(after.document.rules.map((r) => [r.id, r]));
  for (const [id, rule] of now) {
    const was = old.get(id);
    if (!was) {
      changes.push(`rule ${id}: on`);
      continue;
    }
    for (const key of [...new Set([...Object.keys(was.params), ...Object.keys(rule.params)])]) {
      if (show(was.params[key]) !== show(rule.params[key])) changes.push(`rule ${id}, ${key}: ${show(was.params[key])} → ${show(rule.params[key])}`);
    }
    if (was.text !== rule.text) changes.push(`rule ${id}: sentence changed`);
  }
  for (const id of old.keys()) if (!now.has(id)) changes.push(`rule ${id}: off`);
  return changes;
}
