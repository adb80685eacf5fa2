/**
 * POST (multipart/form-data, field `file`): a whole bid period in the engine's
 * JSON format (a bundle, or one instance) becomes a new period. Answers 200
 * with the period's id, 422 naming every problem, 409 when a period of that id
 * holds other data, 413 when the file is too large. Schedulers and admins only.
 */
import { NextResponse } from "next/server";
import { importJsonFile } from "@/lib/db/period-json-import";
import { IMPORT_LIMITS } from "@/lib/imports/limits";
import { bodyTooLarge, importFailure, plannerOrRefusal } from "../../import-response";

export const dynamic = "force-dynamic";

export async function POST(request: Request) {
  const who = await plannerOrRefusal();
  if ("refusal" in who) return who.refusal;
  const tooLarge = bodyTooLarge(request, IMPORT_LIMITS.jsonBytes + 64 * 1024, "a JSON file");
  if (tooLarge) return tooLarge;
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    return NextResponse.json({ error: "Send the file as a multipart form.", problems: [] }, { status: 400 });
  }
  const file = form.get("file");
  if (!(file instanceof File) || file.size === 0) return NextResponse.json({ error: "Choose a JSON file to import.", problems: [] }, { status: 422 });
  try {
    return NextResponse.json(await importJsonFile(await file.text(), file.name || "the file", who.userId));
  } catch (error) {
    return importFailure(error);
  }
}
