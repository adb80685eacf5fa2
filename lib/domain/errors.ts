/** The kinds of failure lib reports; the edge maps each to an HTTP status and a friendly message once. */
export const appErrorCodes = [
  "invalid",
  "unauthenticated",
  "forbidden",
  "not_found",
  "conflict",
  "deadline_passed",
  "too_large",
  "unavailable",
  "internal",
] as const;

/** A kind of failure. */
export type AppErrorCode = (typeof appErrorCodes)[number];

/** A failure with a code the edge can translate; `details` carries data for the caller (for example field issues). */
export class AppError extends Error {
  override readonly name = "AppError";

  constructor(
    readonly code: AppErrorCode,
    message: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

/** Whether `error` is an AppError, optionally of one code. */
export function isAppError(error: unknown, code?: AppErrorCode): error is AppError {
  return error instanceof AppError && (code === undefined || error.code === code);
}
