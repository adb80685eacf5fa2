/**
 * Which PostgreSQL a process uses: DATABASE_URL when set, otherwise the
 * embedded server with a database of ours on it.
 */
import pg from "pg";
import { parse as parseConnectionString } from "pg-connection-string";
import { startLocalServer, type LocalServer } from "./local-server.ts";

export const DEMO_DATABASE = "bidwright";

export interface ResolvedDatabase {
  url: string;
  /** the embedded server, when one was started; stop it on exit */
  server?: LocalServer;
}

export async function resolveDatabase(opts: { log?: (l: string) => void; dataDir?: string } = {}): Promise<ResolvedDatabase> {
  const given = process.env.DATABASE_URL;
  if (given) return { url: given };
  const server = await startLocalServer({ log: opts.log, dataDir: opts.dataDir });
  await createDatabaseIfMissing(server.adminUrl, DEMO_DATABASE);
  return { url: server.urlFor(DEMO_DATABASE), server };
}

/** Creates `name` on the server of `adminUrl` unless it exists. */
export async function createDatabaseIfMissing(adminUrl: string, name: string): Promise<void> {
  assertIdentifier(name);
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const { rowCount } = await client.query("SELECT 1 FROM pg_database WHERE datname = $1", [name]);
    if (!rowCount) await client.query(`CREATE DATABASE "${name}"`);
  } finally {
    await client.end();
  }
}

/** Drops `name` (closing its connections first). */
export async function dropDatabase(adminUrl: string, name: string): Promise<void> {
  assertIdentifier(name);
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  } finally {
    await client.end();
  }
}

/** The same server with another database name. */
export function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${encodeURIComponent(name)}`;
  return u.toString();
}

/**
 * True for a server on this machine: db:reset refuses anything else. Parsed
 * the way pg itself reads a URL (npm pg-connection-string), so a `?host=`
 * option cannot point elsewhere behind a local-looking host name.
 */
export function isLocalUrl(url: string): boolean {
  const host = parseConnectionString(url).host ?? "";
  return ["localhost", "127.0.0.1", "::1", "[::1]"].includes(host) || host.startsWith("/");
}

function assertIdentifier(name: string): void {
  if (!/^[a-z_][a-z0-9_]{0,62}$/.test(name)) throw new Error(`not a safe database name: ${JSON.stringify(name)}`);
}
