/**
 * The one Prisma client of a process, over the pg driver adapter (Prisma 7
 * has no bundled engine: the query compiler is WebAssembly in @prisma/client).
 * Kept on globalThis so Next's dev reloads don't open a pool per reload.
 */
import { PrismaPg } from "@prisma/adapter-pg";
import { PrismaClient } from "./generated/client";
import { databaseUrl } from "../env";

const globalForPrisma = globalThis as unknown as { bidwrightPrisma?: PrismaClient };

/** Creates a client for a given database (tests use one per run). */
export function createPrisma(url: string): PrismaClient {
  return new PrismaClient({ adapter: new PrismaPg({ connectionString: url, max: 10 }) });
}

/** The process-wide client for DATABASE_URL. */
export function db(): PrismaClient {
  globalForPrisma.bidwrightPrisma ??= createPrisma(databaseUrl());
  return globalForPrisma.bidwrightPrisma;
}

export type { PrismaClient };
