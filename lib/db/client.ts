/**
 * The one Prisma client of a process, over the pg driver adapter (Prisma 7
 * has no bundled engine: the query compiler is WebAssembly in @prisma/client).
 * Kept on globalThis so Next's dev reloads don't open a pool per reload.
 */
import { PrismaPg } from "@prisma/adapter-pg";
import { PrismaClient } from "./generated/client";
import { databaseUrl } from "../env";

const globalForPrisma = globalThis as unknown as { bidwrightPrisma?: Db };

/**
 * Creates a client for a given database (tests use one per run). Password
 * hashes are left out of every query unless one asks for them by name.
 */
export function createPrisma(url: string) {
  return new PrismaClient({ adapter: new PrismaPg({ connectionString: url, max: 10 }), omit: { user: { passwordHash: true } } });
}

export type Db = ReturnType<typeof createPrisma>;

/** The process-wide client for DATABASE_URL. */
export function db(): Db {
  globalForPrisma.bidwrightPrisma ??= createPrisma(databaseUrl());
  return globalForPrisma.bidwrightPrisma;
}

export type { PrismaClient };
