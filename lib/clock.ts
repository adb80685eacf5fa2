/**
 * The server's clock. Deadlines are decided here and only here, so the browser
 * tests can start the clock at a fixed instant (BIDWRIGHT_CLOCK_START) and
 * every check still sees time pass normally.
 */
import { env } from "./env";

const processStart = Date.now();

/** Now, as the server decides deadlines. */
export function now(): Date {
  const start = env().BIDWRIGHT_CLOCK_START;
  if (!start) return new Date();
  return new Date(Date.parse(start) + (Date.now() - processStart));
}
