"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { upload, UploadResult, type UploadAnswer } from "../../../upload-result";

const FILES = ["trips", "legs", "crew", "activities"] as const;

/** The four CSV files, each with its template; sent together to the import route, which takes them all or none. */
export function ImportForm({ periodId, help, limit }: { periodId: string; help: Record<string, string>; limit: string }) {
  const router = useRouter();
  const [answer, setAnswer] = useState<UploadAnswer | undefined>();
  const [pending, setPending] = useState(false);
  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setPending(true);
    setAnswer(undefined);
    const result = await upload(`/api/periods/${periodId}/import`, new FormData(event.currentTarget));
    setAnswer(result);
    setPending(false);
    if (result.ok) router.refresh();
  }
  return (
    <form onSubmit={submit} aria-label="Import CSV files" className="space-y-4 rounded-lg border border-slate-200 bg-white p-4">
      <div className="grid gap-4 md:grid-cols-2">
        {FILES.map((f) => (
          <div key={f} className="space-y-1">
            <label className="block text-sm font-medium" htmlFor={`file-${f}`}>
              {f}.csv
            </label>
            <input id={`file-${f}`} type="file" name={f} accept=".csv,text/csv" className="block w-full text-sm file:mr-3 file:rounded-md file:border-0 file:bg-slate-100 file:px-3 file:py-1.5" />
            <p className="text-xs text-slate-600">
              {help[`${f}.csv`]}{" "}
              <a href={`/api/import-templates/${f}.csv`} className="text-sky-800 underline">
                Template
              </a>
            </p>
          </div>
        ))}
      </div>
      <p className="text-sm text-slate-600">
        Trips and legs go together; crew and activities may come on their own. The files describe the period as it should be: trips not in trips.csv are removed, and
        importing the same files again changes nothing. Any problem in any file stops the whole import. Each file may be at most {limit}.
      </p>
      <button type="submit" disabled={pending} className="rounded-md bg-slate-900 px-3 py-1.5 text-sm font-semibold text-white hover:bg-slate-700 disabled:opacity-60">
        {pending ? "Importing…" : "Import files"}
      </button>
      <UploadResult answer={answer} />
    </form>
  );
}
