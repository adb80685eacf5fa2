import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/session";
import { db } from "@/lib/db/client";
import { FILE_HELP } from "@/lib/imports/templates";
import { IMPORT_LIMITS, megabytes } from "@/lib/imports/limits";
import { POSITION_LABEL } from "../../../run-labels";
import { ImportForm } from "./import-form";
import { Trail } from "../../../trail";

export const metadata: Metadata = { title: "Import trips and crew" };

export default async function ImportPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ created?: string }> }) {
  await requireRole("scheduler", "admin");
  const id = (await params).id;
  const period = await db().bidPeriod.findUnique({
    where: { id },
    include: { base: { select: { stationCode: true, _count: { select: { crew: true } } } }, groups: { select: { position: true } }, _count: { select: { pairings: true } } },
  });
  if (!period) notFound();
  const created = (await searchParams).created === "1";
  return (
    <section className="space-y-4">
      <div>
        <Trail steps={[{ label: "Bid periods", href: "/planning" }, { label: period.name, href: `/planning/periods/${period.id}` }, { label: "Import" }]} />
        <h1 className="text-xl font-semibold">Import trips and crew</h1>
        {created ? <p role="status" className="text-sm text-emerald-800">{period.name} was created as a draft. Import its trips next.</p> : null}
        <p className="text-sm text-slate-600" aria-label="What the period holds">
          {period.base.stationCode} · {period._count.pairings} trips · {period.base._count.crew} crew at the base · award groups:{" "}
          {period.groups.length === 0 ? "none yet" : period.groups.map((g) => POSITION_LABEL[g.position] ?? g.position).join(", ")}
        </p>
      </div>
      {period.state === "draft" ? (
        <ImportForm periodId={period.id} help={FILE_HELP} limit={megabytes(IMPORT_LIMITS.csvBytes)} />
      ) : (
        <p className="text-slate-600">
          {period.name} is {period.state}: imports change a period only while it is a draft, because crew bid on its trips as they are.
        </p>
      )}
      <p className="text-sm text-slate-600">
        Each template is a file&apos;s header row. Times are UTC, written like 2027-03-14T08:00:00Z; durations are whole minutes; lists are joined by &ldquo;;&rdquo;, such as
        A220;lang:es. The full description is docs/csv-format.md in the project.
      </p>
      <p>
        <Link href={`/planning/periods/${period.id}`} className="text-sky-800 underline">
          Back to {period.name}
        </Link>
      </p>
    </section>
  );
}
