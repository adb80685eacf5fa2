import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { compareRuns } from "@/lib/db/award-runs";
import { isAppError } from "@/lib/domain/index";
import { hhmm } from "@/app/ui/format";
import { errorMessage } from "@/app/ui/error-message";

export const metadata: Metadata = { title: "Compare runs" };

const lineText = (l: { kind: string; pairings: string[] } | null) => (!l ? "—" : l.kind === "reserve" ? "Reserve" : l.pairings.join(" ") || "No trips");

export default async function ComparePage({ searchParams }: { searchParams: Promise<{ first?: string; second?: string }> }) {
  await requireRole("scheduler", "admin");
  const { first, second } = await searchParams;
  if (!first || !second) notFound();
  let result: Awaited<ReturnType<typeof compareRuns>>;
  try {
    result = await compareRuns(first, second);
  } catch (error) {
    if (isAppError(error, "not_found")) notFound();
    return (
      <section>
        <h1 className="text-xl font-semibold">Compare runs</h1>
        <p role="alert" className="mt-3 text-red-700">
          {errorMessage(error)}
        </p>
      </section>
    );
  }
  const rows: [string, (t: typeof result.first.totals) => string][] = [
    ["Open positions", (t) => String(t.openPositions)],
    ["Open time", (t) => hhmm(t.openCreditMinutes)],
    ["Reserve lines", (t) => String(t.reserveLines)],
    ["Mean satisfaction", (t) => t.meanSatisfaction.toFixed(3)],
    ["Jain's index", (t) => t.jain.toFixed(3)],
    ["Gini coefficient", (t) => t.gini.toFixed(3)],
  ];
  return (
    <section className="space-y-5">
      <h1 className="text-xl font-semibold">Compare runs</h1>
      <table className="w-full max-w-xl rounded-lg border border-slate-200 bg-white text-left text-sm">
        <caption className="sr-only">Totals of both runs</caption>
        <thead className="border-b border-slate-200 bg-slate-50 text-xs uppercase tracking-wide text-slate-500">
          <tr>
            <th className="px-3 py-2 font-medium" />
            <th className="px-3 py-2 text-right font-medium">First run</th>
            <th className="px-3 py-2 text-right font-medium">Second run</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, value]) => (
            <tr key={label} className="border-b border-slate-100 last:border-0">
              <th className="px-3 py-1.5 font-normal">{label}</th>
              <td className="px-3 py-1.5 text-right tabular-nums">{value(result.first.totals)}</td>
              <td className="px-3 py-1.5 text-right tabular-nums">{value(result.second.totals)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <h2 className="font-semibold">{result.changed.length === 0 ? "No crew member's line differs." : `${result.changed.length} crew members' lines differ`}</h2>
      {result.changed.length > 0 ? (
        <div className="overflow-x-auto rounded-lg border border-slate-200 bg-white">
          <table className="w-full min-w-[40rem] text-left text-sm">
            <caption className="sr-only">Crew whose lines differ</caption>
            <thead className="border-b border-slate-200 bg-slate-50 text-xs uppercase tracking-wide text-slate-500">
              <tr>
                <th className="px-3 py-2 font-medium">Seniority</th>
                <th className="px-3 py-2 font-medium">Crew member</th>
                <th className="px-3 py-2 font-medium">First run</th>
                <th className="px-3 py-2 font-medium">Second run</th>
                <th className="px-3 py-2 text-right font-medium">Satisfaction change</th>
              </tr>
            </thead>
            <tbody>
              {result.changed.map((c) => (
                <tr key={c.crewId} className="border-b border-slate-100 last:border-0">
                  <td className="px-3 py-1.5 tabular-nums">{c.seniority}</td>
                  <td className="px-3 py-1.5">{c.name}</td>
                  <td className="px-3 py-1.5">{lineText(c.first)}</td>
                  <td className="px-3 py-1.5">{lineText(c.second)}</td>
                  <td className={`px-3 py-1.5 text-right tabular-nums ${c.satisfactionChange < 0 ? "text-red-700" : "text-emerald-800"}`}>
                    {c.satisfactionChange >= 0 ? "+" : ""}
                    {c.satisfactionChange.toFixed(2)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </section>
  );
}
