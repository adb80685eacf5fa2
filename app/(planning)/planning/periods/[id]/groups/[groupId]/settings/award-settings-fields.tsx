"use client";

import { useId } from "react";
import type { AwardSettings } from "@/lib/domain/settings";
import { MODE_CHOICES } from "./labels";

/** The award settings being edited, as typed. */
export interface SettingsDraft {
  mode: string;
  rankDecay: string;
  seniorityWeight: string;
  fairnessFloor: string;
  reserveMin: string;
  reserveMax: string;
  minutes: string;
  seconds: string;
}

export function settingsDraft(s: AwardSettings): SettingsDraft {
  return {
    mode: s.mode,
    rankDecay: String(s.rankDecay),
    seniorityWeight: String(s.seniorityWeight),
    fairnessFloor: s.fairnessFloor === undefined ? "" : String(s.fairnessFloor),
    reserveMin: String(s.reserve.min),
    reserveMax: s.reserve.max === undefined ? "" : String(s.reserve.max),
    minutes: String(Math.floor(s.timeLimitSeconds / 60)),
    seconds: String(Math.round((s.timeLimitSeconds % 60) * 1000) / 1000),
  };
}

/** An empty or unreadable box is null: the server then says which field needs a number. */
const num = (s: string): number | null => (s.trim() === "" || !Number.isFinite(Number(s)) ? null : Number(s));

/** Minutes and seconds as one number of seconds; both boxes empty is null. */
export function timeLimitSeconds(d: SettingsDraft): number | null {
  if (d.minutes.trim() === "" && d.seconds.trim() === "") return null;
  const [m, s] = [num(d.minutes || "0"), num(d.seconds || "0")];
  return m === null || s === null ? null : m * 60 + s;
}

export function fromSettingsDraft(d: SettingsDraft) {
  return {
    mode: d.mode,
    rankDecay: num(d.rankDecay),
    seniorityWeight: num(d.seniorityWeight),
    fairnessFloor: num(d.fairnessFloor),
    reserve: { min: num(d.reserveMin), max: num(d.reserveMax) },
    timeLimitSeconds: timeLimitSeconds(d),
  };
}

const box = "mt-1 block w-full rounded border border-slate-300 bg-white px-2 py-1.5 text-sm text-slate-900";
const short = (x: number) => String(Math.round(x * 100) / 100);

