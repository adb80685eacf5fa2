/**
 * A whole bid period from the engine's JSON format, as a scheduler uploads
 * it: a bundle (one instance per award group), or one instance alone (then a
 * period with that one group). It becomes a new period through importBundle
 * (period-import.ts: all or nothing, every problem named by its place).
 *
 * Uploading the same file again changes nothing and says so: the import
 * records the SHA-256 of the bundle's canonical JSON (RFC 8785) in its audit
 * entry, and a period of the same id whose recorded hash, or whose export,
 * matches the upload is that upload (the entry is written in the import's own
 * transaction). A period of that id holding anything
 * else is a conflict, and nothing is written.
 */
import { AppError, bundleSchema, canonicalJson, invalidInput, sha256Hex } from "../domain/index";
import { IMPORT_LIMITS, megabytes } from "../imports/limits";
import { byteLength } from "../imports/csv-table";
import { db } from "./client";
import { exportPeriod } from "./period-export";
import { importBundle } from "./period-import";

export interface JsonImportResult {
  periodId: string;
  changed: boolean;
  message: string;
  /** crew rows stored but outside the period's windows (see importBundle) */
  outsideWindows: string[];
}

/** Reads `text` (the file `fileName`) as a bundle or an instance, unparsed; refuses with the place of a syntax error. */
function readJson(text: string, fileName: string): unknown {
  const size = byteLength(text);
  if (size > IMPORT_LIMITS.jsonBytes) {
    throw new AppError("too_large", `the file ${fileName} is ${megabytes(size)}; a JSON file may be at most ${megabytes(IMPORT_LIMITS.jsonBytes)}`);
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new AppError("invalid", `the file ${fileName} is not JSON (${(error as Error).message}): choose a period file written by "Export as JSON" or the generator`);
  }
  if (typeof value === "object" && value !== null && !("instances" in value) && "group" in value && "period" in value) {
    const instance = value as { schemaVersion?: unknown; period: unknown };
    return { schemaVersion: instance.schemaVersion, period: instance.period, instances: [value] };
  }
  return value;
}

/** Imports the uploaded JSON file as a new bid period (or recognises it as imported already). */
export async function importJsonFile(text: string, fileName: string, actorUserId: string): Promise<JsonImportResult> {
  const input = readJson(text, fileName);
  const parsed = bundleSchema.safeParse(input);
  if (!parsed.success) throw invalidInput(`the file ${fileName}`, parsed.error);
  const hash = sha256Hex(parsed.data);
  const id = parsed.data.period.id;
  const existing = await db().bidPeriod.findUnique({ where: { id }, select: { name: true } });
  if (existing) {
    const recorded = await db().auditEvent.findFirst({ where: { entity: "BidPeriod", entityId: id, action: "period.imported-json", detail: { path: ["sha256"], equals: hash } } });
    const same = recorded !== null || canonicalJson(await exportPeriod(db(), id).catch(() => null)) === canonicalJson(parsed.data);
    if (same) return { periodId: id, changed: false, message: `Nothing changed: ${existing.name} holds this file already.`, outsideWindows: [] };
    throw new AppError("conflict", `a bid period with the id "${id}" exists already (${existing.name}) and holds other data; nothing was imported`);
  }
  const result = await importBundle(db(), parsed.data, {}, async (tx) => {
    await tx.auditEvent.create({ data: { actorUserId, action: "period.imported-json", entity: "BidPeriod", entityId: id, detail: { sha256: hash, file: fileName } } });
  });
  const groups = parsed.data.instances.length;
  return {
    periodId: id,
    changed: true,
    message: `Imported ${parsed.data.period.name}: ${groups} award group${groups === 1 ? "" : "s"}, ${new Set(parsed.data.instances.flatMap((i) => i.pairings.map((p) => p.id))).size} trips, ${parsed.data.instances.reduce((n, i) => n + i.crew.length, 0)} crew.`,
    outsideWindows: result.outsideWindows,
  };
}
