/**
 * The bid period before the seeded one, at the same base of Larkfield Air, with
 * a bid each of the given crew members submitted there: enough for "start from
 * my last bid" to show on the bid page of the demo and the browser tests. It
 * holds no trips (its line awards are not part of the seed), so it is left
 * "closed" rather than claiming an award was published.
 */
import type { Db } from "../lib/db/client.ts";
import { bidReceipt } from "../lib/db/bid-receipt.ts";
import { addDays, atLocalTime, monthLabel, type Wish } from "../lib/domain/index.ts";

/** A bid for the month before `startDate` ("YYYY-MM-01"): each kind of wish, some of them tied to that month. */
export function pastWishes(startDate: string): Wish[] {
  const month = addDays(startDate, -1).slice(0, 7);
  return [
    { kind: "trip", filter: { lengthDays: { min: 3, max: 4 }, redEye: false }, count: 2 },
    { kind: "free-days", dates: [`${month}-10`, `${month}-11`, `${month}-12`] },
    { kind: "no-trip", filter: { reportBefore: "06:00" } },
    { kind: "rhythm", maxDaysOn: 4 },
    { kind: "trip", pairingIds: ["T105"], count: 1 },
    { kind: "credit", minMinutes: 72 * 60, maxMinutes: 84 * 60 },
  ];
}

/**
 * Writes the period before `periodId` and a submitted version (revision 1,
 * with its receipt) for each of `crewIds` (employee numbers). Returns the new
 * period's id.
 */
export async function writePastPeriod(prisma: Db, periodId: string, crewIds: readonly string[]): Promise<string> {
  const current = await prisma.bidPeriod.findUniqueOrThrow({ where: { id: periodId }, include: { base: { select: { stationCode: true } } } });
  const zone = current.zone;
  const currentStart = current.startDate.toISOString().slice(0, 10);
  const end = addDays(currentStart, -1);
  const start = `${end.slice(0, 7)}-01`;
  const biddingMonth = addDays(start, -1).slice(0, 7);
  const deadline = new Date(atLocalTime(`${biddingMonth}-20`, "18:00", zone));
  const id = `${current.base.stationCode}-${start.slice(0, 7)}`;
  const wishes = pastWishes(currentStart);
  await prisma.$transaction(async (tx) => {
    await tx.bidPeriod.create({
      data: {
        id,
        baseId: current.baseId,
        name: monthLabel(start),
        startDate: new Date(`${start}T00:00:00Z`),
        endDate: new Date(`${end}T00:00:00Z`),
        zone,
        opensAt: new Date(atLocalTime(`${biddingMonth}-01`, "00:00", zone)),
        deadline,
        state: "closed",
        closedAt: deadline,
      },
    });
    for (const crewId of crewIds) {
      const crew = await tx.crewMember.findUniqueOrThrow({ where: { employeeNumber: crewId } });
      const receipt = bidReceipt({ crewId, periodId: id, wishes });
      const json = receipt.bid.wishes as unknown as object[];
      await tx.bid.create({ data: { crewMemberId: crew.id, bidPeriodId: id, wishes: json, revision: 1 } });
      await tx.bidSubmission.create({
        data: {
          crewMemberId: crew.id,
          bidPeriodId: id,
          revision: 1,
          wishes: json,
          hash: receipt.hash,
          receiptCode: receipt.receiptCode,
          submittedAt: new Date(deadline.getTime() - 3 * 86_400_000),
        },
      });
    }
  });
  return id;
}
