/** Password hashing with bcrypt (npm `bcryptjs`, pure JavaScript: no native build). */
import bcrypt from "bcryptjs";

/** Cost 10 is bcrypt's usual default; sign-in stays well under 100 ms. */
const COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}
