import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { periodRuns } from "@/lib/db/award-runs";
import { periodLedger } from "@/lib/db/publish";
import { isAppError } from "@/lib/domain/index";
import { zonedDateTime } from "@/app/ui/format";
import { RunAwardButton } from "../../run-award-button";
import { PublishForm } from "./publish-form";
import { BiddingSteps } from "./bidding-steps";
import { now } from "@/lib/clock";
import { elapsed, MODE_LABEL, POSITION_LABEL, POSITION_ONE, STATE_LABEL, STATE_STYLE } from "../../run-labels";
import { Trail } from "../../trail";

export const metadata: Metadata = { title: "Bid period" };

export default async function PeriodPage({ params }: { params: Promise<{ id: string }> }) {
  await requireRole("scheduler", "admin");
  const period = await periodRuns((await params).id).catch((e: unknown) => {
    if (isAppError(e, "not_found")) notFound();
    throw e;
  });
  return (
    <section className="space-y-6">
      <div>
        <Trail steps={[{ label: "Bid periods", href: "/planning" }, { label: period.baseCode }]} />
        <h1 className="text-xl font-semibold">{period.name}</h1>
        <p className="text-sm text-slate-600">
          State: {period.state} · bids close {zonedDateTime(period.deadline, period.zone)} · times in {period.zone} ·{" "}
          <a href={`/api/periods/${period.id}/export`} className="text-sky-800 underline">
            Export as JSON
          </a>
          {period.state === "draft" ? (
            <>
              {" "}
              ·{" "}
              <Link href={`/planning/periods/${period.id}/import`} className="text-sky-800 underline">
                Import trips and crew
              </Link>
            </>
          ) : null}
        </p>
      </div>
      <section aria-label="Bidding" className="rounded-lg border border-slate-200 bg-white p-4">
        <h2 className="mb-2 font-semibold">Bidding</h2>
        <BiddingSteps periodId={period.id} state={period.state} zone={period.zone} name={period.name} deadlinePassed={Date.parse(period.deadline) <= now().getTime()} />
      </section>
      {period.groups.map((g) => (
        <section key={g.id} aria-label={POSITION_LABEL[g.position] ?? g.position} className="rounded-lg border border-slate-200 bg-white p-4">
          <div className="flex flex-wrap items-center justify-between gap-3">
            <div>
              <h2 className="font-semibold">{POSITION_LABEL[g.position] ?? g.position}</h2>
              <p className="text-sm text-slate-600">
                {MODE_LABEL[g.mode] ?? g.mode} · time limit {elapsed(g.timeLimitSeconds * 1000)} ·{" "}
                <Link href={`/planning/periods/${period.id}/groups/${g.id}/settings`} className="text-sky-800 underline">
                  Rule set and settings
                </Link>
              </p>
            </div>
            {period.state === "draft" ? (
              <p className="text-sm text-slate-600">Runs start once bidding opens.</p>
            ) : period.state === "open" ? (
              <RunAwardButton groupId={g.id} preview label={`Run preview: ${POSITION_LABEL[g.position] ?? g.position}`} />
            ) : (
              <RunAwardButton groupId={g.id} label={`Run award: ${POSITION_LABEL[g.position] ?? g.position}`} />
            )}
          </div>
          {g.runs.length === 0 ? (
            <p className="mt-3 text-sm text-slate-600">No runs yet.</p>
          ) : (
            <div className="mt-3 overflow-x-auto">
              <table className="w-full min-w-[32rem] text-left text-sm">
                <thead className="text-xs uppercase tracking-wide text-slate-500">
                  <tr>
                    <th className="py-1 pr-3 font-medium">Requested</th>
                    <th className="py-1 pr-3 font-medium">By</th>
                    <th className="py-1 pr-3 font-medium">Mode</th>
                    <th className="py-1 pr-3 font-medium">State</th>
                    <th className="py-1 font-medium" />
                  </tr>
                </thead>
                <tbody>
                  {g.runs.map((r) => (
                    <tr key={r.id} className="border-t border-slate-100">
                      <td className="py-1.5 pr-3">{zonedDateTime(r.createdAt, period.zone)}</td>
                      <td className="py-1.5 pr-3">{r.requestedBy ?? "—"}</td>
                      <td className="py-1.5 pr-3">
                        {MODE_LABEL[r.mode] ?? r.mode}
                        {r.preview ? " · preview" : ""}
                      </td>
                      <td className="py-1.5 pr-3">
                        {r.id === g.chosenRunId ? <span className="mr-1 rounded bg-indigo-50 px-2 py-0.5 text-xs font-medium text-indigo-800">Published</span> : null}
                        <span className={`rounded px-2 py-0.5 text-xs font-medium ${STATE_STYLE[r.state] ?? ""}`}>
                          {STATE_LABEL[r.state] ?? r.state}
                          {r.state === "running" ? ` ${r.progress.percent.toFixed(0)} %` : ""}
                        </span>
                      </td>
                      <td className="py-1.5 text-right">
                        {(() => {
                          // Compare a finished run with the finished run before it.
                          const earlier = r.state === "succeeded" ? g.runs.slice(g.runs.indexOf(r) + 1).find((x) => x.state === "succeeded") : undefined;
                          return earlier ? (
                            <Link href={`/planning/compare?first=${earlier.id}&second=${r.id}`} className="mr-3 text-sky-800 underline">
                              Compare with previous
                            </Link>
                          ) : null;
                        })()}
                        <Link href={`/planning/runs/${r.id}`} className="text-sky-800 underline">
                          Open
                        </Link>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </section>
      ))}
      {period.groups.length === 0 ? (
        <p className="text-sm text-slate-600">This period has no award groups, so there is nothing to run or publish.</p>
      ) : period.state === "closed" || period.state === "awarded" || period.state === "published" ? (
        <PublishForm
          periodId={period.id}
          published={period.state === "published"}
          groups={period.groups.map((g) => ({
            groupId: g.id,
            label: POSITION_LABEL[g.position] ?? g.position,
            chosenRunId: g.chosenRunId,
            runs: g.runs
              .filter((r) => r.state === "succeeded" && !r.preview)
              .map((r) => ({ id: r.id, label: `${zonedDateTime(r.createdAt, period.zone)} · ${MODE_LABEL[r.mode] ?? r.mode}${r.id === g.chosenRunId ? " · published" : ""}` })),
          }))}
        />
      ) : (
        <p className="text-sm text-slate-600">Publishing opens once bidding is closed.</p>
      )}
      {period.state === "published" ? <LedgerSection periodId={period.id} /> : null}
    </section>
  );
}

/** The fairness ledger the published award wrote: who is owed, and the weight each carries into the next period. */
async function LedgerSection({ periodId }: { periodId: string }) {
  const rows = await periodLedger(periodId);
  if (rows.length === 0) return null;
  const owed = rows.filter((r) => r.balance > 0.005).length;
  return (
    <section aria-label="Fairness carried forward" className="rounded-lg border border-slate-200 bg-white p-4">
      <h2 className="font-semibold">Fairness carried into the next period</h2>
      <p className="mt-1 text-sm text-slate-600">
        Each crew member&apos;s balance is how far their satisfaction fell short of their group&apos;s mean, with earlier periods counting half as much each month. {owed} of{" "}
        {rows.length} are owed; in weighted-balance mode their weight next period grows with it (between 0.5 and 2).
      </p>
      <details className="mt-2">
        <summary className="cursor-pointer text-sm font-medium text-sky-800">Show every crew member</summary>
        <div className="mt-2 overflow-x-auto">
          <table className="w-full min-w-[30rem] text-left text-sm">
            <thead className="text-xs uppercase tracking-wide text-slate-500">
              <tr>
                <th className="py-1 pr-3 font-medium">Seniority</th>
                <th className="py-1 pr-3 font-medium">Name</th>
                <th className="py-1 pr-3 font-medium">Position</th>
                <th className="py-1 pr-3 text-right font-medium">Satisfaction</th>
                <th className="py-1 pr-3 text-right font-medium">Balance</th>
                <th className="py-1 text-right font-medium">Weight next period</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.seniority} className="border-t border-slate-100">
                  <td className="py-1 pr-3 tabular-nums">{r.seniority}</td>
                  <td className="py-1 pr-3">{r.name}</td>
                  <td className="py-1 pr-3">{POSITION_ONE[r.position] ?? r.position}</td>
                  <td className="py-1 pr-3 text-right tabular-nums">{(r.satisfaction * 100).toFixed(0)} %</td>
                  <td className="py-1 pr-3 text-right tabular-nums">{r.balance >= 0 ? "+" : "−"}{Math.abs(r.balance).toFixed(2)}</td>
                  <td className="py-1 text-right tabular-nums">{r.carriedWeight.toFixed(2)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </section>
  );
}
