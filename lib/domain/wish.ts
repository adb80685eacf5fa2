import { z } from "zod";
import { crewIdSchema, pairingIdSchema } from "./ids.ts";
import { localDateSchema, minutesSchema } from "./time-schemas.ts";
import { tripFilterSchema } from "./trip-filter.ts";

// A crew member's ranked entries are wishes, one schema per kind. A trip or
// no-trip wish selects trips by name, by filter or both; a trip selected either
// way counts (names OR filter), since filtering named trips would add nothing.

const selection = {
  pairingIds: z.array(pairingIdSchema).min(1).optional().describe("named trips"),
  filter: tripFilterSchema.optional(),
};

function hasSelection(wish: { pairingIds?: string[] | undefined; filter?: unknown }): boolean {
  return wish.pairingIds !== undefined || wish.filter !== undefined;
}

const selectionMessage = "name some trips, give a trip filter, or both";

/** "Give me trips like this": holds when the line has at least `count` selected trips. */
export const tripWishSchema = z
  .strictObject({ kind: z.literal("trip"), ...selection, count: z.number().int().min(1).default(1) })
  .refine(hasSelection, { message: selectionMessage })
  .meta({ title: "Trip wish", description: "Give me trips like this." });

/** "Keep me off trips like this": holds when the line has none of the selected trips. */
export const noTripWishSchema = z
  .strictObject({ kind: z.literal("no-trip"), ...selection })
  .refine(hasSelection, { message: selectionMessage })
  .meta({ title: "No-trip wish", description: "Keep me off trips like this." });

/** "Keep these dates free" (base-local dates). */
export const freeDaysWishSchema = z
  .strictObject({ kind: z.literal("free-days"), dates: z.array(localDateSchema).min(1).max(62) })
  .refine((wish) => new Set(wish.dates).size === wish.dates.length, {
    message: "a date is named twice",
    path: ["dates"],
  })
  .meta({ title: "Free-days wish", description: "Keep these base-local dates free." });

/** A work pattern: at most `maxDaysOn` working days in a row, and/or every weekend of the period free. */
export const rhythmWishSchema = z
  .strictObject({
    kind: z.literal("rhythm"),
    maxDaysOn: z.number().int().min(1).max(31).optional(),
    weekendsOff: z.boolean().optional(),
  })
  .refine((wish) => wish.maxDaysOn !== undefined || wish.weekendsOff === true, {
    message: "a work pattern needs a limit on days on in a row, weekends off, or both",
  })
  .meta({ title: "Rhythm wish", description: "At most so many days on in a row, and/or weekends free." });

/** A credit range wanted for the line, in minutes; either end may be open. */
export const creditWishSchema = z
  .strictObject({ kind: z.literal("credit"), minMinutes: minutesSchema.optional(), maxMinutes: minutesSchema.optional() })
  .refine((wish) => wish.minMinutes !== undefined || wish.maxMinutes !== undefined, {
    message: "a credit range needs a minimum, a maximum or both",
  })
  .refine((wish) => wish.minMinutes === undefined || wish.maxMinutes === undefined || wish.minMinutes <= wish.maxMinutes, {
    message: "the credit minimum is above the maximum",
    path: ["maxMinutes"],
  })
  .meta({ title: "Credit wish", description: "A credit range for the line, in minutes." });

/** Fly with a named colleague (counts only when mutual and within one award group). */
export const buddyWishSchema = z
  .strictObject({ kind: z.literal("buddy"), crewId: crewIdSchema })
  .meta({ title: "Buddy wish", description: "Fly the same trips as a named colleague." });

/** One wish of a bid, told apart by `kind`. */
export const wishSchema = z
  .discriminatedUnion("kind", [
    tripWishSchema,
    noTripWishSchema,
    freeDaysWishSchema,
    rhythmWishSchema,
    creditWishSchema,
    buddyWishSchema,
  ])
  .meta({ id: "Wish", title: "Wish" });

/** One wish. */
export type Wish = z.infer<typeof wishSchema>;
/** The kinds of wish. */
export type WishKind = Wish["kind"];
/** A wish of one kind. */
export type WishOf<K extends WishKind> = Extract<Wish, { kind: K }>;

/** The most wishes a bid may hold. */
export const maxWishes = 50;

/**
 * A bid's wishes in rank order (rank 0 first). At most one buddy wish: a
 * mutual pair is awarded as a unit, and chains of buddies would tie whole
 * groups together.
 */
export const wishListSchema = z
  .array(wishSchema)
  .max(maxWishes, `a bid holds at most ${maxWishes} wishes`)
  .refine((wishes) => wishes.filter((wish) => wish.kind === "buddy").length <= 1, {
    message: "a bid may name one buddy at most",
  });
