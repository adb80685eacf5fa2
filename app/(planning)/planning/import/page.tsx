import type { Metadata } from "next";
import { requireRole } from "@/lib/auth/session";
import { IMPORT_LIMITS, megabytes } from "@/lib/imports/limits";
import { JsonImportForm } from "./json-import-form";
import { Trail } from "../trail";

export const metadata: Metadata = { title: "Import a period" };

export default async function JsonImportPage() {
  await requireRole("scheduler", "admin");
  return (
    <section className="space-y-4">
      <div>
        <Trail steps={[{ label: "Bid periods", href: "/planning" }, { label: "Import from JSON" }]} />
        <h1 className="text-xl font-semibold">Import a period from JSON</h1>
      </div>
      <JsonImportForm limit={megabytes(IMPORT_LIMITS.jsonBytes)} />
    </section>
  );
}
