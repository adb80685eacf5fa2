/**
 * Who is asking about which bid: every bid function starts here. A bid belongs
 * to one crew member and one bid period of their own base; nobody else (not a
 * colleague, not a scheduler through these functions) reads or writes it.
 */
import { db } from "./client";
import type { SessionUser } from "./users";
import { AppError, localDateTimeLabel } from "../domain/index";

/** The crew member and the bid period a bid function works on. */
export interface BidScope {
  crewMemberId: string;
  /** employee number: the bid's `crewId` */
  crewId: string;
  baseId: string;
  position: string;
  period: {
    id: string;
    name: string;
    zone: string;
    startDate: string;
    endDate: string;
    deadline: Date;
    state: string;
  };
}

const isoDate = (d: Date) => d.toISOString().slice(0, 10);

/**
 * The scope of `user`'s bid for `periodId` (or for the open period of their
 * base when none is named). Throws forbidden for an account that is not a
 * crew member, not_found for a period that is not at their base.
 */
export async function bidScope(user: SessionUser, periodId?: string): Promise<BidScope> {
  if (user.role !== "crew" || !user.crewMemberId) throw new AppError("forbidden", "only a crew member's own account has a bid");
  const crew = await db().crewMember.findUnique({
    where: { id: user.crewMemberId },
    select: { id: true, employeeNumber: true, baseId: true, position: true },
  });
  if (!crew) throw new AppError("forbidden", "this account is not linked to a crew member");
  const period = await db().bidPeriod.findFirst({
    where: periodId ? { id: periodId, baseId: crew.baseId } : { baseId: crew.baseId, state: "open" },
    orderBy: { startDate: "asc" },
  });
  if (!period) throw new AppError("not_found", periodId ? "there is no such bid period at your base" : "bidding is not open at your base right now");
  return {
    crewMemberId: crew.id,
    crewId: crew.employeeNumber,
    baseId: crew.baseId,
    position: crew.position,
    period: {
      id: period.id,
      name: period.name,
      zone: period.zone,
      startDate: isoDate(period.startDate),
      endDate: isoDate(period.endDate),
      deadline: period.deadline,
      state: period.state,
    },
  };
}

/**
 * Throws deadline_passed unless the period takes crew edits at `now`: it is
 * open and its deadline (an instant, set in the base's zone) is still ahead.
 */
export function assertBiddingOpen(scope: BidScope, now: Date): void {
  const { period } = scope;
  const when = localDateTimeLabel(period.deadline.toISOString(), period.zone);
  if (period.state !== "open") {
    throw new AppError("deadline_passed", `bidding for ${period.name} is ${period.state === "draft" ? "not open yet" : "closed"}; your bid was not changed`);
  }
  if (now.getTime() >= period.deadline.getTime()) {
    throw new AppError("deadline_passed", `bidding for ${period.name} closed at ${when}; your bid was not changed`);
  }
}