/** A label over its input (by id, so the input's name is the label alone), a hint and the field's error. */
function Field({ label, hint, error, children }: { label: string; hint?: string; error?: string; children?: (id: string) => React.ReactNode }) {
  const id = useId();
  return (
    <div className="space-y-1">
      {children ? (
        <label htmlFor={id} className="block text-sm font-medium text-slate-800">
          {label}
        </label>
      ) : (
        <p className="text-sm font-medium text-slate-800">{label}</p>
      )}
      {children?.(id)}
      {hint ? <p className="text-xs text-slate-600">{hint}</p> : null}
      {error ? (
        <p role="alert" className="text-sm text-red-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** A small label over one of two inputs side by side. */
function Part({ label, children }: { label: string; children: (id: string) => React.ReactNode }) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="text-xs text-slate-600">
        {label}
      </label>
      {children(id)}
    </div>
  );
}

/** Mode, seniority weighting, wish-rank weights, fairness floor (weighted balance only), reserve lines, time limit. */
export function AwardSettingsFields({ draft, errors, onChange }: { draft: SettingsDraft; errors: Record<string, string>; onChange: (d: SettingsDraft) => void }) {
  const set = (key: keyof SettingsDraft) => (e: React.ChangeEvent<HTMLInputElement>) => onChange({ ...draft, [key]: e.target.value });
  const decay = num(draft.rankDecay);
  const weights = decay !== null && decay > 0 && decay <= 1 ? [0, 1, 2, 3, 4].map((r) => decay ** r) : null;
  const seconds = timeLimitSeconds(draft);
  const balanced = draft.mode === "balanced";
  return (
    <div className="space-y-5">
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium text-slate-800">How the award is made</legend>
        <div className="grid gap-2 md:grid-cols-2">
          {MODE_CHOICES.map((m) => (
            <label key={m.value} className={`flex cursor-pointer items-start gap-2 rounded-md border p-3 text-sm ${draft.mode === m.value ? "border-sky-700 bg-sky-50" : "border-slate-200 bg-white"}`}>
              <input type="radio" name="mode" value={m.value} checked={draft.mode === m.value} onChange={() => onChange({ ...draft, mode: m.value })} className="mt-1" />
              <span>
                <span className="block font-medium">{m.label}</span>
                <span className="block text-slate-600">{m.explain}</span>
              </span>
            </label>
          ))}
        </div>
        {errors["settings.mode"] ? (
          <p role="alert" className="text-sm text-red-700">
            {errors["settings.mode"]}
          </p>
        ) : null}
      </fieldset>

      <div className="grid gap-4 md:grid-cols-2">
        <Field
          label="Seniority weighting β"
          hint={`In weighted balance the most senior crew member counts about ${seniorFactor(num(draft.seniorityWeight))} times the most junior; 0 counts everyone the same. Strict seniority follows the order itself.`}
          error={errors["settings.seniorityWeight"]}
        >
          {(id) => <input id={id} type="number" inputMode="decimal" step="any" min={0} value={draft.seniorityWeight} onChange={set("seniorityWeight")} className={box} />}
        </Field>
        <div className="space-y-1">
          <Field label="Rank decay" hint="Each wish counts this much of the wish ranked above it (above 0, at most 1)." error={errors["settings.rankDecay"]}>
            {(id) => <input id={id} type="number" inputMode="decimal" step="any" min={0} max={1} value={draft.rankDecay} onChange={set("rankDecay")} className={box} />}
          </Field>
          <div aria-label="Weights of wishes 1 to 5" role="group" className="flex flex-wrap gap-1.5 pt-1 text-xs">
            {weights
              ? weights.map((w, r) => (
                  <span key={r} className="rounded bg-slate-100 px-2 py-1 text-slate-700">
                    wish #{r + 1}: <span className="font-semibold">{short(w)}</span>
                  </span>
                ))
              : <span className="text-slate-500">Weights show once the rank decay is between 0 and 1.</span>}
          </div>
        </div>

        <Field
          label="Fairness floor"
          hint={balanced ? "Every crew member keeps at least this share (0 to 1) of their best line alone, where the trips allow. Empty: no floor." : "Used by weighted balance only; strict seniority keeps no floor."}
          error={errors["settings.fairnessFloor"]}
        >
          {balanced ? (id) => <input id={id} type="number" inputMode="decimal" step="any" min={0} max={1} placeholder="none" value={draft.fairnessFloor} onChange={set("fairnessFloor")} className={box} /> : undefined}
        </Field>

        <div className="space-y-1">
          <p className="text-sm font-medium text-slate-800">Reserve lines</p>
          <div className="grid grid-cols-2 gap-2">
            <Part label="At least">{(id) => <input id={id} type="number" inputMode="numeric" step={1} min={0} value={draft.reserveMin} onChange={set("reserveMin")} className={box} />}</Part>
            <Part label="At most">{(id) => <input id={id} type="number" inputMode="numeric" step={1} min={0} placeholder="no limit" value={draft.reserveMax} onChange={set("reserveMax")} className={box} />}</Part>
          </div>
          {[errors["settings.reserve.min"], errors["settings.reserve.max"], errors["settings.reserve"]].filter(Boolean).map((e) => (
            <p key={e} role="alert" className="text-sm text-red-700">
              {e}
            </p>
          ))}
        </div>

        <div className="space-y-1">
          <p className="text-sm font-medium text-slate-800">Time limit</p>
          <div className="grid grid-cols-2 gap-2">
            <Part label="Minutes">{(id) => <input id={id} type="number" inputMode="numeric" step={1} min={0} value={draft.minutes} onChange={set("minutes")} className={box} />}</Part>
            <Part label="Seconds">{(id) => <input id={id} type="number" inputMode="numeric" step="any" min={0} value={draft.seconds} onChange={set("seconds")} className={box} />}</Part>
          </div>
          <p className="text-xs text-slate-600">
            The engine stops then and keeps the best award found{seconds !== null ? ` (${seconds} s in all)` : ""}; at most 24 hours.
          </p>
          {errors["settings.timeLimitSeconds"] ? (
            <p role="alert" className="text-sm text-red-700">
              {errors["settings.timeLimitSeconds"]}
            </p>
          ) : null}
        </div>
      </div>
    </div>
  );
}

/** 1 + β: how many times the most senior counts against the most junior (1 + β(n − i)/n at both ends). */
function seniorFactor(beta: number | null): string {
  return beta === null || beta < 0 ? "1 + β" : short(1 + beta);
}
