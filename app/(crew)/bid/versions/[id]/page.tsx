import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { loadVersion } from "@/lib/db/bids";
import { isAppError, localDateTimeLabel, wishSentence } from "@/lib/domain/index";
import { KIND_LABEL } from "../../kind-label";

export const metadata: Metadata = { title: "Submitted version" };

/** One submitted version of the crew member's own bid; anyone else's is "not found". */
export default async function VersionPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requireRole("crew");
  const { id } = await params;
  const found = await loadVersion(user, id).catch((error: unknown) => {
    if (isAppError(error, "not_found")) notFound();
    throw error;
  });
  const { scope, version } = found;
  return (
    <article>
      <p>
        <Link href="/bid" className="inline-flex min-h-11 items-center text-base text-sky-900 underline">
          ← My bid
        </Link>
      </p>
      <h1 className="text-xl font-semibold">
        Version {version.version} · {scope.period.name}
      </h1>
      <dl className="mt-3 space-y-1 rounded-lg border border-slate-300 bg-white px-4 py-3 text-sm">
        <div>
          <dt className="inline font-medium">Receipt code: </dt>
          <dd className="inline font-mono text-base font-semibold">{version.receiptCode}</dd>
        </div>
        <div>
          <dt className="inline font-medium">Submitted: </dt>
          <dd className="inline">{localDateTimeLabel(version.submittedAt, scope.period.zone)}</dd>
        </div>
        <div>
          <dt className="font-medium">Content hash (SHA-256 of the bid&apos;s canonical JSON):</dt>
          <dd className="break-all font-mono text-xs">{version.hash}</dd>
        </div>
      </dl>
      <ol className="mt-4 space-y-2" aria-label="Wishes of this version">
        {version.wishes.map((w, k) => (
          <li key={k} className="rounded-lg border border-slate-300 bg-white px-4 py-3">
            <p className="text-xs font-medium uppercase tracking-wide text-slate-700">
              #{k + 1} · {KIND_LABEL[w.kind]}
            </p>
            <p className="text-base font-medium">{wishSentence(w)}</p>
          </li>
        ))}
      </ol>
    </article>
  );
}
