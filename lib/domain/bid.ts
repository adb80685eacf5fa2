import { z } from "zod";
import { crewIdSchema } from "./ids.ts";
import { wishListSchema } from "./wish.ts";

/** A bid: one crew member's ranked wishes for one bid period; what a bid receipt hashes. */
export const bidSchema = z
  .strictObject({
    crewId: crewIdSchema,
    periodId: z.string().trim().min(1),
    wishes: wishListSchema,
  })
  .superRefine((bid, ctx) => {
    bid.wishes.forEach((wish, rank) => {
      if (wish.kind === "buddy" && wish.crewId === bid.crewId) {
        ctx.addIssue({ code: "custom", path: ["wishes", rank, "crewId"], message: "a buddy wish names someone else" });
      }
    });
  })
  .meta({ title: "Bid", description: "A crew member's ranked wishes for one bid period." });

/** A bid. */
export type Bid = z.infer<typeof bidSchema>;
