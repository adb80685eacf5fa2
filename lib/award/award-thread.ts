/**
 * The body of the award worker thread: receives an instance, solves it with
 * the thread's own HiGHS runtime, and posts progress and then the result (or
 * the error). Cancellation arrives through a shared flag that the engine
 * polls between pricing calls and inside HiGHS's interrupt callbacks.
 */
import { parentPort, workerData } from "node:worker_threads";
import type { Instance } from "../domain/index.ts";
import { isAppError } from "../domain/index.ts";
import { solveAward, type AwardOptions } from "./solve.ts";

interface ThreadInput {
  instance: Instance;
  options: Omit<AwardOptions, "onProgress" | "shouldStop">;
  cancel: SharedArrayBuffer;
}

const port = parentPort;
if (!port) throw new Error("award-thread.ts runs as a worker thread");
const { instance, options, cancel } = workerData as ThreadInput;
const flag = new Int32Array(cancel);
try {
  const result = await solveAward(instance, {
    ...options,
    onProgress: (progress) => port.postMessage({ type: "progress", progress }),
    shouldStop: () => Atomics.load(flag, 0) === 1,
  });
  port.postMessage({ type: "result", result });
} catch (e) {
  port.postMessage({ type: "error", code: isAppError(e) ? e.code : "internal", message: (e as Error).message });
}
