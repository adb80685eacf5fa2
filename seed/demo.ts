/** The demo's data: written once, into an empty database. */
import type { Db as PrismaClient } from "../lib/db/client.ts";
import { smallScenario, type UserSeed } from "./small-scenario.ts";
import { writeScenario } from "./write-scenario.ts";

/** Seeds the demo when the database holds no accounts; returns the demo sign-ins either way. */
export async function seedDemoIfEmpty(prisma: PrismaClient): Promise<{ seeded: boolean; users: UserSeed[] }> {
  const scenario = smallScenario({ seed: 7 });
  const existing = await prisma.user.count();
  if (existing > 0) return { seeded: false, users: scenario.users };
  await writeScenario(prisma, scenario);
  return { seeded: true, users: scenario.users };
}
