/**
 * The offline migration runner. Applies prisma/migrations/<name>/migration.sql
 * in name order, each in its own transaction, and records them in Prisma's own
 * `_prisma_migrations` table with Prisma's checksum (SHA-256 of the file), so the
 * stock `prisma migrate deploy` can take over wherever its engine is available.
 * An advisory lock keeps two starters (demo, worker, tests) from racing.
 */
import { createHash, randomUUID } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import pg from "pg";

export const MIGRATIONS_DIR = path.resolve(import.meta.dirname, "../../prisma/migrations");
/** Arbitrary but fixed: the key of the advisory lock held while migrating. */
const LOCK_KEY = 72_4011_2026;

export interface Migration {
  name: string;
  sql: string;
  checksum: string;
}

/**
 * The committed migrations, in the order they apply. A migration folder
 * without its migration.sql is an error, as it is for Prisma's own CLI.
 * The one reader of the folder: the runner and the schema diff both use it.
 */
export function readMigrations(dir = MIGRATIONS_DIR): Migration[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { withFileTypes: true })
    .filter((e) => e.isDirectory())
    .map((e) => e.name)
    .sort()
    .map((name) => {
      const file = path.join(dir, name, "migration.sql");
      if (!fs.existsSync(file)) throw new Error(`${file} is missing: every folder in ${dir} must hold a migration.sql`);
      const sql = fs.readFileSync(file, "utf8");
      return { name, sql, checksum: createHash("sha256").update(sql).digest("hex") };
    });
}

// Prisma's own definition of its bookkeeping table.
const CREATE_TABLE = `CREATE TABLE IF NOT EXISTS "_prisma_migrations" (
  "id" VARCHAR(36) PRIMARY KEY NOT NULL,
  "checksum" VARCHAR(64) NOT NULL,
  "finished_at" TIMESTAMPTZ,
  "migration_name" VARCHAR(255) NOT NULL,
  "logs" TEXT,
  "rolled_back_at" TIMESTAMPTZ,
  "started_at" TIMESTAMPTZ NOT NULL DEFAULT now(),
  "applied_steps_count" INTEGER NOT NULL DEFAULT 0
)`;

/** Applies every pending migration; returns the names applied now. */
export async function applyMigrations(
  databaseUrl: string,
  opts: { dir?: string; log?: (line: string) => void } = {},
): Promise<string[]> {
  const log = opts.log ?? (() => {});
  const migrations = readMigrations(opts.dir);
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  const applied: string[] = [];
  try {
    await client.query("SELECT pg_advisory_lock($1)", [LOCK_KEY]);
    await client.query(CREATE_TABLE);
    const { rows } = await client.query<{ migration_name: string; checksum: string; finished_at: Date | null }>(
      `SELECT migration_name, checksum, finished_at FROM "_prisma_migrations" WHERE rolled_back_at IS NULL`,
    );
    const done = new Map(rows.map((r) => [r.migration_name, r]));
    for (const m of migrations) {
      const row = done.get(m.name);
      if (row && row.finished_at === null) {
        throw new Error(`migration ${m.name} started earlier and did not finish; repair the database by hand or reset it (npm run db:reset)`);
      }
      if (row) {
        if (row.checksum !== m.checksum) {
          throw new Error(`migration ${m.name} was edited after it was applied; add a new migration instead (or reset a local database: npm run db:reset)`);
        }
        continue;
      }
      await client.query("BEGIN");
      try {
        await client.query(
          `INSERT INTO "_prisma_migrations" (id, checksum, migration_name, started_at) VALUES ($1, $2, $3, now())`,
          [randomUUID(), m.checksum, m.name],
        );
        await client.query(m.sql);
        await client.query(
          `UPDATE "_prisma_migrations" SET finished_at = now(), applied_steps_count = 1 WHERE migration_name = $1 AND finished_at IS NULL`,
          [m.name],
        );
        await client.query("COMMIT");
      } catch (e) {
        await client.query("ROLLBACK");
        throw new Error(`migration ${m.name} failed and was rolled back: ${(e as Error).message}`);
      }
      log(`applied migration ${m.name}`);
      applied.push(m.name);
    }
  } finally {
    await client.query("SELECT pg_advisory_unlock($1)", [LOCK_KEY]).catch(() => {});
    await client.end();
  }
  return applied;
}
