"use client";

import Link from "next/link";
import { useCallback, useEffect, useRef, useState } from "react";
import canonicalize from "canonicalize";
import type { Wish, WishKind } from "@/lib/domain/wish";
import { wishSentence } from "@/lib/domain/wish-sentence";
import type { BidVersion, StoredDraft } from "@/lib/db/bids";
import { copyLastPeriodAction, saveDraftAction, submitBidAction, type SaveOutcome } from "./actions";
import { KIND_LABEL } from "./kind-label";
import { WishForm, type FormPeriod } from "./wish-form";
import { WishList, type Item } from "./wish-list";

interface Props {
  periodId: string;
  crewId: string;
  zone: string;
  draft: StoredDraft;
  versions: BidVersion[];
  closed: boolean;
  previousPeriod: string | null;
  added: string | null;
  /** rank of a wish just made from the trip list's filters */
  madeFromFilters: number | null;
  period: FormPeriod;
}

type Status =
  | { kind: "saved" }
  | { kind: "pending" }
  | { kind: "saving" }
  | { kind: "offline" }
  | { kind: "invalid"; message: string }
  | { kind: "refused"; message: string }
  | { kind: "conflict"; stored: StoredDraft };

/** What the phone keeps until the server confirms a save. */
interface LocalCopy {
  baseRevision: number;
  wishes: Wish[];
}

let nextKey = 0;
const keyed = (wishes: Wish[]): Item[] => wishes.map((wish) => ({ key: `w${++nextKey}`, wish }));
// RFC 8785 text compares wishes whatever order their keys came in (lib/domain/hash.ts is server-only).
const same = (a: Wish[], b: Wish[]) => canonicalize(a) === canonicalize(b);

const when = (iso: string, zone: string) =>
  new Date(iso).toLocaleString("en-US", { month: "short", day: "numeric", hour: "2-digit", minute: "2-digit", hourCycle: "h23", timeZone: zone, timeZoneName: "short" });

/**
 * The bid page's working state. Every change is kept on the phone at once
 * (localStorage) and saved to the server shortly after, naming the revision
 * it started from; the local copy is dropped only when the server confirms.
 * A save the server refuses as stale shows both versions and waits for the
 * crew member to choose.
 */
