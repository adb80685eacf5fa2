/**
 * A crew member's bid: one draft row per crew member and period whose
 * `revision` goes up by one on every save, and immutable submitted versions
 * with a receipt. Saves name the revision they started from; a save from an
 * older revision (another device saved meanwhile) is a conflict returned as
 * data with the stored draft, never an overwrite. Every function is scoped by
 * the asking user (lib/db/bid-scope.ts) and takes the clock as a parameter.
 */
import { db } from "./client";
import { Prisma } from "./generated/client";
import { assertBiddingOpen, bidScope, type BidScope } from "./bid-scope";
import { checkWishes } from "./bid-check";
import { bidReceipt } from "./bid-receipt";
import type { SessionUser } from "./users";
import { AppError, canonicalJson, carryWishes, sha256Text, wishListSchema, type Wish } from "../domain/index";

/** The draft as stored: revision 0 means nothing was saved yet. */
export interface StoredDraft {
  revision: number;
  wishes: Wish[];
  savedAt: string | null;
}

/** A submitted version, numbered 1, 2, … in submission order. */
export interface BidVersion {
  id: string;
  version: number;
  /** the draft revision this version froze */
  revision: number;
  receiptCode: string;
  hash: string;
  submittedAt: string;
  wishes: Wish[];
}

/** What the bid page shows. */
export interface BidView {
  scope: BidScope;
  draft: StoredDraft;
  /** newest first */
  versions: BidVersion[];
}

export type SaveResult =
  | { status: "saved"; draft: StoredDraft }
  | { status: "conflict"; stored: StoredDraft };

export type SubmitResult =
  | { status: "submitted"; version: BidVersion; unchanged: boolean }
  | { status: "conflict"; stored: StoredDraft };

const json = (wishes: Wish[]) => wishes as unknown as Prisma.InputJsonValue;

function draftOf(row: { revision: number; wishes: unknown; updatedAt: Date } | null): StoredDraft {
  if (!row) return { revision: 0, wishes: [], savedAt: null };
  return { revision: row.revision, wishes: wishListSchema.parse(row.wishes), savedAt: row.updatedAt.toISOString() };
}

async function readDraft(scope: BidScope): Promise<StoredDraft> {
  const row = await db().bid.findUnique({ where: { crewMemberId_bidPeriodId: { crewMemberId: scope.crewMemberId, bidPeriodId: scope.period.id } } });
  return draftOf(row);
}

async function readVersions(scope: BidScope): Promise<BidVersion[]> {
  const rows = await db().bidSubmission.findMany({
    where: { crewMemberId: scope.crewMemberId, bidPeriodId: scope.period.id },
    orderBy: [{ revision: "asc" }],
  });
  return rows
    .map((row, k) => ({
      id: row.id,
      version: k + 1,
      revision: row.revision,
      receiptCode: row.receiptCode,
      hash: row.hash,
      submittedAt: row.submittedAt.toISOString(),
      wishes: wishListSchema.parse(row.wishes),
    }))
    .reverse();
}

/** The user's bid for the open period of their base (or `periodId`). */
export async function loadBid(user: SessionUser, periodId?: string): Promise<BidView> {
  const scope = await bidScope(user, periodId);
  const [draft, versions] = await Promise.all([readDraft(scope), readVersions(scope)]);
  return { scope, draft, versions };
}

/** One submitted version of the user's own bid; not_found for anyone else's. */
export async function loadVersion(user: SessionUser, submissionId: string): Promise<{ scope: BidScope; version: BidVersion }> {
  if (user.role !== "crew" || !user.crewMemberId) throw new AppError("forbidden", "only a crew member's own account has a bid");
  const row = await db().bidSubmission.findFirst({ where: { id: submissionId, crewMemberId: user.crewMemberId }, select: { bidPeriodId: true } });
  if (!row) throw new AppError("not_found", "there is no such version of your bid");
  const scope = await bidScope(user, row.bidPeriodId);
  const version = (await readVersions(scope)).find((v) => v.id === submissionId)!;
  return { scope, version };
}

