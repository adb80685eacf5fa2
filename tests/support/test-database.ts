/**
 * A PostgreSQL database of its own for one test run: on the server of
 * DATABASE_URL when set (e.g. the machine's 127.0.0.1:5432), otherwise on an
 * embedded server started for this run in a folder of its own, so parallel runs
 * and the demo's data never mix. Migrated, empty of data.
 */
import fs from "node:fs";
import path from "node:path";
import { createDatabaseIfMissing, dropDatabase, withDatabase } from "../../lib/db/database.ts";
import { dataRoot, startLocalServer, type LocalServer } from "../../lib/db/local-server.ts";
import { applyMigrations } from "../../lib/db/migrate.ts";

export interface TestDatabase {
  url: string;
  /** a superuser-or-owner URL on the same server, for scratch databases */
  serverUrl: string;
  name: string;
  drop(): Promise<void>;
}

export async function createTestDatabase(label: string): Promise<TestDatabase> {
  const name = `bw_${label}_${process.pid}_${Date.now().toString(36)}`;
  let server: LocalServer | undefined;
  let serverUrl = process.env.DATABASE_URL;
  let dataDir: string | undefined;
  if (!serverUrl) {
    dataDir = path.join(dataRoot(), "test-runs", name);
    server = await startLocalServer({ dataDir, port: 0 });
    serverUrl = server.adminUrl;
  }
  await createDatabaseIfMissing(serverUrl, name);
  const url = withDatabase(serverUrl, name);
  await applyMigrations(url);
  return {
    url,
    serverUrl,
    name,
    async drop() {
      await dropDatabase(serverUrl, name).catch(() => {});
      if (server) {
        await server.stop();
        fs.rmSync(dataDir!, { recursive: true, force: true });
        fs.rmSync(`${dataDir}.password`, { force: true });
      }
    },
  };
}