export function BidEditor(props: Props) {
  const storageKey = `bidwright:draft:${props.periodId}:${props.crewId}`;
  const [items, setItems] = useState<Item[]>(() => keyed(props.draft.wishes));
  const [status, setStatus] = useState<Status>({ kind: "saved" });
  const [revision, setRevision] = useState(props.draft.revision);
  const [savedAt, setSavedAt] = useState(props.draft.savedAt);
  const [versions, setVersions] = useState(props.versions);
  const [receipt, setReceipt] = useState<{ version: BidVersion; unchanged: boolean } | null>(null);
  const [editing, setEditing] = useState<{ key: string | null; kind: WishKind } | null>(null);
  const [picking, setPicking] = useState(false);
  const [note, setNote] = useState<string | null>(() => {
    if (props.added) return `Trip ${props.added} was added at the end of your bid.`;
    const made = props.madeFromFilters ? props.draft.wishes[props.madeFromFilters - 1] : undefined;
    return made ? `Your trip filters became wish ${props.madeFromFilters}: “${wishSentence(made)}”.` : null;
  });
  const [problems, setProblems] = useState<Record<number, string>>({});
  const [submitting, setSubmitting] = useState(false);

  // The latest values for the save loop, which runs outside React's render.
  const state = useRef({ wishes: props.draft.wishes, revision: props.draft.revision, inFlight: false, again: false, blocked: false });
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  const keepLocal = useCallback(
    (wishes: Wish[], baseRevision: number) => {
      try {
        localStorage.setItem(storageKey, JSON.stringify({ baseRevision, wishes } satisfies LocalCopy));
      } catch {
        // A full or disabled storage only loses the offline copy, never the server's.
      }
    },
    [storageKey],
  );

  const applyOutcome = useCallback(
    (sent: Wish[], outcome: SaveOutcome) => {
      const s = state.current;
      if (outcome.status === "saved") {
        s.revision = outcome.draft.revision;
        setRevision(outcome.draft.revision);
        setSavedAt(outcome.draft.savedAt);
        setProblems({});
        if (same(sent, s.wishes)) {
          localStorage.removeItem(storageKey);
          setStatus({ kind: "saved" });
        } else {
          keepLocal(s.wishes, s.revision);
          s.again = true;
        }
        return;
      }
      s.blocked = true;
      if (outcome.status === "conflict") setStatus({ kind: "conflict", stored: outcome.stored });
      else if (outcome.status === "invalid") {
        const byRank: Record<number, string> = {};
        for (const issue of outcome.issues) if (typeof issue.path[0] === "number") byRank[issue.path[0]] ??= issue.message.charAt(0).toUpperCase() + issue.message.slice(1);
        setProblems(byRank);
        setStatus({ kind: "invalid", message: outcome.message });
      } else setStatus({ kind: "refused", message: outcome.message });
    },
    [keepLocal, storageKey],
  );

  const save = useCallback(async (): Promise<boolean> => {
    const s = state.current;
    // This save sends the latest wishes: a retry or debounce still waiting (say, from before the connection came back) would only repeat it.
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    if (s.blocked) return false;
    if (s.inFlight) {
      s.again = true;
      return false;
    }
    s.inFlight = true;
    setStatus({ kind: "saving" });
    const sent = s.wishes;
    try {
      const outcome = await saveDraftAction({ periodId: props.periodId, baseRevision: s.revision, wishes: sent });
      applyOutcome(sent, outcome);
      return outcome.status === "saved";
    } catch {
      // No answer (offline, server away): the copy on the phone stays; try again soon.
      setStatus({ kind: "offline" });
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void save(), 5000);
      return false;
    } finally {
      s.inFlight = false;
      if (s.again && !s.blocked) {
        s.again = false;
        void save();
      }
    }
  }, [applyOutcome, props.periodId]);

  const change = useCallback(
    (next: Item[]) => {
      setItems(next);
      setNote(null);
      // The receipt is of the version submitted; a changed draft is not it any more (the receipt stays under versions).
      setReceipt(null);
      const s = state.current;
      s.wishes = next.map((i) => i.wish);
      keepLocal(s.wishes, s.revision);
      if (s.blocked && status.kind !== "conflict") s.blocked = false;
      if (s.blocked) return;
      setStatus({ kind: "pending" });
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void save(), 600);
    },
    [keepLocal, save, status.kind],
  );

  // On load: a copy left on the phone by a save that never got through.
  useEffect(() => {
    let local: LocalCopy | null = null;
    try {
      local = JSON.parse(localStorage.getItem(storageKey) ?? "null") as LocalCopy | null;
    } catch {
      local = null;
    }
    if (!local || !Array.isArray(local.wishes) || same(local.wishes, props.draft.wishes)) {
      localStorage.removeItem(storageKey);
      return;
    }
    const s = state.current;
    s.wishes = local.wishes;
    setItems(keyed(local.wishes));
    if (local.baseRevision === props.draft.revision) {
      setNote("Changes kept on this phone while it was offline are being saved now.");
      void save();
    } else {
      s.blocked = true;
      setStatus({ kind: "conflict", stored: props.draft });
    }
    // Only once, for the draft the page was rendered with.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  useEffect(() => {
    const online = () => {
      if (state.current.wishes !== undefined && !state.current.blocked && localStorage.getItem(storageKey)) void save();
    };
    window.addEventListener("online", online);
    return () => window.removeEventListener("online", online);
  }, [save, storageKey]);

  function resolve(keep: "mine" | "theirs") {
    if (status.kind !== "conflict") return;
    const s = state.current;
    s.blocked = false;
    s.revision = status.stored.revision;
    setRevision(status.stored.revision);
    if (keep === "theirs") {
      s.wishes = status.stored.wishes;
      setItems(keyed(status.stored.wishes));
      localStorage.removeItem(storageKey);
      setStatus({ kind: "saved" });
      setSavedAt(status.stored.savedAt);
    } else {
      keepLocal(s.wishes, s.revision);
      void save();
    }
  }

  async function submit() {
    setSubmitting(true);
    setReceipt(null);
    try {
      const s = state.current;
      if (timer.current) clearTimeout(timer.current);
      if (localStorage.getItem(storageKey) || status.kind !== "saved") {
        while (s.inFlight) await new Promise((r) => setTimeout(r, 100));
        if (!(await save())) return;
      }
      const outcome = await submitBidAction({ periodId: props.periodId, revision: s.revision });
      if (outcome.status === "submitted") {
        setReceipt(outcome);
        setVersions((old) => (old.some((v) => v.id === outcome.version.id) ? old : [outcome.version, ...old]));
      } else if (outcome.status === "conflict") {
        s.blocked = true;
        setStatus({ kind: "conflict", stored: outcome.stored });
      } else setStatus({ kind: outcome.status, message: outcome.message });
    } catch {
      setStatus({ kind: "offline" });
    } finally {
      setSubmitting(false);
    }
  }

  async function copyLast() {
    const s = state.current;
    const outcome = await copyLastPeriodAction({ periodId: props.periodId, baseRevision: s.revision });
    if (outcome.status === "saved") {
      s.wishes = outcome.draft.wishes;
      s.revision = outcome.draft.revision;
      setItems(keyed(outcome.draft.wishes));
      setRevision(outcome.draft.revision);
      setSavedAt(outcome.draft.savedAt);
      setNote(outcome.note ?? null);
      setStatus({ kind: "saved" });
    } else applyOutcome(s.wishes, outcome);
  }

  const disabled = props.closed || status.kind === "conflict";
  const latest = versions[0];
  const unsubmitted = !latest || latest.revision !== revision || status.kind !== "saved";
  const editingItem = editing?.key ? items.find((i) => i.key === editing.key) : undefined;

  return (
    <div className="pb-28">
      <SaveStatus status={status} revision={revision} savedAt={savedAt} zone={props.zone} />
      {note ? (
        <p className="mt-2 rounded-md bg-sky-50 px-3 py-2 text-sm text-sky-950" role="status">
          {note}
        </p>
      ) : null}
      {status.kind === "conflict" ? <Conflict mine={items.map((i) => i.wish)} stored={status.stored} zone={props.zone} onChoose={resolve} /> : null}
      {receipt ? <Receipt version={receipt.version} unchanged={receipt.unchanged} zone={props.zone} /> : null}
      {latest && unsubmitted && !receipt && status.kind !== "conflict" ? (
        <p className="mt-2 rounded-md border border-amber-700 bg-amber-50 px-3 py-2 text-sm font-medium text-amber-950" data-unsubmitted>
          You have changes since version {latest.version}. Until you submit them, version {latest.version} is the bid that counts.
        </p>
      ) : null}

      {editing ? (
        <div className="mt-4 rounded-lg border border-sky-800 bg-white px-4 py-4">
          <WishForm
            kind={editing.kind}
            period={props.period}
            initial={editingItem?.wish ?? null}
            onCancel={() => setEditing(null)}
            onDone={(wish) => {
              change(editing.key ? items.map((i) => (i.key === editing.key ? { ...i, wish } : i)) : [...items, ...keyed([wish])]);
              setEditing(null);
            }}
          />
        </div>
      ) : (
        <WishList
          items={items}
          disabled={disabled}
          problems={problems}
          onReorder={change}
          onEdit={(key) => setEditing({ key, kind: items.find((i) => i.key === key)!.wish.kind })}
          onDuplicate={(key) => {
            const k = items.findIndex((i) => i.key === key);
            change([...items.slice(0, k + 1), ...keyed([items[k]!.wish]), ...items.slice(k + 1)]);
          }}
          onRemove={(key) => change(items.filter((i) => i.key !== key))}
        />
      )}

      {picking && !editing ? (
        <div className="mt-4 rounded-lg border border-slate-300 bg-white px-4 py-4">
          <h2 className="text-lg font-semibold">What kind of wish?</h2>
          <div className="mt-3 grid grid-cols-2 gap-2">
            {(Object.keys(KIND_LABEL) as WishKind[]).map((kind) => (
              <button
                key={kind}
                type="button"
                onClick={() => {
                  setPicking(false);
                  setEditing({ key: null, kind });
                }}
                className="min-h-14 rounded-md border border-slate-400 bg-slate-50 px-3 text-left text-base font-medium"
              >
                {KIND_LABEL[kind]}
              </button>
            ))}
          </div>
          <button type="button" onClick={() => setPicking(false)} className="mt-3 min-h-11 rounded-md border border-slate-400 px-4 text-base">
            Cancel
          </button>
        </div>
      ) : null}

      {props.previousPeriod && items.length === 0 && !props.closed ? (
        <button type="button" onClick={() => void copyLast()} className="mt-4 min-h-12 w-full rounded-md border border-sky-800 px-4 text-base font-medium text-sky-900">
          Start from my {props.previousPeriod} bid
        </button>
      ) : null}

      <Versions versions={versions} zone={props.zone} />

      {!editing ? (
        <div className="fixed inset-x-0 bottom-0 z-20 border-t border-slate-300 bg-white/95 px-4 py-3 backdrop-blur">
          <div className="mx-auto flex max-w-5xl gap-3">
            <button
              type="button"
              disabled={disabled}
              onClick={() => setPicking(true)}
              className="min-h-12 flex-1 rounded-md border border-sky-800 bg-white px-3 text-base font-semibold text-sky-900 disabled:opacity-50"
            >
              Add a wish
            </button>
            <button
              type="button"
              disabled={disabled || submitting || items.length === 0 || !unsubmitted || status.kind === "invalid"}
              onClick={() => void submit()}
              className="min-h-12 flex-1 whitespace-nowrap rounded-md bg-sky-800 px-2 text-base font-semibold text-white hover:bg-sky-900 disabled:opacity-50"
            >
              {submitting ? "Submitting…" : latest && !unsubmitted ? "Submitted" : latest ? "Submit changes" : "Submit bid"}
            </button>
          </div>
        </div>
      ) : null}
    </div>
  );
}

