"use client";

/** What an import route answered, shown to the scheduler: a message, and every problem as a table row. */
export interface UploadAnswer {
  ok: boolean;
  message: string;
  problems: Array<{ file?: string; line?: number; column?: string; message: string }>;
  total?: number;
}

/** Posts `form` to `url` and reads the route's JSON answer (a network failure is an answer too). */
export async function upload(url: string, form: FormData): Promise<UploadAnswer & { body?: Record<string, unknown> }> {
  try {
    const response = await fetch(url, { method: "POST", body: form });
    const body = (await response.json().catch(() => ({}))) as Record<string, unknown>;
    if (response.ok) return { ok: true, message: String(body.message ?? "Imported."), problems: [], body };
    return {
      ok: false,
      message: String(body.error ?? `The server refused the upload (HTTP ${response.status}).`),
      problems: (body.problems as UploadAnswer["problems"]) ?? [],
      total: typeof body.total === "number" ? body.total : undefined,
    };
  } catch {
    return { ok: false, message: "The upload did not reach the server; nothing was imported. Check the connection and try again.", problems: [] };
  }
}

export function UploadResult({ answer }: { answer: UploadAnswer | undefined }) {
  if (!answer) return null;
  return (
    <div className="space-y-2">
      <p role={answer.ok ? "status" : "alert"} className={`text-sm ${answer.ok ? "text-emerald-800" : "text-red-700"}`}>
        {answer.message}
      </p>
      {answer.problems.length > 0 ? (
        <div className="overflow-x-auto rounded-md border border-red-200">
          <table aria-label="Problems in the files" className="w-full text-left text-sm">
            <thead className="bg-red-50 text-xs uppercase tracking-wide text-red-900">
              <tr>
                <th className="px-2 py-1 font-medium max-sm:hidden">File</th>
                <th className="px-2 py-1 text-right font-medium max-sm:hidden">Line</th>
                <th className="px-2 py-1 font-medium max-sm:hidden">Column</th>
                <th className="px-2 py-1 font-medium">Problem</th>
              </tr>
            </thead>
            <tbody>
              {answer.problems.map((p, k) => (
                <tr key={k} className="border-t border-red-100">
                  <td className="whitespace-nowrap px-2 py-1 font-mono max-sm:hidden">{p.file ?? ""}</td>
                  <td className="px-2 py-1 text-right tabular-nums max-sm:hidden">{p.line ?? ""}</td>
                  <td className="px-2 py-1 font-mono max-sm:hidden">{p.column ?? ""}</td>
                  <td className="px-2 py-1">
                    {/* On a phone the place goes above the problem, as one line. */}
                    <span className="block font-mono text-red-900 sm:hidden">{[p.file, p.line === undefined ? undefined : `line ${p.line}`, p.column].filter(Boolean).join(" · ")}</span>
                    {p.message}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {answer.total && answer.total > answer.problems.length ? (
            <p className="px-2 py-1 text-sm text-red-900">
              The first {answer.problems.length} of {answer.total} problems are shown.
            </p>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
