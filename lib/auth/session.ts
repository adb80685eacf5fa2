/**
 * The session of the request, with the role read fresh from the database.
 * Pages and actions call `requireRole` first; it redirects rather than throws,
 * so a crew member who opens a planning address lands on a plain refusal page.
 */
import { getServerSession } from "next-auth";
import { redirect } from "next/navigation";
import { authOptions } from "./options";
import { userById, type SessionUser } from "../db/users";
import type { Role } from "../db/generated/enums";

/** The signed-in user, or null. */
export async function currentUser(): Promise<SessionUser | null> {
  const session = (await getServerSession(authOptions)) as { userId?: string } | null;
  if (!session?.userId) return null;
  return userById(session.userId);
}

/** The signed-in user holding one of `roles`; otherwise redirects. */
export async function requireRole(...roles: Role[]): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  if (!roles.includes(user.role)) redirect("/not-allowed");
  return user;
}