/**
 * Stores `wishes` as the draft's next revision if the stored draft is still
 * at `baseRevision`; otherwise returns the stored draft as a conflict (a save
 * that would store exactly what is stored is no conflict: it adopts it).
 */
export async function saveDraft(
  user: SessionUser,
  input: { periodId: string; baseRevision: number; wishes: unknown },
  now: Date,
): Promise<SaveResult> {
  const scope = await bidScope(user, input.periodId);
  assertBiddingOpen(scope, now);
  const wishes = await checkWishes(scope, input.wishes);
  return writeDraft(scope, input.baseRevision, wishes);
}

async function writeDraft(scope: BidScope, baseRevision: number, wishes: Wish[]): Promise<SaveResult> {
  const key = { crewMemberId: scope.crewMemberId, bidPeriodId: scope.period.id };
  const { count } = await db().bid.updateMany({ where: { ...key, revision: baseRevision }, data: { wishes: json(wishes), revision: baseRevision + 1 } });
  if (count === 0 && baseRevision === 0) {
    try {
      const row = await db().bid.create({ data: { ...key, wishes: json(wishes), revision: 1 } });
      return { status: "saved", draft: draftOf(row) };
    } catch (error) {
      if (!(error instanceof Prisma.PrismaClientKnownRequestError && error.code === "P2002")) throw error;
    }
  }
  const stored = await readDraft(scope);
  if (count === 1) return { status: "saved", draft: stored };
  if (stored.revision > 0 && canonicalJson(stored.wishes) === canonicalJson(wishes)) return { status: "saved", draft: stored };
  return { status: "conflict", stored };
}

/**
 * Submits the draft as it stands at `revision`: a new immutable version with
 * its receipt. Submitting a revision already submitted returns that version
 * (`unchanged`); a stale revision is a conflict.
 */
export async function submitBid(user: SessionUser, input: { periodId: string; revision: number }, now: Date): Promise<SubmitResult> {
  const scope = await bidScope(user, input.periodId);
  assertBiddingOpen(scope, now);
  const stored = await readDraft(scope);
  if (stored.revision !== input.revision || stored.revision === 0) {
    if (stored.revision === 0) throw new AppError("invalid", "there is nothing saved to submit yet");
    return { status: "conflict", stored };
  }
  const versions = await readVersions(scope);
  const already = versions.find((v) => v.revision === stored.revision);
  if (already) return { status: "submitted", version: already, unchanged: true };
  const receipt = bidReceipt({ crewId: scope.crewId, periodId: scope.period.id, wishes: stored.wishes });
  // The code is the hash's head; the same content submitted again as a later
  // version (A, B, then A) needs a code of its own, so it is then taken from
  // the hash of the content hash and the version number.
  const taken = versions.some((v) => v.receiptCode === receipt.receiptCode);
  const receiptCode = taken ? codeOf(sha256Text(`${receipt.hash}#${versions.length + 1}`)) : receipt.receiptCode;
  try {
    await db().$transaction(async (tx) => {
      // The draft must still be at this revision when the version is written.
      const current = await tx.bid.findUnique({ where: { crewMemberId_bidPeriodId: { crewMemberId: scope.crewMemberId, bidPeriodId: scope.period.id } }, select: { revision: true } });
      if (current?.revision !== stored.revision) throw new AppError("conflict", "the draft changed while submitting");
      await tx.bidSubmission.create({
        data: {
          crewMemberId: scope.crewMemberId,
          bidPeriodId: scope.period.id,
          revision: stored.revision,
          wishes: json(receipt.bid.wishes),
          hash: receipt.hash,
          receiptCode,
          submittedAt: now,
        },
      });
    });
  } catch (error) {
    const race = (error instanceof AppError && error.code === "conflict") || (error instanceof Prisma.PrismaClientKnownRequestError && error.code === "P2002");
    if (!race) throw error;
    const again = await readDraft(scope);
    const done = (await readVersions(scope)).find((v) => v.revision === again.revision);
    if (done && again.revision === stored.revision) return { status: "submitted", version: done, unchanged: true };
    return { status: "conflict", stored: again };
  }
  const version = (await readVersions(scope)).find((v) => v.revision === stored.revision)!;
  return { status: "submitted", version, unchanged: false };
}

