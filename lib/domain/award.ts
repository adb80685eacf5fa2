import { z } from "zod";
import { awardGroupSchema } from "./award-group.ts";
import { crewIdSchema, pairingIdSchema } from "./ids.ts";
import { schemaVersion } from "./schema-version.ts";
import { localDateSchema, minutesSchema } from "./time-schemas.ts";

/**
 * One crew member's awarded line: a line-holder line of pairings, or a reserve
 * line of reserve days (no pairings). `grantedWishes` lists the ranks granted in
 * full. `certificate` is strict mode's evidence that no better line fitted;
 * its shape belongs to the award engine.
 */
export const awardedLineSchema = z
  .strictObject({
    crewId: crewIdSchema,
    kind: z.enum(["line", "reserve"]),
    pairings: z.array(pairingIdSchema),
    reserveDays: z.array(localDateSchema),
    creditMinutes: minutesSchema,
    score: z.number().min(0),
    satisfaction: z.number().min(0).max(1),
    grantedWishes: z.array(z.number().int().min(0)),
    certificate: z.record(z.string(), z.unknown()).optional(),
  })
  .superRefine((line, ctx) => {
    if (line.kind === "reserve" && line.pairings.length > 0) {
      ctx.addIssue({ code: "custom", path: ["pairings"], message: `reserve line of ${line.crewId} holds pairings` });
    }
    if (line.kind === "line" && line.reserveDays.length > 0) {
      ctx.addIssue({ code: "custom", path: ["reserveDays"], message: `line of ${line.crewId} holds reserve days` });
    }
  });

/** An awarded line. */
export type AwardedLine = z.infer<typeof awardedLineSchema>;

/** A pairing left (partly) in open time: positions no line covers and the credit they leave open. */
export const openPairingSchema = z.strictObject({
  pairingId: pairingIdSchema,
  positionsOpen: z.number().int().min(1),
  openCreditMinutes: minutesSchema,
});

/** Why a crew member holds a reserve line. */
export const reserveReasonSchema = z.strictObject({
  crewId: crewIdSchema,
  reason: z.enum(["reserve-minimum", "no-legal-line", "not-enough-trips"]),
  text: z.string().trim().min(1),
});

/** The award of one award group: a line per crew member, the open time, and why anyone holds reserve. */
export const awardSchema = z
  .strictObject({
    schemaVersion: z.literal(schemaVersion),
    periodId: z.string().trim().min(1),
    group: awardGroupSchema,
    lines: z.array(awardedLineSchema),
    openPairings: z.array(openPairingSchema),
    reserveReasons: z.array(reserveReasonSchema),
  })
  .superRefine((award, ctx) => {
    const kinds = new Map<string, AwardedLine["kind"]>();
    award.lines.forEach((line, k) => {
      if (kinds.has(line.crewId)) {
        ctx.addIssue({ code: "custom", path: ["lines", k, "crewId"], message: `lines[${k}]: ${line.crewId} has two lines` });
      }
      kinds.set(line.crewId, line.kind);
    });
    award.reserveReasons.forEach((reason, k) => {
      if (kinds.get(reason.crewId) !== "reserve") {
        ctx.addIssue({
          code: "custom",
          path: ["reserveReasons", k, "crewId"],
          message: `reserveReasons[${k}]: ${reason.crewId} holds no reserve line`,
        });
      }
    });
  })
  .meta({ title: "Award", description: "The award of one award group." });

/** An award. */
export type Award = z.infer<typeof awardSchema>;
