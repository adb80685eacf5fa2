"use client";

import Link from "next/link";
import { useState } from "react";
import { upload, UploadResult, type UploadAnswer } from "../upload-result";

export function JsonImportForm({ limit }: { limit: string }) {
  const [answer, setAnswer] = useState<UploadAnswer & { periodId?: string }>();
  const [pending, setPending] = useState(false);
  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setPending(true);
    setAnswer(undefined);
    const result = await upload("/api/periods/import", new FormData(event.currentTarget));
    setAnswer({ ...result, periodId: typeof result.body?.periodId === "string" ? result.body.periodId : undefined });
    setPending(false);
  }
  return (
    <form onSubmit={submit} aria-label="Import a period from JSON" className="max-w-xl space-y-3 rounded-lg border border-slate-200 bg-white p-4">
      <label className="block text-sm font-medium" htmlFor="json-file">
        Period file (.json)
      </label>
      <input id="json-file" type="file" name="file" accept=".json,application/json" required className="block w-full text-sm file:mr-3 file:rounded-md file:border-0 file:bg-slate-100 file:px-3 file:py-1.5" />
      <p className="text-sm text-slate-600">
        A whole period as &ldquo;Export as JSON&rdquo; on a period&apos;s page writes it (or one award group of it). It becomes a new period with its base, stations, crew, trips, rule
        sets and settings, and any bids it holds; the same file again changes nothing. At most {limit}.
      </p>
      <button type="submit" disabled={pending} className="rounded-md bg-slate-900 px-3 py-1.5 text-sm font-semibold text-white hover:bg-slate-700 disabled:opacity-60">
        {pending ? "Importing…" : "Import period"}
      </button>
      <UploadResult answer={answer} />
      {answer?.ok && answer.periodId ? (
        <p>
          <Link href={`/planning/periods/${encodeURIComponent(answer.periodId)}`} className="text-sky-800 underline">
            Open the period
          </Link>
        </p>
      ) : null}
    </form>
  );
}
