/** zod schemas for CSV cells (always text), with the messages a scheduler reads beside the line and column. */
import { z } from "zod";

/** A whole number of minutes, such as 540. */
export const minutesCell = z
  .string()
  .regex(/^\d+$/, { message: "expected a whole number of minutes such as 540" })
  .transform(Number);

/** A whole number ≥ `min`. */
export const wholeCell = (min: number, what: string) =>
  z
    .string()
    .regex(/^\d+$/, { message: `expected ${what}, a whole number` })
    .transform(Number)
    .refine((n) => n >= min, { message: `expected ${what} of ${min} or more` });

/** A list joined by ";" (empty → none). */
export const listCell = z.string().transform((text) =>
  text
    .split(";")
    .map((s) => s.trim())
    .filter((s) => s.length > 0),
);

/** yes / no (empty → no). */
export const yesNoCell = z
  .string()
  .transform((s) => s.toLowerCase())
  .refine((s) => s === "yes" || s === "no" || s === "", { message: 'expected "yes" or "no"' })
  .transform((s) => s === "yes");
