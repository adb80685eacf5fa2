"use client";

import { startTransition, useActionState, useState } from "react";
import type { PresetOption, RuleRow } from "@/lib/db/group-settings-rows";
import type { AwardSettings } from "@/lib/domain/settings";
import { LegalityCaution } from "@/app/ui/legality-caution";
import { ActionMessage } from "../../../../../action-message";
import { saveSettingsAction } from "./actions";
import { AwardSettingsFields, fromSettingsDraft, settingsDraft, type SettingsDraft } from "./award-settings-fields";
import { fromDraft, RuleCard, toDraft, type RuleDraft } from "./rule-card";

interface Stored {
  preset: string;
  presetName: string;
  rules: RuleRow[];
  settings: AwardSettings;
}

function SaveButton({ pending }: { pending: boolean }) {
  return (
    <button type="submit" disabled={pending} className="rounded-md bg-slate-900 px-4 py-2 text-sm font-semibold text-white hover:bg-slate-700 disabled:opacity-60">
      {pending ? "Saving…" : "Save"}
    </button>
  );
}

const section = "space-y-3 rounded-lg border border-slate-200 bg-white p-4";

/** The rule-set and award-settings form of one award group; the whole form is sent as JSON and checked on the server. */
export function SettingsForm({ groupId, stored, presets, editable }: { groupId: string; stored: Stored; presets: PresetOption[]; editable: boolean }) {
  const [state, action, pending] = useActionState(saveSettingsAction, undefined);
  const [preset, setPreset] = useState(stored.preset);
  const [asked, setAsked] = useState<string | null>(null);
  const [rules, setRules] = useState<RuleDraft[]>(() => stored.rules.map(toDraft));
  const [settings, setSettings] = useState<SettingsDraft>(() => settingsDraft(stored.settings));
  const errors = state?.status === "refused" ? (state.fields ?? {}) : {};
  const options = presets.some((p) => p.id === stored.preset) ? presets : [{ id: stored.preset, name: stored.presetName, description: "", rules: stored.rules }, ...presets];
  const current = options.find((p) => p.id === preset);
  const askedPreset = options.find((p) => p.id === asked);
  const payload = JSON.stringify({ preset, rules: rules.map(fromDraft), settings: fromSettingsDraft(settings) });
  const inForce = rules.filter((r) => r.on).length;

  function loadPreset(id: string) {
    const chosen = options.find((p) => p.id === id);
    if (!chosen) return;
    setPreset(id);
    setRules((id === stored.preset ? stored.rules : chosen.rules).map(toDraft));
    setAsked(null);
  }

  function undo() {
    setPreset(stored.preset);
    setRules(stored.rules.map(toDraft));
    setSettings(settingsDraft(stored.settings));
    setAsked(null);
  }

  return (
    // Sent from onSubmit rather than `action`: a form action resets the form afterwards, which unchecks the controlled mode radios.
    <form
      aria-label="Rule set and settings"
      className="space-y-5"
      onSubmit={(e) => {
        e.preventDefault();
        const data = new FormData(e.currentTarget);
        startTransition(() => action(data));
      }}
    >
      <input type="hidden" name="groupId" value={groupId} />
      <input type="hidden" name="payload" value={payload} />
      <fieldset disabled={!editable} className="space-y-5">
        <section aria-label="Preset" className={section}>
          <h2 className="font-semibold">Preset</h2>
          <label htmlFor={`${groupId}-preset`} className="block text-sm font-medium text-slate-800">
            Start from
          </label>
          <select
              id={`${groupId}-preset`}
              value={asked ?? preset}
              onChange={(e) => setAsked(e.target.value === preset ? null : e.target.value)}
              className="mt-1 block w-full rounded border border-slate-300 bg-white px-2 py-1.5 text-sm sm:w-auto"
            >
              {options.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </select>
          {current?.description ? <p className="text-sm text-slate-600">{current.description}</p> : null}
          {askedPreset ? (
            <div role="alertdialog" aria-label="Load the preset's rules" className="space-y-2 rounded-md border border-amber-300 bg-amber-50 p-3 text-sm text-amber-950">
              <p>
                Loading <strong>{askedPreset.name}</strong> replaces every rule below with that preset&apos;s own, and your edits to the rules are lost. The award
                settings stay as they are. Nothing is saved until you press Save.
              </p>
              {askedPreset.description ? <p className="text-amber-900">{askedPreset.description}</p> : null}
              <div className="flex flex-wrap gap-2">
                <button type="button" onClick={() => loadPreset(askedPreset.id)} className="rounded-md bg-amber-800 px-3 py-1.5 font-semibold text-white hover:bg-amber-700">
                  Replace the rules
                </button>
                <button type="button" onClick={() => setAsked(null)} className="rounded-md border border-amber-400 bg-white px-3 py-1.5 font-medium">
                  Keep the current rules
                </button>
              </div>
            </div>
          ) : null}
          {errors.preset ? (
            <p role="alert" className="text-sm text-red-700">
              {errors.preset}
            </p>
          ) : null}
        </section>

        <section aria-label="Rules" className={section}>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 className="font-semibold">Rules</h2>
            <p className="text-sm text-slate-600">
              {inForce} of {rules.length} in force
            </p>
          </div>
          <LegalityCaution />
          <p className="text-sm text-slate-600">A rule that is off is left out of the rule set. Minutes, hours and days are as the rule&apos;s sentence reads them.</p>
          <ul className="space-y-2">
            {rules.map((rule, k) => (
              <RuleCard key={`${preset}:${rule.id}`} rule={rule} error={errors[`rules.${rule.id}`]} onChange={(next) => setRules(rules.map((r, j) => (j === k ? next : r)))} />
            ))}
          </ul>
        </section>

        <section aria-label="Award settings" className={section}>
          <h2 className="font-semibold">Award settings</h2>
          <AwardSettingsFields draft={settings} errors={errors} onChange={setSettings} />
        </section>
      </fieldset>

      <div className="sticky bottom-0 -mx-4 space-y-2 border-t border-slate-200 bg-slate-50/95 px-4 py-3 backdrop-blur sm:mx-0 sm:rounded-lg sm:border">
        {editable ? (
          <div className="flex items-center gap-3">
            <SaveButton pending={pending} />
            <button type="button" onClick={undo} className="rounded-md border border-slate-300 bg-white px-3 py-2 text-sm font-medium text-slate-800 hover:bg-slate-100">
              Undo changes
            </button>
          </div>
        ) : (
          <p className="text-sm text-slate-700">This period is published: its rule set and settings can no longer change.</p>
        )}
        <div className="max-h-32 overflow-y-auto">
          <ActionMessage state={state} />
        </div>
      </div>
    </form>
  );
}
