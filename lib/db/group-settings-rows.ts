/**
 * The rules of an award group's rule set as the settings screen edits them:
 * one row per rule with its sentence, its parameters, whether it is in force,
 * and what kind of input each parameter takes (read from the check's own zod
 * schema in lib/rules, so a choice offers exactly the values the check accepts).
 *
 * A rule that is off is left out of the rule-set document (the checks'
 * parameters are strict, so there is no "enabled" flag to store); the screen
 * still lists the preset's rules that the document leaves out, as off.
 */
import { z } from "zod";
import type { Rule, RuleSet } from "../domain/index";
import { PRESET_IDS, REGISTRY, presetRuleSet } from "../rules/index";

/** How one parameter is edited: a number, a whole number, a switch, one of a list, free text, or not at all. */
export interface ParamField {
  key: string;
  kind: "integer" | "number" | "boolean" | "choice" | "text" | "fixed";
  options?: string[];
}

/** One rule on the screen. */
export interface RuleRow {
  id: string;
  text: string;
  on: boolean;
  params: Record<string, number | string | boolean>;
  fields: ParamField[];
}

/** A shipped preset as the screen offers it. */
export interface PresetOption {
  id: string;
  name: string;
  description: string;
  rules: RuleRow[];
}

/** `check` picks the implementation and `reference` cites the text: shown, never edited. */
const FIXED = new Set(["check", "reference"]);

type JsonProp = { type?: string; enum?: unknown[] };
const propsByCheck = new Map<string, Record<string, JsonProp>>();

function checkProps(checkId: string): Record<string, JsonProp> {
  let props = propsByCheck.get(checkId);
  if (!props) {
    const impl = REGISTRY.get(checkId);
    const schema = impl ? (z.toJSONSchema(impl.params as z.ZodType, { io: "input", unrepresentable: "any" }) as { properties?: Record<string, JsonProp> }) : {};
    props = schema.properties ?? {};
    propsByCheck.set(checkId, props);
  }
  return props;
}

function fieldOf(key: string, value: unknown, prop: JsonProp | undefined): ParamField {
  if (FIXED.has(key)) return { key, kind: "fixed" };
  if (prop?.enum) return { key, kind: "choice", options: prop.enum.map(String) };
  const type = prop?.type ?? typeof value;
  if (type === "integer") return { key, kind: "integer" };
  if (type === "number") return { key, kind: "number" };
  if (type === "boolean") return { key, kind: "boolean" };
  return { key, kind: "text" };
}

/** A rule of a document as a row of the screen. */
export function ruleRow(rule: Rule, on: boolean): RuleRow {
  const props = checkProps(String(rule.params.check ?? rule.id));
  // In the order the check declares its parameters (stored JSON does not keep the document's order), unknown ones last.
  const order = Object.keys(props);
  const rank = (key: string) => (order.includes(key) ? order.indexOf(key) : order.length);
  const keys = Object.keys(rule.params).sort((a, b) => rank(a) - rank(b) || a.localeCompare(b));
  return { id: rule.id, text: rule.text, on, params: { ...rule.params }, fields: keys.map((key) => fieldOf(key, rule.params[key], props[key])) };
}

/** The document's rules (in force), then the rules of its preset that it leaves out (off). */
export function ruleRows(document: RuleSet): RuleRow[] {
  const rows = document.rules.map((r) => ruleRow(r, true));
  if ((PRESET_IDS as string[]).includes(document.preset)) {
    const present = new Set(rows.map((r) => r.id));
    const preset = presetRuleSet(document.preset as (typeof PRESET_IDS)[number]);
    for (const rule of preset.rules) if (!present.has(rule.id)) rows.push(ruleRow(rule, false));
  }
  return rows;
}

/** Every shipped preset, with its rules as rows (all in force). */
export function presetOptions(): PresetOption[] {
  return PRESET_IDS.map((id) => {
    const document = presetRuleSet(id);
    return { id, name: document.name, description: document.description ?? "", rules: document.rules.map((r) => ruleRow(r, true)) };
  });
}
