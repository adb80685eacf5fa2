import { isAppError } from "@/lib/domain/index";

/**
 * The one place lib's typed errors become words for a person. AppError
 * messages are written for crew; anything else is logged and not shown raw.
 */
export function errorMessage(error: unknown): string {
  if (isAppError(error)) {
    const text = error.message;
    return text.charAt(0).toUpperCase() + text.slice(1) + (/[.!?]$/.test(text) ? "" : ".");
  }
  console.error(error);
  return "Something went wrong on our side; nothing was changed. Please try again.";
}
