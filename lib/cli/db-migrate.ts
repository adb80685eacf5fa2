/** `npm run db:migrate`: applies pending migrations to DATABASE_URL (or the embedded server). */
import { resolveDatabase } from "../db/database.ts";
import { applyMigrations } from "../db/migrate.ts";

const db = await resolveDatabase({ log: console.log });
try {
  const applied = await applyMigrations(db.url, { log: console.log });
  console.log(applied.length ? `${applied.length} migration(s) applied` : "database is up to date");
} catch (e) {
  console.error(`db:migrate failed: ${(e as Error).message}`);
  process.exitCode = 1;
} finally {
  await db.server?.stop();
}
