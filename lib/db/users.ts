/** Accounts: sign-in look-up and the role re-read for every privileged action. */
import { db } from "./client";
import { verifyPassword } from "../auth/password";
import type { Role } from "./generated/enums";

const DECOY_HASH = "$2b$10$04cmRC0w2d8SbwbV56pzou9qgz2bmimZyIAeM5EBDHQpoS0FFGh2G";

/** What the app knows about the person behind a session, read fresh from the database. */
export interface SessionUser {
  id: string;
  name: string;
  email: string;
  role: Role;
  crewMemberId: string | null;
}

/** The user for an e-mail and password, or null; never says which of the two was wrong. */
export async function checkCredentials(email: string, password: string): Promise<SessionUser | null> {
  const user = await db().user.findUnique({ where: { email: email.trim().toLowerCase() }, omit: { passwordHash: false } });
  // Compare against a hash of a random string when the account is unknown, so timing does not tell.
  const ok = await verifyPassword(password, user?.passwordHash ?? DECOY_HASH);
  if (!user || !ok) return null;
  return { id: user.id, name: user.name, email: user.email, role: user.role, crewMemberId: user.crewMemberId };
}

/** The current role and crew link of a user id taken from a session token. */
export async function userById(id: string): Promise<SessionUser | null> {
  const user = await db().user.findUnique({
    where: { id },
    select: { id: true, name: true, email: true, role: true, crewMemberId: true },
  });
  return user;
}
