import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { runDetail } from "@/lib/db/award-runs";
import { isAppError } from "@/lib/domain/index";
import { hhmm, zonedDateTime } from "@/app/ui/format";
import { LegalityCaution } from "@/app/ui/legality-caution";
import { elapsed, MODE_LABEL, POSITION_LABEL } from "../../run-labels";
import { RunProgress } from "./run-progress";
import { SatisfactionBySeniority, SatisfactionHistogram } from "./charts";
import { CoverageCalendar } from "./coverage-calendar";
import { fairnessReport } from "@/lib/fairness";

export const metadata: Metadata = { title: "Award run" };

export default async function RunPage({ params }: { params: Promise<{ id: string }> }) {
  await requireRole("scheduler", "admin");
  const run = await runDetail((await params).id).catch((e: unknown) => {
    if (isAppError(e, "not_found")) notFound();
    throw e;
  });
  const names = new Map(run.crew.map((c) => [c.employeeNumber, c]));
  const lines = run.award?.lines ?? [];
  const reasons = new Map((run.award?.reserveReasons ?? []).map((r) => [r.crewId, r.text]));
  const points = lines.map((l) => ({ seniority: names.get(l.crewId)?.seniority ?? 0, satisfaction: l.satisfaction, name: names.get(l.crewId)?.name ?? l.crewId }));
  const fairness = lines.length ? fairnessReport(points) : null;
  return (
    <section className="space-y-5">
      <div>
        <p className="text-sm text-slate-500">
          <Link href={`/planning/periods/${run.period.id}`} className="underline">
            {run.period.name}
          </Link>{" "}
          / award run
        </p>
        <h1 className="text-xl font-semibold">Award run · {POSITION_LABEL[run.position] ?? run.position}</h1>
        <p className="text-sm text-slate-600">
          {MODE_LABEL[run.mode] ?? run.mode} · time limit {elapsed(run.timeLimitSeconds * 1000)} · requested {zonedDateTime(run.createdAt, run.period.zone)}
          {run.requestedBy ? ` by ${run.requestedBy}` : ""} · input <span className="font-mono">{run.instanceHash.slice(0, 12)}</span>
        </p>
      </div>
      <RunProgress initial={{ ...run }} />
      {run.state === "failed" ? (
        <p role="alert" className="rounded-md border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-900">
          The run failed: {run.error ?? "no reason was recorded"}. Earlier runs and any published award are unchanged.
        </p>
      ) : null}
      {run.state === "cancelled" ? <p className="text-sm text-slate-700">The run was cancelled. Earlier runs and any published award are unchanged.</p> : null}
      {run.award ? (
        <>
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
            {[
              ["Open positions", String(run.report?.openPositions ?? run.award.openPairings.reduce((t, o) => t + o.positionsOpen, 0))],
              ["Open time", hhmm(run.report?.openCreditMinutes ?? run.award.openPairings.reduce((t, o) => t + o.openCreditMinutes, 0))],
              ["Mean satisfaction", (fairness?.mean ?? 0).toFixed(2)],
              ["Jain's index", (fairness?.jain ?? 0).toFixed(3)],
              ["Gini coefficient", (fairness?.gini ?? 0).toFixed(3)],
              ["Reserve lines", String(lines.filter((l) => l.kind === "reserve").length)],
            ].map(([label, value]) => (
              <div key={label} className="rounded-lg border border-slate-200 bg-white p-3">
                <dt className="text-xs uppercase tracking-wide text-slate-500">{label}</dt>
                <dd className="text-lg font-semibold tabular-nums">{value}</dd>
              </div>
            ))}
          </dl>
          <div className="grid gap-3 md:grid-cols-2">
            <SatisfactionHistogram satisfactions={lines.map((l) => l.satisfaction)} />
            <SatisfactionBySeniority points={points} />
          </div>
          {run.report?.warnings?.length ? (
            <ul className="list-disc pl-5 text-sm text-slate-700">
              {run.report.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          ) : null}
          <section aria-label="Coverage" className="grid gap-3 md:grid-cols-2">
            {run.review ? <CoverageCalendar days={run.review.openByDay} /> : null}
            <div className="rounded-lg border border-slate-200 bg-white p-3">
              <h2 className="text-sm font-medium">Open trips</h2>
              {run.award.openPairings.length === 0 ? (
                <p className="mt-2 text-sm text-emerald-800">Every trip is covered.</p>
              ) : (
                <ul className="mt-2 divide-y divide-slate-100 text-sm">
                  {run.award.openPairings.map((o) => (
                    <li key={o.pairingId} className="flex justify-between py-1">
                      <span className="font-mono">{o.pairingId}</span>
                      <span className="tabular-nums text-slate-600">
                        {o.positionsOpen} open · {hhmm(o.openCreditMinutes)}
                      </span>
                    </li>
                  ))}
                </ul>
              )}
            </div>
          </section>
          {run.review ? (
            <section aria-label="Legality" className="rounded-lg border border-slate-200 bg-white p-3 text-sm">
              <h2 className="font-medium">Legality, re-checked line by line</h2>
              <p className={run.review.problems.length ? "text-red-800" : "text-emerald-800"}>
                {run.review.legal} of {run.review.lines} lines pass the rule set&apos;s checks{run.review.problems.length ? "; these do not:" : "."}
              </p>
              {run.review.problems.length ? (
                <ul className="mt-1 list-disc pl-5 text-red-800">
                  {run.review.problems.map((p) => (
                    <li key={p.crewId}>
                      {names.get(p.crewId)?.name ?? p.crewId}: {p.texts.join("; ")}
                    </li>
                  ))}
                </ul>
              ) : null}
            </section>
          ) : null}
          <LegalityCaution />
          <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
            <table className="w-full min-w-[36rem] text-left text-sm">
              <caption className="sr-only">Lines by seniority</caption>
              <thead className="border-b border-slate-200 bg-slate-50 text-xs uppercase tracking-wide text-slate-500">
                <tr>
                  <th className="px-3 py-2 font-medium">Seniority</th>
                  <th className="px-3 py-2 font-medium">Crew member</th>
                  <th className="px-3 py-2 font-medium">Line</th>
                  <th className="px-3 py-2 text-right font-medium">Credit</th>
                  <th className="px-3 py-2 text-right font-medium">Satisfaction</th>
                </tr>
              </thead>
              <tbody>
                {lines.map((l) => {
                  const who = names.get(l.crewId);
                  return (
                    <tr key={l.crewId} className="border-b border-slate-100 last:border-0">
                      <td className="px-3 py-1.5 tabular-nums">{who?.seniority ?? "—"}</td>
                      <td className="px-3 py-1.5">
                        {who?.name ?? l.crewId} <span className="font-mono text-xs text-slate-500">{l.crewId}</span>
                      </td>
                      <td className="px-3 py-1.5">
                        {l.kind === "reserve" ? `Reserve, ${l.reserveDays.length} days` : l.pairings.join(" ") || "No trips"}
                        {reasons.get(l.crewId) ? <span className="block text-xs text-slate-500">{reasons.get(l.crewId)}</span> : null}
                      </td>
                      <td className="px-3 py-1.5 text-right tabular-nums">{hhmm(l.creditMinutes)}</td>
                      <td className="px-3 py-1.5 text-right tabular-nums">{l.satisfaction.toFixed(2)}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </>
      ) : null}
    </section>
  );
}
