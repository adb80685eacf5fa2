"use client";

import { useId, useState } from "react";
import type { TripFilter } from "@/lib/domain/trip-filter";
import { wishSchema, type Wish, type WishKind } from "@/lib/domain/wish";
import { KIND_LABEL } from "./kind-label";


const WEEKDAYS = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];
const input = "mt-1 block w-full rounded-md border bg-white px-3 py-2.5 text-base";
const border = (bad: boolean) => (bad ? "border-red-700 ring-1 ring-red-700" : "border-slate-400");

/** Everything the form holds, as typed: text until it is read into a wish. */
interface Fields {
  pairingIds: string;
  count: string;
  lengthMin: string;
  lengthMax: string;
  layoverAt: string;
  reportAfter: string;
  reportBefore: string;
  releaseBefore: string;
  releaseAfter: string;
  daysOfWeek: number[];
  minCreditPerDutyDay: string;
  maxLegsPerDuty: string;
  redEye: "" | "yes" | "no";
  deadhead: "" | "yes" | "no";
  ranges: { from: string; to: string }[];
  maxDaysOn: string;
  weekendsOff: boolean;
  minHours: string;
  maxHours: string;
  crewId: string;
}

const hoursText = (m: number | undefined) => (m === undefined ? "" : String(Math.round((m / 60) * 100) / 100));
const numText = (n: number | undefined) => (n === undefined ? "" : String(n));
const tri = (b: boolean | undefined): "" | "yes" | "no" => (b === undefined ? "" : b ? "yes" : "no");

