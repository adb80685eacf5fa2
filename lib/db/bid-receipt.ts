/**
 * The receipt of a submitted bid. DESIGN.md: receipts are SHA-256 of the RFC
 * 8785 canonical JSON of the bid; the bid is lib/domain's bidSchema,
 * { crewId (employee number), periodId (the bid period's id), wishes }, parsed
 * first so that defaults and instant spellings never change the hash.
 */
import { bidSchema, sha256Hex, type Bid } from "../domain/index";

/** A bid's hash and the short code a crew member reads off the receipt. */
export interface BidReceipt {
  bid: Bid;
  /** 64 lowercase hex digits */
  hash: string;
  /** the hash's first 12 hex digits, upper case, in groups of four: "3F2A-9C1D-77E0" */
  receiptCode: string;
}

/** The receipt of `bid` (parsed with bidSchema, which throws on an invalid bid). */
export function bidReceipt(bid: { crewId: string; periodId: string; wishes: unknown }): BidReceipt {
  const parsed = bidSchema.parse(bid);
  const hash = sha256Hex(parsed);
  const head = hash.slice(0, 12).toUpperCase();
  return { bid: parsed, hash, receiptCode: `${head.slice(0, 4)}-${head.slice(4, 8)}-${head.slice(8, 12)}` };
}
