import { z } from "zod";
import { crewIdSchema, pairingIdSchema } from "./ids.ts";
import { schemaVersion } from "./schema-version.ts";
import { localDateSchema } from "./time-schemas.ts";

/**
 * Why a wish was not granted (in full), one family of constraints each. Never
 * names another crew member's bid: seniority names only seniority numbers.
 */
export const reasonSchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("held-by-seniority"), seniorityNumbers: z.array(z.number().int().min(1)).min(1) }),
  z.strictObject({ kind: z.literal("needed-for-coverage") }),
  z.strictObject({ kind: z.literal("traded-for-own-wish"), rank: z.number().int().min(0) }),
  z.strictObject({ kind: z.literal("not-legal"), ruleId: z.string().min(1), text: z.string().trim().min(1) }),
]);

/** A reason. */
export type Reason = z.infer<typeof reasonSchema>;

/** How one wish fared: its outcome, the reasons it gave way, the part of the line that grants it, and a plain sentence. */
export const wishExplanationSchema = z
  .strictObject({
    rank: z.number().int().min(0),
    outcome: z.enum(["granted", "partly", "not-granted"]),
    reasons: z.array(reasonSchema).default([]),
    grantedBy: z
      .strictObject({ pairingIds: z.array(pairingIdSchema).default([]), dates: z.array(localDateSchema).default([]) })
      .optional(),
    text: z.string().trim().min(1),
  })
  .refine((wish) => wish.outcome !== "granted" || wish.reasons.length === 0, {
    message: "a granted wish gives no reasons",
    path: ["reasons"],
  });

/** A wish's explanation. */
export type WishExplanation = z.infer<typeof wishExplanationSchema>;

/** One crew member's explanations, in rank order: element r explains wish r. */
export const crewExplanationSchema = z.array(wishExplanationSchema).superRefine((wishes, ctx) => {
  wishes.forEach((wish, k) => {
    if (wish.rank !== k) ctx.addIssue({ code: "custom", path: [k, "rank"], message: `explanation ${k} is for wish ${wish.rank}` });
  });
});

/** The explanations of an award, keyed by crew id, then by wish rank. */
export const explanationsSchema = z
  .strictObject({
    schemaVersion: z.literal(schemaVersion),
    crew: z.record(crewIdSchema, crewExplanationSchema),
  })
  .meta({ title: "Explanations", description: "Per crew member and wish: granted or not, and why." });

/** The explanations of an award. */
export type Explanations = z.infer<typeof explanationsSchema>;
