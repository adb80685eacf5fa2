/**
 * Period import: a bundle (lib/domain) loaded into the database as one bid
 * period, all or nothing, in one transaction.
 *
 * Decisions (where the design was silent):
 * - The bundle's `period.id` becomes the BidPeriod row's id, so a bid's
 *   receipt (which hashes the period id) and a later export name the same
 *   period, and export → import → export is byte-identical.
 * - Stations are shared by the carrier: missing ones are created; an existing
 *   one with another zone or longitude refuses the import; another name is
 *   cosmetic and the database's name is kept. The base is created when missing.
 * - Crew are new rows: an employee or seniority number already in the
 *   database refuses the import (crew are not merged or moved). Their rows
 *   outside the period's windows (say a look-back duty 30 days back) are
 *   stored, and listed in the result, because this period's export leaves
 *   them out (period-import-checks.ts).
 * - A pairing that several instances list (captain and first officer) is one
 *   row; the instances must agree on it, and each group must list exactly the
 *   trips that need its position (period-import-checks.ts says why).
 * - Rule sets: a row with the same name and identical document is reused; a
 *   name taken by another document gets a variant row (period-import-database.ts).
 * - Bids: a Bid row (the working copy, revision 1) and one BidSubmission
 *   (revision 1) with the receipt of bid-receipt.ts: hash = SHA-256 of the
 *   canonical JSON of { crewId, periodId, wishes }, code = its first 12 hex digits.
 * - Bidding window, when not given: opens at 00:00 base local one calendar
 *   month before the start date (day clamped to that month's length); the
 *   deadline is 18:00 base local 19 days after that (so a period starting on
 *   the 1st opens on the 1st of the month before and closes on its 20th, as the
 *   demo does). State, when not given: "closed" when the bundle holds any bid
 *   (the bids are frozen and ready to award; closedAt = the deadline), else
 *   "draft". An imported period has no award runs, so it cannot be awarded or
 *   published on arrival.
 */
import { z } from "zod";
import {
  AppError,
  addDays,
  atLocalTime,
  bundleSchema,
  instantMs,
  instantSchema,
  invalidInput,
  isAppError,
  startOfLocalDay,
  toInstant,
} from "../domain/index";
import { Prisma } from "./generated/client";
import type { Db } from "./period-db";
import { bundleFitProblems, outsideWindows } from "./period-import-checks";
import { refuseConflicts } from "./period-import-database";
import { planImport } from "./period-import-rows";
import { writePlan } from "./period-import-write";

const instantInput = z.union([z.date().transform((date) => toInstant(date)), instantSchema]);

const importOptionsSchema = z.strictObject({
  state: z.enum(["draft", "open", "closed"]).optional(),
  opensAt: instantInput.optional(),
  deadline: instantInput.optional(),
  periodName: z.string().trim().min(1).optional(),
});

/** How an import sets the period's own fields; everything is optional. */
export interface ImportOptions {
  /** the period's state; default "closed" when the bundle holds bids, else "draft" */
  state?: "draft" | "open" | "closed";
  /** when bidding opens (a Date or a UTC instant); default: see {@link defaultBiddingWindow} */
  opensAt?: Date | string;
  /** the bidding deadline; default: see {@link defaultBiddingWindow} */
  deadline?: Date | string;
  /** the period's name; default the bundle's `period.name` */
  periodName?: string;
}

/** "YYYY-MM-DD" one calendar month before `date`, the day clamped to that month's length. */
function monthBefore(date: string): string {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  const length = new Date(Date.UTC(y, m - 1, 0)).getUTCDate();
  return new Date(Date.UTC(y, m - 2, Math.min(d, length))).toISOString().slice(0, 10);
}

/** The default bidding window of a period starting on `startDate` at a base in `zone` (UTC instants). */
export function defaultBiddingWindow(startDate: string, zone: string): { opensAt: string; deadline: string } {
  const opens = monthBefore(startDate);
  return { opensAt: startOfLocalDay(opens, zone), deadline: atLocalTime(addDays(opens, 19), "18:00", zone) };
}

/** A unique constraint hit while writing (a row written meanwhile by someone else) as a conflict. */
function writeError(error: unknown): unknown {
  if (isAppError(error)) return error;
  if (error instanceof Prisma.PrismaClientKnownRequestError && error.code === "P2002") {
    // With a driver adapter the constraint's name sits in the adapter's cause.
    const meta = error.meta as { modelName?: string; driverAdapterError?: { cause?: { constraint?: { index?: string } } } } | undefined;
    const constraint = meta?.driverAdapterError?.cause?.constraint?.index;
    const which = constraint ? ` (unique constraint ${constraint})` : meta?.modelName ? ` (${meta.modelName})` : "";
    return new AppError("conflict", `the bundle collides with a row already in the database${which}; nothing was imported`);
  }
  return error;
}

/** What an import did. */
export interface ImportResult {
  /** the new BidPeriod's id: the bundle's `period.id` */
  periodId: string;
  /** crew rows stored but outside the period's windows, each naming its place and why; a later export of the period leaves them out */
  outsideWindows: string[];
}

/**
 * Loads `input` (a bundle, unparsed) as a new bid period. Export of the period
 * then gives the bundle back (after parsing, in the export's orders) except
 * for the rows listed in `outsideWindows`. Refuses, writing nothing, with AppError
 * ("invalid") listing each problem and where it is — first bundleSchema's,
 * then the checks of period-import-checks.ts — or AppError("conflict") for
 * clashes with the database. Rows are written in bulk (period-import-write.ts):
 * a 300-crew, 1,000-pairing bundle takes a few seconds.
 */
export async function importBundle(
  prisma: Db,
  input: unknown,
  opts: ImportOptions = {},
  /** more writes in the same transaction (the JSON upload's audit entry) */
  also?: (tx: Parameters<Parameters<Db["$transaction"]>[0]>[0]) => Promise<void>,
): Promise<ImportResult> {
  const parsed = bundleSchema.safeParse(input);
  if (!parsed.success) throw invalidInput("the bundle", parsed.error);
  const bundle = parsed.data;
  const options = importOptionsSchema.safeParse(opts);
  if (!options.success) throw invalidInput("the import options", options.error);
  const problems = bundleFitProblems(bundle);
  if (problems.length > 0) {
    throw new AppError("invalid", `the bundle cannot be imported: ${problems.join("; ")}`, { issues: problems });
  }

  const window = defaultBiddingWindow(bundle.period.startDate, bundle.period.zone);
  const opensAt = options.data.opensAt ?? window.opensAt;
  const deadline = options.data.deadline ?? window.deadline;
  if (instantMs(deadline) <= instantMs(opensAt)) {
    throw new AppError("invalid", `the bidding deadline ${deadline} is not after bidding opens ${opensAt}`);
  }
  const hasBids = bundle.instances.some((inst) => Object.keys(inst.bids).length > 0);
  const state = options.data.state ?? (hasBids ? "closed" : "draft");
  const plan = planImport(bundle, {
    name: options.data.periodName ?? bundle.period.name,
    opensAt: new Date(opensAt),
    deadline: new Date(deadline),
    state,
    closedAt: state === "closed" ? new Date(deadline) : null,
  });

  try {
    await prisma.$transaction(
      async (tx) => {
        await refuseConflicts(tx, plan);
        await writePlan(tx, plan);
        await also?.(tx);
      },
      { timeout: 300_000, maxWait: 10_000 },
    );
  } catch (error) {
    throw writeError(error);
  }
  return { periodId: plan.period.id, outsideWindows: outsideWindows(bundle) };
}
