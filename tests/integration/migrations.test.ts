import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabaseIfMissing, dropDatabase, withDatabase } from "@/lib/db/database";
import { applyMigrations, readMigrations } from "@/lib/db/migrate";

const serverUrl = inject("serverUrl");
const scratch = `bw_mig_${process.pid}_${Date.now().toString(36)}`;
const scratchUrl = withDatabase(serverUrl, scratch);

async function query<T extends pg.QueryResultRow>(url: string, sql: string): Promise<T[]> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return (await c.query<T>(sql)).rows;
  } finally {
    await c.end();
  }
}

function tempMigrations(files: Record<string, string>): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "bw-mig-"));
  for (const [name, sql] of Object.entries(files)) {
    fs.mkdirSync(path.join(dir, name));
    fs.writeFileSync(path.join(dir, name, "migration.sql"), sql);
  }
  return dir;
}

describe("the migration runner", () => {
  beforeAll(() => createDatabaseIfMissing(serverUrl, scratch));
  afterAll(() => dropDatabase(serverUrl, scratch));

  it("applies the committed migrations once, even when two starters race, recording Prisma's checksum", async () => {
    const [a, b] = await Promise.all([applyMigrations(scratchUrl), applyMigrations(scratchUrl)]);
    const committed = readMigrations();
    expect(committed.length).toBeGreaterThan(0);
    // Exactly one of the two racers applied each migration.
    expect([...a, ...b].sort()).toEqual(committed.map((m) => m.name).sort());
    const rows = await query<{ migration_name: string; checksum: string; finished_at: Date | null; applied_steps_count: number }>(
      scratchUrl,
      `SELECT migration_name, checksum, finished_at, applied_steps_count FROM "_prisma_migrations" ORDER BY migration_name`,
    );
    expect(rows.map((r) => r.migration_name)).toEqual(committed.map((m) => m.name));
    const first = committed[0]!;
    const onDisk = fs.readFileSync(path.join("prisma/migrations", first.name, "migration.sql"));
    expect(rows[0]!.checksum).toBe(createHash("sha256").update(onDisk).digest("hex"));
    expect(rows.every((r) => r.finished_at !== null && r.applied_steps_count === 1)).toBe(true);
    expect(await applyMigrations(scratchUrl)).toEqual([]);
  });

  it("rolls a failing migration back completely and says which one failed", async () => {
    const name = `${scratch}_f`;
    await createDatabaseIfMissing(serverUrl, name);
    const url = withDatabase(serverUrl, name);
    const dir = tempMigrations({
      "0001_ok": `CREATE TABLE "Kept" (id int);`,
      "0002_broken": `CREATE TABLE "HalfWritten" (id int); INSERT INTO "Kept" VALUES (1); SELECT 1/0;`,
    });
    try {
      await expect(applyMigrations(url, { dir })).rejects.toThrow(/0002_broken failed and was rolled back: division by zero/);
      const tables = await query<{ tablename: string }>(url, `SELECT tablename FROM pg_tables WHERE schemaname='public' ORDER BY 1`);
      expect(tables.map((t) => t.tablename)).toEqual(["Kept", "_prisma_migrations"]);
      expect(await query(url, `SELECT * FROM "Kept"`)).toEqual([]);
      const recorded = await query<{ migration_name: string }>(url, `SELECT migration_name FROM "_prisma_migrations"`);
      expect(recorded.map((r) => r.migration_name)).toEqual(["0001_ok"]);
    } finally {
      await dropDatabase(serverUrl, name);
    }
  });

  it("refuses a migration that was edited after it was applied", async () => {
    const name = `${scratch}_e`;
    await createDatabaseIfMissing(serverUrl, name);
    const url = withDatabase(serverUrl, name);
    const dir = tempMigrations({ "0001_a": `CREATE TABLE "A" (id int);` });
    try {
      await applyMigrations(url, { dir });
      fs.writeFileSync(path.join(dir, "0001_a", "migration.sql"), `CREATE TABLE "A" (id bigint);`);
      await expect(applyMigrations(url, { dir })).rejects.toThrow(/0001_a was edited after it was applied/);
    } finally {
      await dropDatabase(serverUrl, name);
    }
  });
});
