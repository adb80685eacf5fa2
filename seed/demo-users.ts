/**
 * Sign-ins for the demo and the browser tests: crew accounts at different
 * seniority (most senior, middle, most junior of the pilots), a scheduler and
 * an administrator. Everyone shares the demo password.
 */
import type { Db } from "../lib/db/client.ts";
import type { Bundle } from "../lib/domain/index.ts";
import { hashPassword } from "../lib/auth/password.ts";
import { CARRIER } from "./carrier.ts";

/** The demo's one shared password; the sign-in page and README print it. */
export const DEMO_PASSWORD = "larkfield-demo";

export interface UserSeed {
  email: string;
  name: string;
  role: "crew" | "scheduler" | "admin";
  password: string;
  /** employee number of the crew member the account belongs to */
  crewId?: string;
}

const mailName = (name: string) =>
  name
    .normalize("NFD")
    .replace(/[^A-Za-z ]/g, "")
    .trim()
    .toLowerCase()
    .replace(/\s+/g, ".");

/** Three crew accounts (senior, middle, junior across the bundle's crew) plus planning and admin. */
export function demoUsers(bundle: Bundle): UserSeed[] {
  const crew = bundle.instances.flatMap((i) => i.crew).sort((a, b) => a.seniority - b.seniority);
  const picks = [crew[0], crew[Math.floor(crew.length / 2)], crew[crew.length - 1]].filter((c, k, all) => c && all.indexOf(c) === k);
  return [
    ...picks.map((c) => ({ email: `${mailName(c!.name)}@${CARRIER.mailDomain}`, name: c!.name, role: "crew" as const, password: DEMO_PASSWORD, crewId: c!.id })),
    { email: `planning@${CARRIER.mailDomain}`, name: "Oriel Banks", role: "scheduler", password: DEMO_PASSWORD },
    { email: `admin@${CARRIER.mailDomain}`, name: "Wren Adeyemi", role: "admin", password: DEMO_PASSWORD },
  ];
}

/** Creates the accounts, linking crew accounts by employee number; e-mail addresses are stored lower-case. */
export async function writeUsers(prisma: Db, users: readonly UserSeed[]): Promise<void> {
  const hashes = await Promise.all(users.map((u) => hashPassword(u.password)));
  await prisma.$transaction(async (tx) => {
    for (const [k, u] of users.entries()) {
      const crew = u.crewId ? await tx.crewMember.findUniqueOrThrow({ where: { employeeNumber: u.crewId } }) : undefined;
      await tx.user.create({ data: { email: u.email.toLowerCase(), name: u.name, role: u.role, passwordHash: hashes[k]!, crewMemberId: crew?.id } });
    }
  });
}
