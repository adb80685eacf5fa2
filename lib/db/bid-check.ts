/**
 * Checks a bid's wishes before they are stored: the shared zod schema first
 * (lib/domain bidSchema, the same one the forms use), then the facts only the
 * database knows — that named trips are trips of this period, and that a buddy
 * is a colleague in the same award group (base × position).
 */
import { db } from "./client";
import type { BidScope } from "./bid-scope";
import { AppError, bidSchema, type Wish } from "../domain/index";

/** A problem with one field of one wish: `path` starts at the wish's rank. */
export interface WishIssue {
  path: (string | number)[];
  message: string;
}

/**
 * The wishes parsed and checked, or AppError("invalid") whose `details.issues`
 * name each bad field by its path in the wish list, e.g. [2, "dates", 0].
 */
export async function checkWishes(scope: BidScope, wishes: unknown): Promise<Wish[]> {
  const parsed = bidSchema.safeParse({ crewId: scope.crewId, periodId: scope.period.id, wishes });
  if (!parsed.success) {
    const issues: WishIssue[] = parsed.error.issues.map((issue) => ({
      path: issue.path[0] === "wishes" ? (issue.path.slice(1) as (string | number)[]) : (issue.path as (string | number)[]),
      message: issue.message,
    }));
    throw invalid(issues);
  }
  const list = parsed.data.wishes;
  const issues: WishIssue[] = [];
  const named = [...new Set(list.flatMap((w) => (w.kind === "trip" || w.kind === "no-trip" ? (w.pairingIds ?? []) : [])))];
  if (named.length > 0) {
    const found = await db().pairing.findMany({ where: { bidPeriodId: scope.period.id, code: { in: named } }, select: { code: true } });
    const known = new Set(found.map((p) => p.code));
    list.forEach((w, rank) => {
      if (w.kind !== "trip" && w.kind !== "no-trip") return;
      w.pairingIds?.forEach((code, k) => {
        if (!known.has(code)) issues.push({ path: [rank, "pairingIds", k], message: `there is no trip ${code} in ${scope.period.name}` });
      });
    });
  }
  list.forEach((w, rank) => {
    if (w.kind !== "free-days") return;
    w.dates.forEach((date, k) => {
      if (date < scope.period.startDate || date > scope.period.endDate) {
        issues.push({ path: [rank, "dates", k], message: `${date} is not a day of ${scope.period.name}` });
      }
    });
  });
  for (const [rank, w] of list.entries()) {
    if (w.kind !== "buddy") continue;
    const buddy = await db().crewMember.findFirst({
      where: { employeeNumber: w.crewId, baseId: scope.baseId, position: scope.position as never },
      select: { id: true },
    });
    if (!buddy) issues.push({ path: [rank, "crewId"], message: `no colleague with employee number ${w.crewId} flies your position at your base` });
  }
  if (issues.length > 0) throw invalid(issues);
  return list;
}

function invalid(issues: WishIssue[]): AppError {
  const first = issues[0]!;
  const where = typeof first.path[0] === "number" ? `wish ${first.path[0] + 1}: ` : "";
  return new AppError("invalid", `${where}${first.message}`, { issues });
}
