/**
 * Period export: a bid period in the database as a bundle (lib/domain), one
 * self-contained instance per award group of the period.
 *
 * What each instance holds:
 * - the stations it refers to: the base, every leg's stations, and the
 *   stations of its crew's carry-in legs and look-back duties (those the
 *   station table knows), by code;
 * - the period's pairings that need the group's position (crewNeeded > 0);
 * - the crew of the period's base in that position, each with qualifications
 *   and the rows that fall in the period's windows (period-windows.ts): fixed
 *   activities overlapping the period, carry-in trips running into it,
 *   look-back duties of the 28 days before it, daily flight totals of the
 *   365 days before it;
 * - bids: each crew member's latest submitted version (the BidSubmission with
 *   the highest revision). The working copy (Bid) is a draft and never a bid;
 *   a crew member who never submitted has no entry;
 * - each crew member's `carriedWeight`: the fairness ledger's weight from
 *   their latest earlier published period (lib/fairness/ledger.ts), else the
 *   crew row's own (1 unless an import set it);
 * - the group's rule-set document and settings, as stored.
 *
 * The output depends on the data only (orders in period-export-assemble.ts,
 * instants in lib/domain's canonical form), so one database state always
 * exports to the same canonical JSON, byte for byte.
 */
import { AppError, bundleSchema, type Bundle } from "../domain/index";
import type { Db } from "./period-db";
import { assembleBundle } from "./period-export-assemble";
import { exportError } from "./period-export-errors";
import { loadPeriodRows } from "./period-export-rows";

/**
 * The bundle of bid period `periodId`, parsed with bundleSchema so an export
 * can never emit an invalid bundle. Throws AppError("not_found") for an
 * unknown period, and AppError("invalid") naming each row that breaks the
 * schema (for example a leg whose arrival is not after its departure) or when
 * the period has no award groups.
 */
export async function exportPeriod(prisma: Db, periodId: string): Promise<Bundle> {
  const rows = await loadPeriodRows(prisma, periodId);
  const { period } = rows;
  if (period.groups.length === 0) {
    throw new AppError(
      "invalid",
      `bid period "${period.name}" (${period.id}) has no award groups, and a bundle holds one instance per award group`,
    );
  }
  const { candidate, sources } = assembleBundle(rows);
  const parsed = bundleSchema.safeParse(candidate);
  if (!parsed.success) throw exportError(sources, parsed.error);
  return parsed.data;
}