function SaveStatus({ status, revision, savedAt, zone }: { status: Status; revision: number; savedAt: string | null; zone: string }) {
  const text =
    status.kind === "saved"
      ? revision === 0
        ? "Nothing saved yet."
        : `Draft saved (revision ${revision}${savedAt ? `, ${when(savedAt, zone)}` : ""}).`
      : status.kind === "pending" || status.kind === "saving"
        ? "Saving…"
        : status.kind === "offline"
          ? "No connection: your changes are kept on this phone and will be saved when it is back."
          : status.kind === "conflict"
            ? "Not saved: this bid was changed on another device."
            : status.kind === "refused"
              ? status.message
              : `Not saved: ${status.message}`;
  const bad = status.kind === "invalid" || status.kind === "refused" || status.kind === "conflict";
  return (
    <p role="status" data-save-status={status.kind} className={`mt-2 text-sm ${bad ? "font-medium text-red-800" : status.kind === "offline" ? "font-medium text-amber-900" : "text-slate-700"}`}>
      {text}
    </p>
  );
}

function Conflict({ mine, stored, zone, onChoose }: { mine: Wish[]; stored: StoredDraft; zone: string; onChoose: (keep: "mine" | "theirs") => void }) {
  const list = (wishes: Wish[]) =>
    wishes.length === 0 ? (
      <p className="text-sm text-slate-700">No wishes.</p>
    ) : (
      <ol className="list-decimal space-y-1 pl-5 text-sm">
        {wishes.map((w, k) => (
          <li key={k}>{wishSentence(w)}</li>
        ))}
      </ol>
    );
  return (
    <section role="alert" aria-label="Changed on another device" className="mt-3 rounded-lg border-2 border-red-700 bg-white px-4 py-3">
      <h2 className="text-lg font-semibold text-red-900">Your bid was changed on another device</h2>
      <p className="mt-1 text-sm">Nothing has been overwritten. Choose which version to keep; you can edit it afterwards.</p>
      <div className="mt-3 grid gap-3 sm:grid-cols-2">
        <div className="rounded-md bg-slate-100 px-3 py-2" data-version="theirs">
          <h3 className="text-sm font-semibold">Saved from the other device (revision {stored.revision}{stored.savedAt ? `, ${when(stored.savedAt, zone)}` : ""})</h3>
          {list(stored.wishes)}
        </div>
        <div className="rounded-md bg-sky-50 px-3 py-2" data-version="mine">
          <h3 className="text-sm font-semibold">On this device, not saved</h3>
          {list(mine)}
        </div>
      </div>
      <div className="mt-3 flex flex-col gap-2 sm:flex-row">
        <button type="button" onClick={() => onChoose("theirs")} className="min-h-12 flex-1 rounded-md border border-slate-500 bg-white px-3 text-base font-medium">
          Use the other device&apos;s version
        </button>
        <button type="button" onClick={() => onChoose("mine")} className="min-h-12 flex-1 rounded-md bg-sky-800 px-3 text-base font-semibold text-white">
          Keep this device&apos;s version
        </button>
      </div>
    </section>
  );
}

