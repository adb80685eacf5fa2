/**
 * POST (multipart/form-data): the planner's CSV files for a draft period —
 * fields `trips`, `legs`, `crew`, `activities`, each optional (trips and legs
 * together). Answers 200 with what changed, or 422 with every bad row's file,
 * line, column and reason (nothing imported), 409 when the period is not a
 * draft, 413 when the upload is too large. Schedulers and admins only.
 * A route handler rather than a server action, which stops at 1 MB.
 */
import { NextResponse } from "next/server";
import { importCsvFiles, type CsvFiles } from "@/lib/db/period-csv-import";
import { IMPORT_LIMITS } from "@/lib/imports/limits";
import { bodyTooLarge, importFailure, plannerOrRefusal } from "../../../import-response";

export const dynamic = "force-dynamic";

const FIELDS = ["trips", "legs", "crew", "activities"] as const;

export async function POST(request: Request, context: { params: Promise<{ id: string }> }) {
  const who = await plannerOrRefusal();
  if ("refusal" in who) return who.refusal;
  // Four files at the per-file limit, and room for the form's own bytes; each file's own limit is checked as it is read.
  const tooLarge = bodyTooLarge(request, FIELDS.length * IMPORT_LIMITS.csvBytes + 64 * 1024, "the four CSV files");
  if (tooLarge) return tooLarge;
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    return NextResponse.json({ error: "Send the files as a multipart form.", problems: [] }, { status: 400 });
  }
  const files: CsvFiles = {};
  for (const field of FIELDS) {
    const value = form.get(field);
    if (value instanceof File && value.size > 0) files[field] = await value.text();
  }
  try {
    const result = await importCsvFiles((await context.params).id, who.userId, files);
    return NextResponse.json(result);
  } catch (error) {
    return importFailure(error);
  }
}
