import type { Metadata } from "next";
import Link from "next/link";
import { requireRole } from "@/lib/auth/session";
import { db } from "@/lib/db/client";
import { basesForPeriods } from "@/lib/db/period-create";
import { addDays } from "@/lib/domain/index";
import { now } from "@/lib/clock";
import { CreatePeriodForm } from "./create-form";
import { Trail } from "../../trail";

export const metadata: Metadata = { title: "New bid period" };

/** The calendar month after the latest period (or after this month): the usual next period to create. */
async function nextMonth(): Promise<{ startDate: string; endDate: string }> {
  const latest = await db().bidPeriod.findFirst({ orderBy: { endDate: "desc" }, select: { endDate: true } });
  const after = latest ? addDays(latest.endDate.toISOString().slice(0, 10), 1) : now().toISOString().slice(0, 10);
  const [y, m] = after.split("-").map(Number) as [number, number];
  const start = after.endsWith("-01") ? after : new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 10);
  const [sy, sm] = start.split("-").map(Number) as [number, number];
  return { startDate: start, endDate: addDays(new Date(Date.UTC(sy, sm, 1)).toISOString().slice(0, 10), -1) };
}

export default async function NewPeriodPage() {
  await requireRole("scheduler", "admin");
  const [bases, month] = await Promise.all([basesForPeriods(), nextMonth()]);
  return (
    <section className="space-y-4">
      <div>
        <Trail steps={[{ label: "Bid periods", href: "/planning" }, { label: "New" }]} />
        <h1 className="text-xl font-semibold">New bid period</h1>
      </div>
      {bases.length === 0 ? (
        <p className="text-slate-600">
          There are no bases yet. <Link href="/planning/import" className="text-sky-800 underline">Import a period from JSON</Link>: it brings its base and stations.
        </p>
      ) : (
        <CreatePeriodForm bases={bases} {...month} />
      )}
    </section>
  );
}
