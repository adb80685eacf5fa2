/**
 * Writes the small scenario into an empty database: the bid period through the
 * bundle import (one transaction), then the scenario's sign-ins.
 */
import type { Db } from "../lib/db/client.ts";
import { importBundle } from "../lib/db/period-import.ts";
import { writeUsers } from "./demo-users.ts";
import { smallScenarioBundle, type Scenario } from "./small-scenario.ts";

export async function writeScenario(prisma: Db, s: Scenario): Promise<{ periodId: string }> {
  const { periodId } = await importBundle(prisma, smallScenarioBundle(s), {
    state: s.period.state === "open" || s.period.state === "draft" || s.period.state === "closed" ? s.period.state : "draft",
    opensAt: s.period.opensAt,
    deadline: s.period.deadline,
  });
  await writeUsers(prisma, s.users);
  return { periodId };
}
