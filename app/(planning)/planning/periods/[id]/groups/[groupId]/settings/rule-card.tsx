"use client";

import { useId, useState } from "react";
import type { ParamField, RuleRow } from "@/lib/db/group-settings-rows";
import { minutesText, optionLabel, paramLabel } from "./labels";

/** A rule being edited: numbers as typed (strings), the rest as they are; `original` is what was loaded. */
export interface RuleDraft {
  id: string;
  text: string;
  on: boolean;
  params: Record<string, string | boolean>;
  original: RuleRow["params"];
  fields: ParamField[];
}

const isNumber = (f: ParamField) => f.kind === "integer" || f.kind === "number";

export function toDraft(row: RuleRow): RuleDraft {
  const params: RuleDraft["params"] = {};
  for (const f of row.fields) {
    const value = row.params[f.key]!;
    params[f.key] = typeof value === "boolean" ? value : String(value);
  }
  return { id: row.id, text: row.text, on: row.on, params, original: row.params, fields: row.fields };
}

/** The rule as the server reads it: numbers parsed (an empty box is null, text that is no number stays text, so the check names it). */
export function fromDraft(rule: RuleDraft) {
  const params: Record<string, number | string | boolean | null> = {};
  for (const f of rule.fields) {
    const value = rule.params[f.key]!;
    if (f.kind === "fixed") params[f.key] = rule.original[f.key]!;
    else if (isNumber(f) && typeof value === "string") {
      const n = Number(value);
      params[f.key] = value.trim() === "" ? null : Number.isFinite(n) ? n : value;
    } else params[f.key] = value;
  }
  return { id: rule.id, on: rule.on, params, text: rule.text };
}

/** An on/off switch with its state in words beside it. */
export function Switch({ checked, label, onChange }: { checked: boolean; label: string; onChange: (on: boolean) => void }) {
  return (
    <button type="button" role="switch" aria-checked={checked} aria-label={label} onClick={() => onChange(!checked)} className="inline-flex shrink-0 items-center gap-2 text-xs font-medium text-slate-700 disabled:opacity-60">
      <span className={`relative h-6 w-11 rounded-full transition-colors ${checked ? "bg-emerald-600" : "bg-slate-300"}`}>
        <span className={`absolute top-0.5 h-5 w-5 rounded-full bg-white shadow transition-all ${checked ? "left-[1.375rem]" : "left-0.5"}`} />
      </span>
      <span className="w-6">{checked ? "On" : "Off"}</span>
    </button>
  );
}

const inputClass = "mt-0.5 block w-full rounded border border-slate-300 bg-white px-2 py-1.5 text-sm text-slate-900 disabled:bg-slate-100 disabled:text-slate-500";

function ParamInput({ field, value, disabled, onChange }: { field: ParamField; value: string | boolean; disabled: boolean; onChange: (v: string | boolean) => void }) {
  const label = paramLabel(field.key);
  const id = useId();
  if (field.kind === "boolean") {
    return (
      <label className="col-span-2 flex items-center gap-2 py-1.5 text-sm text-slate-700 lg:col-span-1">
        <input type="checkbox" checked={value === true} disabled={disabled} onChange={(e) => onChange(e.target.checked)} className="h-4 w-4" />
        {label}
      </label>
    );
  }
  if (field.kind === "choice") {
    return (
      <div className="col-span-2 sm:col-span-1">
        <label htmlFor={id} className="text-xs text-slate-600">
          {label}
        </label>
        <select id={id} value={String(value)} disabled={disabled} onChange={(e) => onChange(e.target.value)} className={inputClass}>
          {field.options!.map((o) => (
            <option key={o} value={o}>
              {optionLabel(field.key, o)}
            </option>
          ))}
        </select>
      </div>
    );
  }
  const n = Number(value);
  const minutes = field.key.endsWith("Minutes") && typeof value === "string" && value.trim() !== "" && Number.isFinite(n) && n >= 60 ? minutesText(n) : null;
  return (
    <div>
      <label htmlFor={id} className="text-xs text-slate-600">
        {label}
      </label>
      <div className="relative">
      <input
        id={id}
        type={isNumber(field) ? "number" : "text"}
        inputMode={field.kind === "integer" ? "numeric" : isNumber(field) ? "decimal" : undefined}
        step={field.kind === "integer" ? 1 : "any"}
        value={String(value)}
        disabled={disabled}
        onChange={(e) => onChange(e.target.value)}
        className={`${inputClass} ${minutes ? "pr-20" : ""}`}
      />
      {minutes ? <span className="pointer-events-none absolute inset-y-0 right-2 mt-0.5 flex items-center text-xs text-slate-500">{minutes}</span> : null}
      </div>
    </div>
  );
}

/** One rule: its sentence, its source, an on/off switch, its parameters as inputs and the sentence to edit. */
export function RuleCard({ rule, error, onChange }: { rule: RuleDraft; error?: string; onChange: (rule: RuleDraft) => void }) {
  const [editing, setEditing] = useState(false);
  const editable = rule.fields.filter((f) => f.kind !== "fixed");
  const reference = typeof rule.original.reference === "string" ? rule.original.reference : null;
  const figuresChanged = editable.some((f) => isNumber(f) && rule.params[f.key] !== String(rule.original[f.key]));
  return (
    <li aria-label={`Rule ${rule.id}`} className={`space-y-2 rounded-md border p-3 ${rule.on ? "border-slate-200 bg-white" : "border-dashed border-slate-300 bg-slate-50"}`}>
      <div className="flex items-start justify-between gap-3">
        <div className="min-w-0">
          <p className={`text-sm ${rule.on ? "text-slate-900" : "text-slate-500 line-through decoration-slate-300"}`}>{rule.text}</p>
          <p className="mt-0.5 break-words text-xs text-slate-500">
            <span className="font-mono">{rule.id}</span>
            {reference ? ` · ${reference}` : ""}
          </p>
        </div>
        <Switch checked={rule.on} label={`In force: ${rule.id}`} onChange={(on) => onChange({ ...rule, on })} />
      </div>
      {editable.length > 0 ? (
        <div className="grid grid-cols-2 items-end gap-2 lg:grid-cols-3">
          {editable.map((f) => (
            <ParamInput key={f.key} field={f} value={rule.params[f.key]!} disabled={!rule.on} onChange={(v) => onChange({ ...rule, params: { ...rule.params, [f.key]: v } })} />
          ))}
        </div>
      ) : null}
      {figuresChanged && rule.on ? <p className="text-xs text-amber-800">A figure changed: check that the sentence still says what the rule asks.</p> : null}
      {rule.on ? (
        <div>
          <button type="button" onClick={() => setEditing(!editing)} className="text-xs text-sky-800 underline">
            {editing ? "Done with the sentence" : "Edit the sentence"}
          </button>
          {editing ? (
            <textarea aria-label={`Sentence of ${rule.id}`} value={rule.text} rows={2} onChange={(e) => onChange({ ...rule, text: e.target.value })} className={inputClass} />
          ) : null}
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="text-sm text-red-700">
          {error}
        </p>
      ) : null}
    </li>
  );
}
