/**
 * The award worker process: `npm run worker` (DATABASE_URL required). The demo
 * starts one beside the web server; production runs as many as it likes.
 */
import { databaseUrl } from "../env";
import { startAwardWorker } from "./award-worker";
import { startQueue } from "./queue";

const log = (l: string) => console.log(l);

const boss = await startQueue(databaseUrl(), log);
await startAwardWorker(boss, log);
log("waiting for award runs");

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  log(`${signal}: stopping`);
  await boss.stop({ graceful: true, timeout: 10_000 });
  process.exit(0);
}
process.on("SIGINT", () => void stop("SIGINT"));
process.on("SIGTERM", () => void stop("SIGTERM"));
