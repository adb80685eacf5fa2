// prisma/schema.prisma and prisma/migrations must describe the same database:
// a schema edit without `npm run db:migration -- <name>` fails here (and in CI
// through `npm run db:migration -- --check`).
import path from "node:path";
import { describe, expect, inject, it } from "vitest";
import { diffMigrationsToSchema } from "../../lib/db/schema-diff.ts";

const root = path.resolve(import.meta.dirname, "../..");

describe("migrations", () => {
  it("produce exactly prisma/schema.prisma", { timeout: 60_000 }, async () => {
    // A server-level URL: the diff creates and drops scratch databases of its own
    // beside the run's database (which is only the door when no server URL is given).
    const serverUrl = inject("serverUrl") ?? process.env.DATABASE_URL;
    if (!serverUrl) throw new Error("no server: the integration global setup provides serverUrl and DATABASE_URL");
    const sql = await diffMigrationsToSchema({
      adminUrl: serverUrl,
      migrationsDir: path.join(root, "prisma", "migrations"),
      schemaPath: path.join(root, "prisma", "schema.prisma"),
    });
    expect(sql, "schema.prisma changed without a migration: run npm run db:migration -- <name>").toBe("");
  });
});
