/**
 * The demo's data, written once into an empty database: a generated month at
 * Halvern for captains and first officers (64 crew and about 240 trips),
 * bidding open until the 20th, with the generated bids of the other crew
 * already in and the demo crew accounts' own bids left for the visitor; the
 * month before holds a bid each demo crew account submitted there.
 */
import path from "node:path";
import type { Db } from "../lib/db/client.ts";
import { importBundle } from "../lib/db/period-import.ts";
import { daysBetween } from "../lib/domain/time.ts";
import { STATIONS } from "./carrier.ts";
import { DEMO_PASSWORD, demoUsers, writeUsers, type UserSeed } from "./demo-users.ts";
import { generatePeriod } from "./generator/generate-period.ts";
import { writeCsv } from "./generator/write-csv.ts";
import { writePastPeriod } from "./past-period.ts";
import { nextPeriod } from "./small-scenario.ts";

export const DEMO_BASE = "HLV";

/** The demo bundle for the bid period that `now` is bidding for. */
export function demoBundle(now: Date) {
  const zone = STATIONS.find((s) => s.code === DEMO_BASE)!.zone;
  const window = nextPeriod(now, zone);
  const bundle = generatePeriod({
    seed: 7,
    crew: 32,
    tightness: 0.95,
    base: DEMO_BASE,
    startDate: window.startDate,
    days: daysBetween(window.startDate, window.endDate) + 1,
  });
  // Two minutes per award group: a run a scheduler can watch (the engine's default is ten).
  const instances = bundle.instances.map((i) => ({ ...i, settings: { ...i.settings, timeLimitSeconds: 120 } }));
  return { bundle: { ...bundle, instances }, window };
}

/**
 * The CSV files of the month after the demo's period, for trying the import
 * (a new period, then its files): the same crew (the generator's crew depend
 * on the seed only), that month's trips and leave. Returns the folder.
 */
export function writeDemoFiles(now: Date, root: string): string {
  const zone = STATIONS.find((s) => s.code === DEMO_BASE)!.zone;
  const current = nextPeriod(now, zone);
  const [y, m] = current.startDate.split("-").map(Number) as [number, number];
  const startDate = new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 10);
  const next = new Date(Date.UTC(y, m + 1, 1)).toISOString().slice(0, 10);
  const bundle = generatePeriod({ seed: 7, crew: 32, tightness: 0.95, base: DEMO_BASE, startDate, days: daysBetween(startDate, next) });
  const dir = path.join(root, startDate.slice(0, 7));
  writeCsv(bundle, dir);
  return dir;
}

/**
 * Seeds the demo when the database holds no accounts. Returns the sign-ins
 * either way: the new ones, or those already in the database (first ten).
 */
export async function seedDemoIfEmpty(prisma: Db, now = new Date()): Promise<{ seeded: boolean; users: UserSeed[] }> {
  if ((await prisma.user.count()) > 0) {
    const rows = await prisma.user.findMany({ orderBy: [{ role: "asc" }, { email: "asc" }], take: 10 });
    return { seeded: false, users: rows.map((u) => ({ email: u.email, name: u.name, role: u.role, password: DEMO_PASSWORD })) };
  }
  const { bundle, window } = demoBundle(now);
  const users = demoUsers(bundle);
  // The visitor builds the demo accounts' bids themselves.
  const mine = new Set(users.flatMap((u) => (u.crewId ? [u.crewId] : [])));
  for (const instance of bundle.instances) for (const id of mine) delete instance.bids[id];
  const { periodId } = await importBundle(prisma, bundle, { state: "open", opensAt: window.opensAt, deadline: window.deadline });
  await writeUsers(prisma, users);
  // Last month's bids of the demo accounts, so "start from my last bid" can be tried.
  await writePastPeriod(prisma, periodId, [...mine]);
  return { seeded: true, users };
}
