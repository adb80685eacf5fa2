/** How the import route handlers answer: JSON with a message, and for a refused import every problem found. */
import { NextResponse } from "next/server";
import { currentUser } from "@/lib/auth/session";
import { isAppError, type AppErrorCode } from "@/lib/domain/index";
import { errorMessage } from "@/app/ui/error-message";

const STATUS: Partial<Record<AppErrorCode, number>> = { invalid: 422, conflict: 409, not_found: 404, too_large: 413, forbidden: 403 };

/** The signed-in scheduler or admin, or the response refusing anyone else. */
export async function plannerOrRefusal(): Promise<{ userId: string } | { refusal: NextResponse }> {
  const user = await currentUser();
  if (!user) return { refusal: NextResponse.json({ error: "Sign in first." }, { status: 401 }) };
  if (user.role !== "scheduler" && user.role !== "admin") return { refusal: NextResponse.json({ error: "Imports are for schedulers." }, { status: 403 }) };
  return { userId: user.id };
}

/** A failed import as JSON: the message, and the problems (file, line, column, message) when lib listed them. */
export function importFailure(error: unknown): NextResponse {
  const status = isAppError(error) ? (STATUS[error.code] ?? 500) : 500;
  const details = isAppError(error) ? error.details : undefined;
  return NextResponse.json(
    { error: errorMessage(error), problems: details?.problems ?? (details?.issues as string[] | undefined)?.map((message) => ({ message })) ?? [], total: details?.total },
    { status },
  );
}

/** Refuses a request body larger than `limit` bytes before reading it (when the client says its length). */
export function bodyTooLarge(request: Request, limit: number, what: string): NextResponse | undefined {
  const length = Number(request.headers.get("content-length") ?? "0");
  if (length > limit) {
    return NextResponse.json({ error: `The upload is ${(length / 1048576).toFixed(1)} MB; ${what} may be at most ${(limit / 1048576).toFixed(1)} MB in all.`, problems: [] }, { status: 413 });
  }
  return undefined;
}
