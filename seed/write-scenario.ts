/**
 * Writes a scenario into an empty database in one transaction: either all of
 * it lands or none of it does.
 */
import type { Db as PrismaClient } from "../lib/db/client.ts";
import { hashPassword } from "../lib/auth/password.ts";
import type { Scenario } from "./small-scenario.ts";

const day = (d: string) => new Date(`${d}T00:00:00Z`);

/** Placeholder rule-set documents until the legality engine's presets land. */
const RULE_SETS = [
  { name: "Flight deck (US Part 117)", preset: "us-flightcrew", positions: ["captain", "first_officer"] },
  { name: "Cabin (US 121.467)", preset: "us-cabin", positions: ["flight_attendant", "purser"] },
] as const;

export async function writeScenario(prisma: PrismaClient, s: Scenario): Promise<{ periodId: string }> {
  const hashes = await Promise.all(s.users.map((u) => hashPassword(u.password)));
  return prisma.$transaction(
    async (tx) => {
      await tx.station.createMany({ data: s.stations.map((st) => ({ ...st })), skipDuplicates: true });
      const baseStation = s.stations.find((st) => st.code === s.base)!;
      const base = await tx.base.create({ data: { stationCode: s.base, name: baseStation.name } });
      const crewIds = new Map<string, string>();
      for (const c of s.crew) {
        const row = await tx.crewMember.create({
          data: {
            employeeNumber: c.id,
            name: c.name,
            seniority: c.seniority,
            baseId: base.id,
            position: c.position,
            qualifications: c.qualifications,
            activities: c.vacation
              ? { create: { kind: "vacation", startsAt: day(c.vacation.start), endsAt: day(c.vacation.end), label: "Annual leave" } }
              : undefined,
          },
        });
        crewIds.set(c.id, row.id);
      }
      for (const [i, u] of s.users.entries()) {
        await tx.user.create({
          data: {
            email: u.email,
            name: u.name,
            role: u.role,
            passwordHash: hashes[i]!,
            crewMemberId: u.crewId ? crewIds.get(u.crewId) : undefined,
          },
        });
      }
      const period = await tx.bidPeriod.create({
        data: {
          baseId: base.id,
          name: s.period.name,
          startDate: day(s.period.startDate),
          endDate: day(s.period.endDate),
          zone: s.period.zone,
          opensAt: new Date(s.period.opensAt),
          deadline: new Date(s.period.deadline),
          state: s.period.state,
        },
      });
      for (const p of s.pairings) {
        await tx.pairing.create({
          data: {
            bidPeriodId: period.id,
            code: p.id,
            startsAt: new Date(p.dutyPeriods[0]!.report),
            endsAt: new Date(p.dutyPeriods[p.dutyPeriods.length - 1]!.release),
            blockMinutes: p.blockMinutes,
            creditMinutes: p.creditMinutes,
            tafbMinutes: p.tafbMinutes,
            crewNeeded: p.crewNeeded,
            requires: p.requires,
            dutyPeriods: {
              create: p.dutyPeriods.map((d, seq) => ({
                seq,
                reportAt: new Date(d.report),
                releaseAt: new Date(d.release),
                legs: {
                  create: d.legs.map((l, lseq) => ({
                    seq: lseq,
                    flightNumber: l.flightNumber,
                    fromCode: l.from,
                    toCode: l.to,
                    departsAt: new Date(l.departure),
                    arrivesAt: new Date(l.arrival),
                    deadhead: l.deadhead,
                    blockMinutes: l.blockMinutes,
                    equipment: l.equipment ?? null,
                  })),
                },
              })),
            },
          },
        });
      }
      const positions = [...new Set(s.crew.map((c) => c.position))];
      for (const rs of RULE_SETS) {
        const used = positions.filter((p) => (rs.positions as readonly string[]).includes(p));
        if (used.length === 0) continue;
        const ruleSet = await tx.ruleSet.upsert({
          where: { name: rs.name },
          update: {},
          create: { name: rs.name, preset: rs.preset, document: { name: rs.name, preset: rs.preset, rules: [] } },
        });
        for (const position of used) {
          await tx.awardGroup.create({ data: { bidPeriodId: period.id, position, ruleSetId: ruleSet.id, settings: {} } });
        }
      }
      return { periodId: period.id };
    },
    { timeout: 60_000 },
  );
}
