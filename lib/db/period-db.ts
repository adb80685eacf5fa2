/**
 * The client types period import and export take: the app's own client
 * (`Db`, with its global omissions) and the transaction client its
 * `$transaction` hands to a callback.
 */
import type { Db } from "./client";

export type { Db };

/** The client inside `db().$transaction(async (tx) => …)`. */
export type DbTx = Parameters<Parameters<Db["$transaction"]>[0]>[0];
