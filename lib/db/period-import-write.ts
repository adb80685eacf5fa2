/**
 * Writes an import plan inside the caller's transaction, table by table: the
 * many-row tables with one unnest statement per 20,000 rows
 * (period-import-bulk.ts), the others with createMany. A 300-crew,
 * 1,000-pairing period is a few dozen statements rather than tens of thousands
 * of nested inserts.
 */
import type { DbTx } from "./period-db";
import {
  activityColumns,
  bulkInsert,
  dailyFlightColumns,
  dutyPeriodColumns,
  legColumns,
  pastDutyColumns,
} from "./period-import-bulk";
import { baseId, ruleSetIds } from "./period-import-database";
import type { ImportPlan } from "./period-import-rows";

/**
 * PostgreSQL's protocol allows 65,535 bind parameters per statement; chunks
 * stay under half of that whatever the width of the table.
 */
const MAX_PARAMETERS = 30_000;

async function insertAll<T extends object>(rows: readonly T[], insert: (chunk: T[]) => Promise<unknown>): Promise<void> {
  if (rows.length === 0) return;
  const size = Math.max(1, Math.floor(MAX_PARAMETERS / Object.keys(rows[0]!).length));
  for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size));
}

/** Writes every row of `plan`; the caller has refused conflicts first. */
export async function writePlan(tx: DbTx, plan: ImportPlan): Promise<void> {
  // Stations already present were checked to agree in zone and longitude; they are kept as they are.
  await tx.station.createMany({ data: plan.stations.map((s) => ({ ...s.station })), skipDuplicates: true });
  const base = await baseId(tx, plan);
  await tx.bidPeriod.create({ data: { ...plan.period, baseId: base } });
  await insertAll(
    plan.crew.map((c) => ({ ...c.row, baseId: base })),
    (data) => tx.crewMember.createMany({ data }),
  );
  await insertAll(plan.pairings, (data) => tx.pairing.createMany({ data }));
  await bulkInsert(tx, "DutyPeriod", dutyPeriodColumns, plan.dutyPeriods);
  await bulkInsert(tx, "Leg", legColumns, plan.legs);
  await bulkInsert(tx, "FixedActivity", activityColumns, plan.activities);
  await insertAll(plan.carryIn, (data) => tx.carryInTrip.createMany({ data }));
  await bulkInsert(tx, "PastDuty", pastDutyColumns, plan.pastDuties);
  await bulkInsert(tx, "DailyFlightTotal", dailyFlightColumns, plan.dailyFlight);
  const ruleSets = await ruleSetIds(tx, plan.ruleSets);
  await tx.awardGroup.createMany({
    data: plan.groups.map((g) => ({ bidPeriodId: plan.period.id, position: g.position, ruleSetId: ruleSets[g.ruleSet]!, settings: g.settings })),
  });
  await insertAll(plan.bids, (data) => tx.bid.createMany({ data }));
  await insertAll(plan.submissions, (data) => tx.bidSubmission.createMany({ data }));
}
