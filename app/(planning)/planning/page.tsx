import type { Metadata } from "next";
import Link from "next/link";
import { requireRole } from "@/lib/auth/session";
import { listPeriods } from "@/lib/db/periods";
import { shortDate, zonedDateTime } from "@/app/ui/format";

export const metadata: Metadata = { title: "Bid periods" };

const STATE_STYLE: Record<string, string> = {
  draft: "bg-slate-100 text-slate-700",
  open: "bg-emerald-50 text-emerald-800",
  closed: "bg-amber-50 text-amber-800",
  awarded: "bg-sky-50 text-sky-800",
  published: "bg-indigo-50 text-indigo-800",
};

export default async function PlanningHome() {
  await requireRole("scheduler", "admin");
  const periods = await listPeriods();
  return (
    <section>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-xl font-semibold">Bid periods</h1>
        <div className="flex flex-wrap gap-2 text-sm">
          <Link href="/planning/periods/new" className="rounded-md bg-slate-900 px-3 py-1.5 font-semibold text-white hover:bg-slate-700">
            New period
          </Link>
          <Link href="/planning/import" className="rounded-md border border-slate-300 bg-white px-3 py-1.5 font-medium hover:bg-slate-50">
            Import from JSON
          </Link>
        </div>
      </div>
      {periods.length === 0 ? (
        <p className="mt-3 text-slate-600">No bid periods yet.</p>
      ) : (
        <div className="mt-4 overflow-x-auto rounded-lg border border-slate-200 bg-white">
          <table className="w-full min-w-[40rem] text-left text-sm">
            <thead className="border-b border-slate-200 bg-slate-50 text-xs uppercase tracking-wide text-slate-500">
              <tr>
                <th className="px-3 py-2 font-medium">Period</th>
                <th className="px-3 py-2 font-medium">Base</th>
                <th className="px-3 py-2 font-medium">Dates</th>
                <th className="px-3 py-2 font-medium">Bids close</th>
                <th className="px-3 py-2 font-medium">State</th>
                <th className="px-3 py-2 text-right font-medium">Trips</th>
                <th className="px-3 py-2 text-right font-medium">Bids in</th>
              </tr>
            </thead>
            <tbody>
              {periods.map((p) => (
                <tr key={p.id} className="border-b border-slate-100 last:border-0" data-period={p.name}>
                  <td className="px-3 py-2 font-medium">
                    <Link href={`/planning/periods/${p.id}`} className="text-sky-800 underline">
                      {p.name}
                    </Link>
                  </td>
                  <td className="px-3 py-2 font-mono">{p.baseCode}</td>
                  <td className="px-3 py-2">
                    {shortDate(p.startDate)} – {shortDate(p.endDate)}
                  </td>
                  <td className="px-3 py-2">{zonedDateTime(p.deadline, p.zone)}</td>
                  <td className="px-3 py-2">
                    <span className={`rounded px-2 py-0.5 text-xs font-medium ${STATE_STYLE[p.state] ?? ""}`}>{p.state}</span>
                  </td>
                  <td className="px-3 py-2 text-right tabular-nums">{p.pairings}</td>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {p.submittedBids} / {p.crew}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
