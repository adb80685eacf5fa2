import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import { AppError } from "./errors.ts";

/**
 * The RFC 8785 (JSON Canonicalization Scheme) text of `value`: properties
 * sorted by UTF-16 code units, numbers in ECMAScript form, no whitespace. Values
 * JSON cannot hold (undefined at the top, NaN, Infinity) are refused, so that a
 * hash never silently covers less than the caller meant.
 */
export function canonicalJson(value: unknown): string {
  let text: string | undefined;
  try {
    text = canonicalize(value);
  } catch (error) {
    throw new AppError("invalid", `cannot canonicalize: ${(error as Error).message}`);
  }
  if (text === undefined) throw new AppError("invalid", "cannot canonicalize a value JSON cannot hold");
  return text;
}

/** SHA-256 of the UTF-8 bytes of `text`, as 64 lowercase hex digits. */
export function sha256Text(text: string): string {
  return createHash("sha256").update(text, "utf8").digest("hex");
}

/**
 * SHA-256 of the canonical JSON of `value`, in hex: the hash of bid receipts,
 * award-run inputs and the stale-run check. Hash parsed documents, so that
 * defaults and instant spellings are the same on both sides of a comparison.
 */
export function sha256Hex(value: unknown): string {
  return sha256Text(canonicalJson(value));
}