function rangesOf(dates: readonly string[]): { from: string; to: string }[] {
  const out: { from: string; to: string }[] = [];
  for (const d of [...dates].sort()) {
    const last = out.at(-1);
    const next = last ? new Date(Date.parse(`${last.to}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10) : "";
    if (last && next === d) last.to = d;
    else out.push({ from: d, to: d });
  }
  return out.length ? out : [{ from: "", to: "" }];
}

function fieldsOf(wish: Wish | null): Fields {
  const f: TripFilter | undefined = wish && (wish.kind === "trip" || wish.kind === "no-trip") ? wish.filter : undefined;
  return {
    pairingIds: wish && (wish.kind === "trip" || wish.kind === "no-trip") ? (wish.pairingIds ?? []).join(", ") : "",
    count: wish?.kind === "trip" ? String(wish.count) : "1",
    lengthMin: numText(f?.lengthDays?.min),
    lengthMax: numText(f?.lengthDays?.max),
    layoverAt: (f?.layoverAt ?? []).join(", "),
    reportAfter: f?.reportAfter ?? "",
    reportBefore: f?.reportBefore ?? "",
    releaseBefore: f?.releaseBefore ?? "",
    releaseAfter: f?.releaseAfter ?? "",
    daysOfWeek: f?.daysOfWeek ?? [],
    minCreditPerDutyDay: hoursText(f?.minCreditPerDutyDay),
    maxLegsPerDuty: numText(f?.maxLegsPerDuty),
    redEye: tri(f?.redEye),
    deadhead: tri(f?.deadhead),
    ranges: wish?.kind === "free-days" ? rangesOf(wish.dates) : [{ from: "", to: "" }],
    maxDaysOn: wish?.kind === "rhythm" ? numText(wish.maxDaysOn) : "",
    weekendsOff: wish?.kind === "rhythm" ? wish.weekendsOff === true : false,
    minHours: wish?.kind === "credit" ? hoursText(wish.minMinutes) : "",
    maxHours: wish?.kind === "credit" ? hoursText(wish.maxMinutes) : "",
    crewId: wish?.kind === "buddy" ? wish.crewId : "",
  };
}

type Errors = Record<string, string>;

/** What the form checks against besides the schema: the period's days and trip numbers (the server checks the same, lib/db/bid-check.ts). */
export interface FormPeriod {
  name: string;
  startDate: string;
  endDate: string;
  tripCodes: string[];
}

/**
 * Reads the fields into a wish with lib/domain's wishSchema (the schema the
 * server checks with too); a field that is wrong gets its message under it.
 */
function readWish(kind: WishKind, v: Fields, period: FormPeriod): { wish?: Wish; errors: Errors } {
  const errors: Errors = {};
  const list = (text: string) => text.split(/[\s,;]+/).map((s) => s.trim().toUpperCase()).filter(Boolean);
  const num = (key: string, text: string, scale = 1): number | undefined => {
    if (text.trim() === "") return undefined;
    const n = Number(text.replace(",", "."));
    if (Number.isNaN(n)) {
      errors[key] = scale === 60 ? "enter hours as a number, such as 75 or 75.5" : "enter a whole number";
      return undefined;
    }
    return Math.round(n * scale);
  };
  let raw: Record<string, unknown> = { kind };
  if (kind === "trip" || kind === "no-trip") {
    const ids = list(v.pairingIds);
    const known = new Set(period.tripCodes);
    const unknown = ids.filter((id) => !known.has(id));
    if (unknown.length > 0) errors.pairingIds = `There is no trip ${unknown.join(", ")} in ${period.name}`;
    const filter: Record<string, unknown> = {};
    const lo = num("filter.lengthDays", v.lengthMin);
    const hi = num("filter.lengthDays", v.lengthMax);
    if (lo !== undefined || hi !== undefined) filter.lengthDays = { ...(lo !== undefined && { min: lo }), ...(hi !== undefined && { max: hi }) };
    if (list(v.layoverAt).length) filter.layoverAt = list(v.layoverAt);
    for (const key of ["reportAfter", "reportBefore", "releaseBefore", "releaseAfter"] as const) if (v[key]) filter[key] = v[key];
    if (v.daysOfWeek.length) filter.daysOfWeek = [...v.daysOfWeek].sort();
    const perDay = num("filter.minCreditPerDutyDay", v.minCreditPerDutyDay, 60);
    if (perDay !== undefined) filter.minCreditPerDutyDay = perDay;
    const legs = num("filter.maxLegsPerDuty", v.maxLegsPerDuty);
    if (legs !== undefined) filter.maxLegsPerDuty = legs;
    if (v.redEye) filter.redEye = v.redEye === "yes";
    if (v.deadhead) filter.deadhead = v.deadhead === "yes";
    raw = { kind, ...(ids.length && { pairingIds: ids }), ...(Object.keys(filter).length && { filter }) };
    if (kind === "trip") raw.count = num("count", v.count) ?? 1;
  } else if (kind === "free-days") {
    const dates: string[] = [];
    v.ranges.forEach((r, k) => {
      if (!r.from && !r.to) return;
      const from = r.from || r.to;
      const to = r.to || r.from;
      if (to < from) {
        errors[`ranges.${k}`] = "the last day is before the first";
        return;
      }
      for (let t = Date.parse(`${from}T00:00:00Z`); t <= Date.parse(`${to}T00:00:00Z`) && dates.length <= 62; t += 86_400_000) {
        dates.push(new Date(t).toISOString().slice(0, 10));
      }
    });
    const outside = v.ranges.findIndex((r) => [r.from, r.to].some((d) => d && (d < period.startDate || d > period.endDate)));
    if (outside >= 0) errors[`ranges.${outside}`] ??= `Choose days of ${period.name} (${period.startDate} to ${period.endDate})`;
    raw = { kind, dates };
  } else if (kind === "rhythm") {
    raw = { kind, ...(v.maxDaysOn.trim() && { maxDaysOn: num("maxDaysOn", v.maxDaysOn) }), ...(v.weekendsOff && { weekendsOff: true }) };
  } else if (kind === "credit") {
    const lo = num("minMinutes", v.minHours, 60);
    const hi = num("maxMinutes", v.maxHours, 60);
    raw = { kind, ...(lo !== undefined && { minMinutes: lo }), ...(hi !== undefined && { maxMinutes: hi }) };
  } else {
    raw = { kind, crewId: v.crewId.trim() };
  }
  const parsed = wishSchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const path = issue.path.filter((p) => typeof p === "string").join(".");
      errors[path] ??= issue.message;
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { errors };
  return { wish: parsed.data, errors };
}

/** The form that adds or edits one wish. */
export function WishForm({ kind, period, initial, onDone, onCancel }: { kind: WishKind; period: FormPeriod; initial: Wish | null; onDone: (wish: Wish) => void; onCancel: () => void }) {
  const [v, setV] = useState<Fields>(() => fieldsOf(initial));
  const [errors, setErrors] = useState<Errors>({});
  const id = useId();
  const set = <K extends keyof Fields>(key: K, value: Fields[K]) => setV((old) => ({ ...old, [key]: value }));
  const formError = errors[""];

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const { wish, errors: found } = readWish(kind, v, period);
    setErrors(found);
    if (wish) onDone(wish);
  }

  const text = (key: keyof Fields, errorKey: string, label: string, extra: React.InputHTMLAttributes<HTMLInputElement> = {}, hint?: string) => (
    <Field id={`${id}-${key}`} label={label} error={errors[errorKey]} hint={hint}>
      <input
        id={`${id}-${key}`}
        value={v[key] as string}
        onChange={(e) => set(key, e.target.value as never)}
        aria-invalid={errors[errorKey] ? true : undefined}
        aria-describedby={errors[errorKey] ? `${id}-${key}-error` : undefined}
        className={`${input} ${border(!!errors[errorKey])}`}
        {...extra}
      />
    </Field>
  );
  const triSelect = (key: "redEye" | "deadhead", label: string, yes: string, no: string) => (
    <Field id={`${id}-${key}`} label={label}>
      <select id={`${id}-${key}`} value={v[key]} onChange={(e) => set(key, e.target.value as Fields["redEye"])} className={`${input} ${border(false)}`}>
        <option value="">Either</option>
        <option value="yes">{yes}</option>
        <option value="no">{no}</option>
      </select>
    </Field>
  );

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={`${initial ? "Edit" : "New"} wish: ${KIND_LABEL[kind]}`}>
      <h2 className="text-lg font-semibold">{KIND_LABEL[kind]}</h2>
      {formError ? (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm text-red-900">
          {capital(formError)}
        </p>
      ) : null}
      {kind === "trip" || kind === "no-trip" ? (
        <>
          {text("pairingIds", "pairingIds", "Trip numbers", { autoCapitalize: "characters", placeholder: "e.g. T104, T112" }, "Name trips, describe them below, or both.")}
          <fieldset className={`rounded-lg border px-3 py-3 ${errors.filter ? "border-red-700" : "border-slate-300"}`}>
            <legend className="px-1 text-sm font-semibold">Trips like this</legend>
            {errors.filter ? (
              <p className="mb-2 text-sm text-red-800" role="alert">
                {capital(errors.filter)}
              </p>
            ) : null}
            <div className="grid grid-cols-2 gap-3">
              {text("lengthMin", "filter.lengthDays", "Days, at least", { inputMode: "numeric" })}
              {text("lengthMax", "filter.lengthDays", "Days, at most", { inputMode: "numeric" })}
            </div>
            <div className="mt-3">{text("layoverAt", "filter.layoverAt", "Layover at (stations)", { autoCapitalize: "characters", placeholder: "e.g. PLM, EMR" })}</div>
            <div className="mt-3 grid grid-cols-2 gap-3">
              {text("reportAfter", "filter.reportAfter", "Report at or after", { type: "time" })}
              {text("reportBefore", "filter.reportBefore", "Report before", { type: "time" })}
              {text("releaseBefore", "filter.releaseBefore", "Release by", { type: "time" })}
              {text("releaseAfter", "filter.releaseAfter", "Release after", { type: "time" })}
            </div>
            <fieldset className="mt-3">
              <legend className="text-sm font-medium">Touches any of these days</legend>
              <div className="mt-1 flex flex-wrap gap-2">
                {WEEKDAYS.map((d, k) => {
                  const on = v.daysOfWeek.includes(k + 1);
                  return (
                    <button
                      key={d}
                      type="button"
                      aria-pressed={on}
                      onClick={() => set("daysOfWeek", on ? v.daysOfWeek.filter((x) => x !== k + 1) : [...v.daysOfWeek, k + 1])}
                      className={`min-h-11 min-w-11 rounded-md border px-2 text-base ${on ? "border-sky-800 bg-sky-800 text-white" : "border-slate-400 bg-white"}`}
                    >
                      {d}
                    </button>
                  );
                })}
              </div>
            </fieldset>
            <div className="mt-3 grid grid-cols-2 gap-3">
              {text("minCreditPerDutyDay", "filter.minCreditPerDutyDay", "Credit per duty day, at least (h)", { inputMode: "decimal" })}
              {text("maxLegsPerDuty", "filter.maxLegsPerDuty", "Legs per duty, at most", { inputMode: "numeric" })}
              {triSelect("redEye", "Red-eye", "With a red-eye", "No red-eyes")}
              {triSelect("deadhead", "Deadhead", "With a deadhead", "No deadheads")}
            </div>
          </fieldset>
          {kind === "trip" ? text("count", "count", "How many such trips", { inputMode: "numeric" }) : null}
        </>
      ) : null}
      {kind === "free-days" ? (
        <fieldset>
          <legend className="text-sm font-medium">Dates to keep free (base local)</legend>
          {v.ranges.map((r, k) => (
            <div key={k} className="mt-2 grid grid-cols-2 gap-3">
              <Field id={`${id}-from-${k}`} label="First day" error={k === 0 ? errors.dates : undefined}>
                <input
                  id={`${id}-from-${k}`}
                  type="date"
                  min={period.startDate}
                  max={period.endDate}
                  value={r.from}
                  aria-invalid={errors[`ranges.${k}`] || errors.dates ? true : undefined}
                  onChange={(e) => set("ranges", v.ranges.map((x, j) => (j === k ? { ...x, from: e.target.value } : x)))}
                  className={`${input} ${border(!!errors[`ranges.${k}`] || !!errors.dates)}`}
                />
              </Field>
              <Field id={`${id}-to-${k}`} label="Last day" error={errors[`ranges.${k}`]}>
                <input
                  id={`${id}-to-${k}`}
                  type="date"
                  min={period.startDate}
                  max={period.endDate}
                  value={r.to}
                  aria-invalid={errors[`ranges.${k}`] ? true : undefined}
                  onChange={(e) => set("ranges", v.ranges.map((x, j) => (j === k ? { ...x, to: e.target.value } : x)))}
                  className={`${input} ${border(!!errors[`ranges.${k}`])}`}
                />
              </Field>
            </div>
          ))}
          <button type="button" onClick={() => set("ranges", [...v.ranges, { from: "", to: "" }])} className="mt-2 min-h-11 rounded-md border border-slate-400 px-3 text-base">
            Add more dates
          </button>
        </fieldset>
      ) : null}
      {kind === "rhythm" ? (
        <>
          {text("maxDaysOn", "maxDaysOn", "At most this many days on in a row", { inputMode: "numeric" })}
          <label className="flex min-h-11 items-center gap-3 text-base">
            <input type="checkbox" checked={v.weekendsOff} onChange={(e) => set("weekendsOff", e.target.checked)} className="h-6 w-6" />
            Keep weekends free
          </label>
        </>
      ) : null}
      {kind === "credit" ? (
        <div className="grid grid-cols-2 gap-3">
          {text("minHours", "minMinutes", "At least (hours)", { inputMode: "decimal" })}
          {text("maxHours", "maxMinutes", "At most (hours)", { inputMode: "decimal" })}
        </div>
      ) : null}
      {kind === "buddy" ? text("crewId", "crewId", "Colleague's employee number", { inputMode: "numeric" }, "Counts only if they name you too, in the same position and base.") : null}
      <div className="flex gap-3">
        <button type="submit" className="min-h-12 flex-1 rounded-md bg-sky-800 px-4 text-base font-semibold text-white hover:bg-sky-900">
          {initial ? "Save wish" : "Add wish"}
        </button>
        <button type="button" onClick={onCancel} className="min-h-12 rounded-md border border-slate-400 px-4 text-base">
          Cancel
        </button>
      </div>
    </form>
  );
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

function Field({ id, label, error, hint, children }: { id: string; label: string; error?: string | undefined; hint?: string | undefined; children: React.ReactNode }) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium text-slate-900">
        {label}
      </label>
      {hint ? <p className="text-sm text-slate-700">{hint}</p> : null}
      {children}
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm font-medium text-red-800">
          {capital(error)}
        </p>
      ) : null}
    </div>
  );
}
