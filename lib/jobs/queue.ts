/**
 * The award job queue: pg-boss 10 on the same PostgreSQL, in its own schema.
 * One job per award run; any number of worker processes consume it.
 */
import PgBoss from "pg-boss";

export const AWARD_QUEUE = "award-run";
export const BOSS_SCHEMA = "pgboss";

export interface AwardJob {
  runId: string;
}

/**
 * A started pg-boss with the award queue in place. Its maintenance (which
 * expires the jobs of dead workers, so that they are retried) runs every
 * `maintenanceIntervalSeconds` (default 30).
 */
export async function startQueue(
  databaseUrl: string,
  log: (l: string) => void = () => {},
  options: { maintenanceIntervalSeconds?: number; /** false: send only (the web server), the workers maintain the queue */ supervise?: boolean } = {},
): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    schema: BOSS_SCHEMA,
    maintenanceIntervalSeconds: options.maintenanceIntervalSeconds ?? 30,
    supervise: options.supervise ?? true,
    schedule: false,
  });
  boss.on("error", (e: Error) => log(`queue error: ${e.message}`));
  await boss.start();
  // pg-boss 10 returns null from send() for a missing queue instead of throwing.
  if (!(await boss.getQueue(AWARD_QUEUE))) await boss.createQueue(AWARD_QUEUE);
  return boss;
}

const holder = globalThis as { bidwrightSender?: Promise<PgBoss> };

/** The web server's pg-boss, started once per process, for sending jobs only. */
export function queueSender(databaseUrl: string): Promise<PgBoss> {
  holder.bidwrightSender ??= startQueue(databaseUrl, (l) => console.error(l), { supervise: false }).catch((e: unknown) => {
    holder.bidwrightSender = undefined;
    throw e;
  });
  return holder.bidwrightSender;
}
