/**
 * The bid-period generator: one base, any positions, deterministic for a seed.
 * Returns the bundle (one instance per award group) and what the database
 * needs besides (the bidding window and demo sign-ins are added by callers).
 */
import { awardSettingsSchema, bundleSchema, instanceSchema, type Bundle, type Instance } from "../../lib/domain/index.ts";
import { addDays, monthLabel } from "../../lib/domain/time.ts";
import { CARRIER, STATIONS } from "../carrier.ts";
import { rng } from "../random.ts";
import { makeBids, tripAppeal } from "./make-bids.ts";
import { makeCrew } from "./make-crew.ts";
import { capacityMinutes, makePairings } from "./make-pairings.ts";
import { CREW_PER_PAIRING, generatorParamsSchema, type GeneratorInput } from "./params.ts";
import { ruleSetFor } from "./rule-set-presets.ts";


export function generatePeriod(input: GeneratorInput = {}): Bundle {
  const params = generatorParamsSchema.parse(input);
  const base = STATIONS.find((s) => s.code === params.base);
  if (!base) throw new Error(`base "${params.base}" is not a station of ${CARRIER.name}`);
  const zone = base.zone;
  const endDate = addDays(params.startDate, params.days - 1);
  // Separate random streams, so asking for more pairings does not change the crew.
  let flight = 100;
  const flightRng = rng(params.seed * 7919 + 3);
  const flightNo = () => (flight += flightRng.int(1, 7));
  const crew = makeCrew({ params, zone, endDate, flightNo }, rng(params.seed * 7919 + 1));
  // Trip credit each group can absorb, per crew seat a pairing needs: the tightest group sets the pace.
  const perSeat = Math.min(
    ...params.positions.map((pos) => capacityMinutes(crew.filter((c) => c.position === pos), params, zone) / CREW_PER_PAIRING[pos]),
  );
  const pairings = makePairings(params, perSeat, rng(params.seed * 7919 + 2), flightNo, zone);
  const appeal = new Map(pairings.map((p) => [p.id, tripAppeal(p, zone)]));
  const ranked = [...pairings].sort((a, b) => appeal.get(b.id)! - appeal.get(a.id)! || a.id.localeCompare(b.id));
  const bids = makeBids(crew, { params, zone, endDate, ranked }, rng(params.seed * 7919 + 4));
  const period = {
    id: params.periodId ?? `${params.base}-${params.startDate.slice(0, 7)}`,
    name: params.days >= 28 && params.startDate.endsWith("-01") ? monthLabel(params.startDate) : `${params.startDate} to ${endDate}`,
    startDate: params.startDate,
    endDate,
    zone,
  };
  const instances: Instance[] = params.positions.map((position) => {
    const groupCrew = crew.filter((c) => c.position === position);
    const ids = new Set(groupCrew.map((c) => c.id));
    return instanceSchema.parse({
      schemaVersion: 1,
      period,
      group: { base: params.base, position },
      stations: [...STATIONS].sort((a, b) => a.code.localeCompare(b.code)),
      pairings,
      crew: groupCrew,
      bids: Object.fromEntries(Object.entries(bids).filter(([id]) => ids.has(id))),
      ruleSet: ruleSetFor(position),
      settings: awardSettingsSchema.parse({}),
    });
  });
  return bundleSchema.parse({ schemaVersion: 1, period, instances });
}
