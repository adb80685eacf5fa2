import { z } from "zod";

/** A pairing's id: the trip number crew see, such as "T412"; unique within a bid period. */
export const pairingIdSchema = z
  .string()
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,19}$/, {
    message: "a trip number is 1–20 letters, digits, '.', '_' or '-', such as T412",
  });

/** A crew member's id: their employee number, kept as a string (leading zeros matter). */
export const crewIdSchema = z
  .string()
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,19}$/, {
    message: "an employee number is 1–20 letters, digits, '.', '_' or '-', such as 004711",
  });
