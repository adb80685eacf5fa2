/**
 * Solving off the caller's event loop: HiGHS's solves are synchronous, so the
 * engine runs in a worker thread of its own (with a fresh WebAssembly heap,
 * which never shrinks), and the caller keeps writing progress and can cancel.
 */
import { Worker } from "node:worker_threads";
import type { Instance } from "../domain/index.ts";
import { AppError, type AppErrorCode } from "../domain/index.ts";
import type { AwardOptions, AwardResult, Progress } from "./solve.ts";

export interface ThreadOptions extends Omit<AwardOptions, "onProgress" | "shouldStop"> {
  onProgress?: (progress: Progress) => void;
  /** aborting cancels the run: the promise rejects with an AppError "conflict" */
  signal?: AbortSignal;
}

type Message =
  | { type: "progress"; progress: Progress }
  | { type: "result"; result: AwardResult }
  | { type: "error"; code: AppErrorCode; message: string };

export function solveAwardInThread(instance: Instance, options: ThreadOptions = {}): Promise<AwardResult> {
  const { onProgress, signal, ...rest } = options;
  const cancel = new SharedArrayBuffer(4);
  const flag = new Int32Array(cancel);
  // The thread runs TypeScript through tsx, as the command-line tools and the worker process do.
  const worker = new Worker(new URL("./award-thread-entry.mjs", import.meta.url), { workerData: { instance, options: rest, cancel } });
  return new Promise<AwardResult>((resolve, reject) => {
    let settled = false;
    const abort = () => Atomics.store(flag, 0, 1);
    if (signal?.aborted) abort();
    signal?.addEventListener("abort", abort, { once: true });
    const done = (fn: () => void) => {
      if (settled) return;
      settled = true;
      signal?.removeEventListener("abort", abort);
      fn();
      void worker.terminate();
    };
    worker.on("message", (message: Message) => {
      if (message.type === "progress") onProgress?.(message.progress);
      else if (message.type === "result") {
        if (Atomics.load(flag, 0) === 1) done(() => reject(new AppError("conflict", "the award run was cancelled")));
        else done(() => resolve(message.result));
      } else done(() => reject(new AppError(message.code, message.message)));
    });
    worker.on("error", (e) => done(() => reject(e)));
    worker.on("exit", (code) => done(() => reject(new AppError("internal", `the award thread stopped (exit code ${code}) before it answered`))));
  });
}
