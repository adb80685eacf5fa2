/**
 * `npm run db:migration -- <name>`: writes the next migration, the SQL that
 * takes a database built from prisma/migrations to what prisma/schema.prisma
 * describes, as prisma/migrations/<NNNN>_<name>/migration.sql.
 * `npm run db:migration -- --check`: exits 1 when the two have drifted (CI).
 *
 * Options: --schema <path> and --migrations <dir> point elsewhere (tests, trials).
 * Server: DATABASE_URL when set (needs CREATEDB: scratch databases are created
 * and dropped on it), otherwise a private embedded PostgreSQL.
 *
 * Exit codes: 0 written or nothing to do, 1 drift or failure, 2 bad usage.
 */
import fs from "node:fs";
import path from "node:path";
import { parseArgs } from "node:util";
import pg from "pg";
import { diffMigrationsToSchema, MIGRATION_LOCK, SCRATCH_PREFIX } from "../db/schema-diff.ts";
import { REPO_ROOT, dataRoot, startLocalServer } from "../db/local-server.ts";

const USAGE = `usage: npm run db:migration -- <name>      write the next migration (name: lowercase letters, digits, _)
       npm run db:migration -- --check     fail when schema.prisma and the migrations differ
options: --schema <path>  --migrations <dir>`;

class UsageError extends Error {}

/** Lowercase letters, digits and underscores: the folder name stays portable and greppable. */
function validateMigrationName(name: string): string | undefined {
  if (!/^[a-z0-9_]+$/.test(name)) {
    return `migration name "${name}" may contain only lowercase letters, digits and underscores (e.g. add_crew_email)`;
  }
  if (name.length > 200) return "migration name is too long (at most 200 characters)";
  return undefined;
}

/** The next 4-digit number after the highest `NNNN_` folder (0001 for the first). */
function nextMigrationNumber(migrationsDir: string): string {
  const taken = fs.existsSync(migrationsDir)
    ? fs.readdirSync(migrationsDir).map((n) => /^(\d{4})_/.exec(n)?.[1]).filter((n): n is string => !!n)
    : [];
  const next = Math.max(0, ...taken.map(Number)) + 1;
  if (next > 9999) throw new Error("migration numbers are exhausted (9999)");
  return String(next).padStart(4, "0");
}

function parse(argv: string[]) {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      check: { type: "boolean", default: false },
      schema: { type: "string" },
      migrations: { type: "string" },
      help: { type: "boolean", short: "h", default: false },
    },
  });
  if (values.help) return { help: true as const };
  if (positionals.length > 1) throw new UsageError(`expected one migration name, got: ${positionals.join(" ")}`);
  const name = positionals[0];
  if (values.check && name) throw new UsageError("--check takes no migration name");
  if (!values.check && !name) throw new UsageError("a migration name is required, e.g. npm run db:migration -- add_crew_email");
  const problem = name ? validateMigrationName(name) : undefined;
  if (problem) throw new UsageError(problem);
  // npm runs scripts from the package root; resolve user paths against where they typed them.
  const cwd = process.env.INIT_CWD ?? process.cwd();
  return {
    help: false as const,
    check: values.check,
    name,
    schemaPath: values.schema ? path.resolve(cwd, values.schema) : path.join(REPO_ROOT, "prisma", "schema.prisma"),
    migrationsDir: values.migrations ? path.resolve(cwd, values.migrations) : path.join(REPO_ROOT, "prisma", "migrations"),
  };
}

/** A server we may create databases on, and how to let go of it. */
async function openServer(): Promise<{ adminUrl: string; close(): Promise<void> }> {
  const url = process.env.DATABASE_URL;
  if (url) return { adminUrl: url, close: async () => {} };
  // A data folder of its own: starting on the demo's folder would stop a demo that is running.
  const server = await startLocalServer({
    dataDir: path.join(dataRoot(), "pg-migration"),
    log: (line) => console.error(line),
  });
  console.error(`using an embedded PostgreSQL on port ${server.port} (set DATABASE_URL to use your own)`);
  await dropLeftovers(server.adminUrl).catch(async (e) => {
    await server.stop();
    throw e;
  });
  return { adminUrl: server.adminUrl, close: () => server.stop() };
}

/** A run killed mid-diff (Ctrl-C) leaves its scratch databases; this server is ours alone, so sweep them. */
async function dropLeftovers(adminUrl: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const { rows } = await client.query<{ datname: string }>("SELECT datname FROM pg_database WHERE starts_with(datname, $1)", [SCRATCH_PREFIX]);
    for (const { datname } of rows) await client.query(`DROP DATABASE IF EXISTS "${datname}" WITH (FORCE)`);
  } finally {
    await client.end();
  }
}

/** Paths as the user typed them: relative inside the working folder, absolute outside it. */
const rel = (p: string) => {
  const r = path.relative(process.cwd(), p);
  return r.startsWith("..") ? p : r || ".";
};

async function main(argv: string[]): Promise<number> {
  const args = parse(argv);
  if (args.help) {
    console.log(USAGE);
    return 0;
  }
  if (!fs.existsSync(args.schemaPath)) throw new Error(`no schema at ${rel(args.schemaPath)}`);

  const server = await openServer();
  let sql: string;
  const started = performance.now();
  try {
    sql = await diffMigrationsToSchema({ adminUrl: server.adminUrl, migrationsDir: args.migrationsDir, schemaPath: args.schemaPath });
  } finally {
    await server.close();
  }
  const took = `${((performance.now() - started) / 1000).toFixed(1)} s`;

  if (args.check) {
    if (!sql) {
      console.log(`${rel(args.schemaPath)} and ${rel(args.migrationsDir)} are in sync (${took})`);
      return 0;
    }
    console.error(`${rel(args.schemaPath)} and ${rel(args.migrationsDir)} have drifted; the migrations lack:\n\n${sql}`);
    console.error("write a migration for it: npm run db:migration -- <name>");
    return 1;
  }

  if (!sql) {
    console.log(`no changes: ${rel(args.migrationsDir)} already produce ${rel(args.schemaPath)}; nothing written (${took})`);
    return 0;
  }
  const file = writeMigration(args.migrationsDir, `${nextMigrationNumber(args.migrationsDir)}_${args.name}`, sql);
  console.log(`${sql}\nwrote ${rel(file)} (${took})`);
  return 0;
}

/** Writes the migration (and the lock file Prisma keeps beside them) without ever leaving half a file. */
function writeMigration(migrationsDir: string, folder: string, sql: string): string {
  fs.mkdirSync(migrationsDir, { recursive: true });
  const lock = path.join(migrationsDir, "migration_lock.toml");
  if (!fs.existsSync(lock)) fs.writeFileSync(lock, MIGRATION_LOCK);
  const dir = path.join(migrationsDir, folder);
  fs.mkdirSync(dir); // throws if it exists: never overwrite a migration
  const file = path.join(dir, "migration.sql");
  fs.writeFileSync(`${file}.tmp`, sql);
  fs.renameSync(`${file}.tmp`, file);
  return file;
}

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (e: unknown) => {
    const usage = e instanceof UsageError || (e as { code?: string }).code?.startsWith("ERR_PARSE_ARGS");
    const msg = e instanceof Error ? e.message : String(e);
    const hint = /permission denied to create database/.test(msg) ? "\n(the DATABASE_URL user needs CREATEDB: the diff runs in scratch databases)" : "";
    console.error(usage ? `${msg}\n${USAGE}` : `db:migration failed: ${msg}${hint}`);
    process.exit(usage ? 2 : 1);
  },
);
