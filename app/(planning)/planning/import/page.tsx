import type { Metadata } from "next";
import Link from "next/link";
import { requireRole } from "@/lib/auth/session";
import { IMPORT_LIMITS, megabytes } from "@/lib/imports/limits";
import { JsonImportForm } from "./json-import-form";

export const metadata: Metadata = { title: "Import a period" };

export default async function JsonImportPage() {
  await requireRole("scheduler", "admin");
  return (
    <section className="space-y-4">
      <div>
        <p className="text-sm text-slate-500">
          <Link href="/planning" className="underline">
            Bid periods
          </Link>{" "}
          / Import from JSON
        </p>
        <h1 className="text-xl font-semibold">Import a period from JSON</h1>
      </div>
      <JsonImportForm limit={megabytes(IMPORT_LIMITS.jsonBytes)} />
    </section>
  );
}
