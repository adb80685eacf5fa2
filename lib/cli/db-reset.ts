/**
 * `npm run db:reset`: empties the demo database, migrates and seeds it again.
 * Refuses any server that is not on this machine.
 */
import pg from "pg";
import { createPrisma } from "../db/client.ts";
import { isLocalUrl, resolveDatabase } from "../db/database.ts";
import { applyMigrations } from "../db/migrate.ts";
import { seedDemoIfEmpty } from "../../seed/demo.ts";

const given = process.env.DATABASE_URL;
if (given && !isLocalUrl(given)) {
  console.error(`db:reset refuses ${new URL(given).host}: it only resets a database on this machine`);
  process.exit(1);
}
const db = await resolveDatabase({ log: console.log });
try {
  const client = new pg.Client({ connectionString: db.url });
  await client.connect();
  // Drop what we own, not the database: the URL's user may lack CREATEDB.
  await client.query("DROP SCHEMA IF EXISTS public CASCADE; DROP SCHEMA IF EXISTS pgboss CASCADE; CREATE SCHEMA public;");
  await client.end();
  await applyMigrations(db.url, { log: console.log });
  const prisma = createPrisma(db.url);
  await seedDemoIfEmpty(prisma);
  await prisma.$disconnect();
  console.log(`reset ${new URL(db.url).pathname.slice(1)} on ${new URL(db.url).host}: migrated and seeded`);
} catch (e) {
  console.error(`db:reset failed: ${(e as Error).message}`);
  process.exitCode = 1;
} finally {
  await db.server?.stop();
}
