/**
 * The small hand-made scenario the tests reuse and the demo shows until the
 * realistic generator lands: one base (Halvern), a dozen crew in two
 * positions, a few dozen pairings in a one-month bid period.
 */
import type { Bundle, CrewMember, Position } from "../lib/domain/index.ts";
import { bundleSchema } from "../lib/domain/index.ts";
import { DEMO_PASSWORD, type UserSeed } from "./demo-users.ts";
import { ruleSetFor } from "./generator/rule-set-presets.ts";
import { addDays, atLocalTime, localDate, monthLabel, startOfLocalDay } from "../lib/domain/time.ts";
import { CARRIER, STATIONS, type StationSeed } from "./carrier.ts";
import { makePairing, type PairingSeed } from "./pairing-factory.ts";
import { rng } from "./random.ts";

export type PositionName = Position;

export interface CrewSeed {
  id: string;
  name: string;
  seniority: number;
  base: string;
  position: PositionName;
  qualifications: string[];
  vacation?: { start: string; end: string };
}


export interface PeriodSeed {
  name: string;
  base: string;
  startDate: string;
  endDate: string;
  zone: string;
  opensAt: string;
  deadline: string;
  state: "draft" | "open" | "closed" | "awarded" | "published";
}

export interface Scenario {
  stations: readonly StationSeed[];
  base: string;
  crew: CrewSeed[];
  users: UserSeed[];
  period: PeriodSeed;
  pairings: PairingSeed[];
}

export { DEMO_PASSWORD, type UserSeed } from "./demo-users.ts";

const CREW_NAMES = [
  "Ines Marlowe", "Tomas Brecht", "Aiyana Clearwater", "Ruben Okafor", "Greta Lindqvist", "Dev Raman",
  "Noor Haddad", "Pavel Sykora", "Mireille Dufresne", "Kofi Mensah", "Hana Ueda", "Sam Whitlock",
];

/** The base-local month after `now`'s month, with a deadline on the 20th of `now`'s month at 18:00. */
export function nextPeriod(now: Date, zone: string): { startDate: string; endDate: string; opensAt: string; deadline: string } {
  const [y, m, d] = localDate(now.toISOString(), zone).split("-").map(Number) as [number, number, number];
  // After the 20th, bidding for next month has closed: offer the month after.
  const bidMonth = d >= 20 ? m + 1 : m; // 1-based, may pass 12
  const month = (offset: number) => {
    const t = new Date(Date.UTC(y, bidMonth - 1 + offset, 1));
    return `${t.getUTCFullYear()}-${String(t.getUTCMonth() + 1).padStart(2, "0")}`;
  };
  const startDate = `${month(1)}-01`;
  return {
    startDate,
    endDate: addDays(`${month(2)}-01`, -1),
    opensAt: startOfLocalDay(`${month(0)}-01`, zone),
    deadline: atLocalTime(`${month(0)}-20`, "18:00", zone),
  };
}


export interface SmallScenarioOptions {
  seed?: number;
  /** the clock that places the bid period; tests pass a fixed one */
  now?: Date;
  pairings?: number;
  state?: PeriodSeed["state"];
}

export function smallScenario(opts: SmallScenarioOptions = {}): Scenario {
  const r = rng(opts.seed ?? 1);
  const base = "HLV";
  const zone = STATIONS.find((s) => s.code === base)!.zone;
  const dates = nextPeriod(opts.now ?? new Date(), zone);
  const crew: CrewSeed[] = CREW_NAMES.map((name, i) => ({
    id: String(4100 + i * 7),
    name,
    seniority: i + 1,
    base,
    position: i % 2 === 0 ? "captain" : "first_officer",
    qualifications: ["A220", ...(i % 3 === 0 ? ["lang:es"] : [])],
  }));
  const vacationer = crew[4]!;
  const vStart = addDays(dates.startDate, 9);
  vacationer.vacation = { start: vStart, end: addDays(vStart, 6) };

  const pairings: PairingSeed[] = [];
  const count = opts.pairings ?? 36;
  let flight = 400;
  const monthDays = Number(dates.endDate.slice(8, 10));
  for (let k = 0; k < count; k++) {
    const days = r.pick([1, 2, 2, 3, 3, 4]);
    const startDay = 1 + Math.floor((k * (monthDays - days)) / count);
    const redEye = r.next() < 0.08;
    const firstDeparture = redEye ? "22:40" : r.pick(["06:10", "07:25", "08:40", "10:15", "12:30", "14:05", "16:50"]);
    pairings.push(
      makePairing(
        {
          id: `T${100 + k}`,
          base,
          startDate: addDays(dates.startDate, startDay - 1),
          days,
          firstDeparture,
          crewNeeded: { captain: 1, first_officer: 1 },
          requires: ["A220"],
        },
        r,
        () => (flight += r.int(1, 9)),
      ),
    );
  }
  const mail = (n: string) => `${n.toLowerCase().split(" ")[0]}@${CARRIER.mailDomain}`;
  const crewUser = (c: CrewSeed): UserSeed => ({ email: mail(c.name), name: c.name, role: "crew", password: DEMO_PASSWORD, crewId: c.id });
  return {
    stations: STATIONS,
    base,
    crew,
    users: [
      crewUser(crew[0]!),
      crewUser(crew[5]!),
      crewUser(crew[11]!),
      { email: `planning@${CARRIER.mailDomain}`, name: "Oriel Banks", role: "scheduler", password: DEMO_PASSWORD },
      { email: `admin@${CARRIER.mailDomain}`, name: "Wren Adeyemi", role: "admin", password: DEMO_PASSWORD },
    ],
    period: { name: monthLabel(dates.startDate), base, zone, ...dates, state: opts.state ?? "open" },
    pairings,
  };
}

/** The scenario as a bundle (one instance per position), the shape the database import takes. */
export function smallScenarioBundle(s: Scenario): Bundle {
  const { zone } = s.period;
  const crew: CrewMember[] = s.crew.map((c) => ({
    id: c.id,
    name: c.name,
    seniority: c.seniority,
    base: c.base,
    position: c.position,
    qualifications: c.qualifications,
    // A vacation covers whole base-local days, first to last.
    fixedActivities: c.vacation
      ? [{ kind: "vacation", start: startOfLocalDay(c.vacation.start, zone), end: startOfLocalDay(addDays(c.vacation.end, 1), zone), label: "Annual leave" }]
      : [],
    carryIn: [],
    lookBack: { duties: [], dailyFlightMinutes: [] },
    carriedWeight: 1,
  }));
  const period = { id: `${s.base}-${s.period.startDate.slice(0, 7)}`, name: s.period.name, startDate: s.period.startDate, endDate: s.period.endDate, zone };
  const positions = [...new Set(crew.map((c) => c.position))];
  return bundleSchema.parse({
    schemaVersion: 1,
    period,
    instances: positions.map((position) => ({
      schemaVersion: 1,
      period,
      group: { base: s.base, position },
      stations: [...s.stations].sort((a, b) => a.code.localeCompare(b.code)),
      pairings: s.pairings.filter((p) => (p.crewNeeded[position] ?? 0) > 0),
      crew: crew.filter((c) => c.position === position),
      bids: {},
      ruleSet: ruleSetFor(position),
      settings: {},
    })),
  });
}
