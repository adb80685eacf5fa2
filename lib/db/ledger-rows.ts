/** The fairness ledger as later periods read it. */
import type { DbTx } from "./period-db";

/** Each crew member's entry from their latest period starting before `startDate` (none: absent). */
export async function latestEarlierEntries(tx: DbTx, crewMemberIds: string[], startDate: Date): Promise<Map<string, { balance: number; carriedWeight: number }>> {
  const rows = await tx.fairnessEntry.findMany({
    where: { crewMemberId: { in: crewMemberIds }, bidPeriod: { startDate: { lt: startDate } } },
    orderBy: { bidPeriod: { startDate: "desc" } },
    select: { crewMemberId: true, balance: true, carriedWeight: true },
  });
  const latest = new Map<string, { balance: number; carriedWeight: number }>();
  for (const e of rows) if (!latest.has(e.crewMemberId)) latest.set(e.crewMemberId, { balance: e.balance, carriedWeight: e.carriedWeight });
  return latest;
}
