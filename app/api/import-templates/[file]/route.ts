/** GET: an empty CSV template (the header row) for trips.csv, legs.csv, crew.csv or activities.csv; columns in docs/csv-format.md. */
import { NextResponse } from "next/server";
import { TEMPLATES } from "@/lib/imports/templates";
import { plannerOrRefusal } from "../../import-response";

export const dynamic = "force-dynamic";

export async function GET(_request: Request, context: { params: Promise<{ file: string }> }) {
  const who = await plannerOrRefusal();
  if ("refusal" in who) return who.refusal;
  const name = (await context.params).file;
  const template = Object.hasOwn(TEMPLATES, name) ? TEMPLATES[name as keyof typeof TEMPLATES] : undefined;
  if (!template) return NextResponse.json({ error: `There is no template ${name}; there are ${Object.keys(TEMPLATES).join(", ")}.` }, { status: 404 });
  return new NextResponse(template, {
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}"`, "cache-control": "no-store" },
  });
}
