import type { WishKind } from "@/lib/domain/wish";

/** The wish kinds as the bid pages name them. */
export const KIND_LABEL: Record<WishKind, string> = {
  trip: "Trips I want",
  "no-trip": "Trips to avoid",
  "free-days": "Days to keep free",
  rhythm: "Work pattern",
  credit: "Credit range",
  buddy: "Fly with a colleague",
};