function codeOf(hash: string): string {
  const head = hash.slice(0, 12).toUpperCase();
  return `${head.slice(0, 4)}-${head.slice(4, 8)}-${head.slice(8, 12)}`;
}

/**
 * Appends `wish` (unparsed; checked with the rest of the draft by
 * checkWishes, i.e. bidSchema, as every save is) to the end of the user's
 * draft, whatever revision it is at: an append reads and writes in one step,
 * so it cannot overwrite another device's save. Retries on a race.
 */
export async function appendWish(user: SessionUser, wish: unknown, now: Date): Promise<StoredDraft> {
  const scope = await bidScope(user);
  assertBiddingOpen(scope, now);
  for (let attempt = 0; attempt < 3; attempt++) {
    const stored = await readDraft(scope);
    const wishes = await checkWishes(scope, [...stored.wishes, wish]);
    const result = await writeDraft(scope, stored.revision, wishes);
    if (result.status === "saved") return result.draft;
  }
  throw new AppError("conflict", "your bid is being changed on another device; try again");
}

/** A trip wish for trip `code` at the end of the draft (the trip page's "add to my bid"). */
export function addTripWish(user: SessionUser, code: string, now: Date): Promise<StoredDraft> {
  return appendWish(user, { kind: "trip", pairingIds: [code] }, now);
}

/** The trip numbers of the scope's period, sorted: what the wish form checks named trips against (as checkWishes does). */
export async function periodTripCodes(scope: BidScope): Promise<string[]> {
  const rows = await db().pairing.findMany({ where: { bidPeriodId: scope.period.id }, select: { code: true }, orderBy: { code: "asc" } });
  return rows.map((r) => r.code);
}

/** The latest bid the user submitted for an earlier period at their base (else its last draft), or null. */
export async function previousBid(scope: BidScope): Promise<{ periodName: string; wishes: Wish[] } | null> {
  const period = await db().bidPeriod.findFirst({
    where: { baseId: scope.baseId, startDate: { lt: new Date(`${scope.period.startDate}T00:00:00Z`) } },
    orderBy: { startDate: "desc" },
    include: {
      submissions: { where: { crewMemberId: scope.crewMemberId }, orderBy: { revision: "desc" }, take: 1 },
      bids: { where: { crewMemberId: scope.crewMemberId }, take: 1 },
    },
  });
  const wishes = period?.submissions[0]?.wishes ?? period?.bids[0]?.wishes;
  if (!period || wishes === undefined) return null;
  return { periodName: period.name, wishes: wishListSchema.parse(wishes) };
}

/**
 * Puts last period's bid after the draft's wishes as a starting point (see
 * carryWishes for what is left behind), as a save from `baseRevision`.
 */
export async function copyPreviousBid(
  user: SessionUser,
  input: { periodId: string; baseRevision: number },
  now: Date,
): Promise<SaveResult & { leftBehind: string[]; copied: number }> {
  const scope = await bidScope(user, input.periodId);
  assertBiddingOpen(scope, now);
  const previous = await previousBid(scope);
  if (!previous) throw new AppError("not_found", "you have no bid from an earlier period to copy");
  const carried = carryWishes(previous.wishes);
  const stored = await readDraft(scope);
  if (stored.revision !== input.baseRevision) return { status: "conflict", stored, leftBehind: [], copied: 0 };
  const wishes = await checkWishes(scope, [...stored.wishes, ...carried.wishes]);
  const result = await writeDraft(scope, input.baseRevision, wishes);
  return { ...result, leftBehind: carried.leftBehind, copied: carried.wishes.length };
}
