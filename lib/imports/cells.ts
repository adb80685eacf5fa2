/** zod schemas for CSV cells (always text), with the messages a scheduler reads beside the line and column. */
import { z } from "zod";
import { instantSchema } from "../domain/index";

/** A UTC instant such as 2027-02-03T06:15:00Z; a bad one is quoted back with how to write it. */
export const instantCell = z.string().transform((text, ctx) => {
  const parsed = instantSchema.safeParse(text);
  if (parsed.success) return parsed.data;
  ctx.addIssue({ code: "custom", message: `"${text}" is not a UTC instant: write it like 2027-03-14T08:00:00Z (a real date, 24-hour time, ending in Z)` });
  return z.NEVER;
});

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