function Receipt({ version, unchanged, zone }: { version: BidVersion; unchanged: boolean; zone: string }) {
  return (
    <section role="status" aria-label="Receipt" className="mt-3 rounded-lg border-2 border-emerald-800 bg-emerald-50 px-4 py-3 text-emerald-950">
      <h2 className="text-lg font-semibold">{unchanged ? `Already submitted as version ${version.version}` : `Submitted: version ${version.version}`}</h2>
      <dl className="mt-1 space-y-1 text-sm">
        <div>
          <dt className="inline font-medium">Receipt code: </dt>
          <dd className="inline font-mono text-base font-semibold" data-receipt-code>
            {version.receiptCode}
          </dd>
        </div>
        <div>
          <dt className="inline font-medium">Submitted: </dt>
          <dd className="inline">{when(version.submittedAt, zone)}</dd>
        </div>
        <div>
          <dt className="font-medium">Content hash (SHA-256 of the bid&apos;s canonical JSON):</dt>
          <dd className="break-all font-mono text-xs" data-receipt-hash>
            {version.hash}
          </dd>
        </div>
      </dl>
    </section>
  );
}

function Versions({ versions, zone }: { versions: BidVersion[]; zone: string }) {
  if (versions.length === 0) return null;
  return (
    <section className="mt-6" aria-labelledby="versions-heading">
      <h2 id="versions-heading" className="text-lg font-semibold">
        Submitted versions
      </h2>
      <ul className="mt-2 divide-y divide-slate-200 rounded-lg border border-slate-300 bg-white">
        {versions.map((v) => (
          <li key={v.id}>
            <Link href={`/bid/versions/${v.id}`} className="flex min-h-12 flex-wrap items-center justify-between gap-x-3 px-4 py-2 text-base" data-version-row={v.version}>
              <span className="font-medium">
                Version {v.version}
                {v.id === versions[0]!.id ? <span className="ml-2 rounded bg-emerald-800 px-1.5 py-0.5 text-xs font-medium text-white">counts</span> : null}
              </span>
              <span className="font-mono text-sm">{v.receiptCode}</span>
              <span className="text-sm text-slate-700">{when(v.submittedAt, zone)}</span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
