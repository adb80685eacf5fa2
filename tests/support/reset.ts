import pg from "pg";

/** Empties every table of the app (not the migration record) so a test file starts clean. */
export async function truncateAll(url: string): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows } = await client.query<{ t: string }>(
      `SELECT quote_ident(tablename) AS t FROM pg_tables WHERE schemaname = 'public' AND tablename <> '_prisma_migrations'`,
    );
    if (rows.length) await client.query(`TRUNCATE ${rows.map((r) => r.t).join(", ")} CASCADE`);
  } finally {
    await client.end();
  }
}
