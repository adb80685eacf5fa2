// The converter of the published data set of A. Kasirzadeh, M. Saddoune,
// F. Soumis, "Airline crew scheduling: models, algorithms, and data sets",
// EURO J. Transp. Logist. 6 (2017) 111–137, checked against the files
// themselves (tests/fixtures/kasirzadeh-2017, unchanged copies) and against the
// paper's table of instances. The checks of times, legs and credit read the
// fixture files here, with a reader of their own, rather than trusting the
// converter's numbers.
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { bundleSchema, instanceSchema, type Instance } from "@/lib/domain";
import {
  MAX_DUTY_MIN,
  MIN_REST_IN_PAIRING_MIN,
  MONTHLY_CREDIT_MAX_MIN,
  loadKasirzadeh,
} from "@/seed/published/kasirzadeh-2017";

const fixtures = path.resolve(import.meta.dirname, "../../fixtures/kasirzadeh-2017");
const HOUR = 60;

interface FileLeg { from: string; to: string; dep: number; arr: number }

/** The fixture's legs by id, times in minutes since the epoch, read straight from the day files. */
function fileLegs(dir: string): Map<string, FileLeg> {
  const legs = new Map<string, FileLeg>();
  for (const name of readdirSync(dir).filter((n) => n.startsWith("day_"))) {
    for (const line of readFileSync(path.join(dir, name), "utf8").split("\n")) {
      if (line.trim() === "" || line.startsWith("#")) continue;
      const [id, from, dd, dt, to, ad, at] = line.split(",").map((s) => s.trim()) as string[];
      legs.set(id!, { from: from!, to: to!, dep: Date.parse(`${dd}T${dt}Z`) / 60000, arr: Date.parse(`${ad}T${at}Z`) / 60000 });
    }
  }
  return legs;
}

/** The published pairings by number: base name and leg names as written (TDH_ kept). */
function filePairings(dir: string): Map<string, { base: string; legs: string[] }> {
  const text = readFileSync(path.join(dir, "initialSolution.in"), "utf8");
  return new Map(
    [...text.matchAll(/Pairing (\d+) : Base (\w+) : ([^;]*);/g)].map((m) => [
      `P${m[1]}`,
      { base: m[2]!, legs: m[3]!.split(",").map((s) => s.trim()) },
    ]),
  );
}

const bare = (name: string) => name.replace(/^TDH_/, "");
const range = (xs: number[]) => [Math.min(...xs), Math.max(...xs)] as const;
const hours = (min: number) => `${Math.floor(min / 60)}h${String(Math.round(min % 60)).padStart(2, "0")}`;

// Kasirzadeh, Saddoune & Soumis 2017, table of instances: pairings, legs and pilots per base.
const published = {
  instance1: { pairings: 172, legs: 1013, pilots: { BASE1: 7, BASE2: 20, BASE3: 6 } },
  instance2: { pairings: 303, legs: 1500, pilots: { BASE1: 10, BASE2: 9, BASE3: 15 } },
} as const;

describe.each(Object.entries(published))("published %s", (name, table) => {
  const dir = path.join(fixtures, name);
  const data = loadKasirzadeh(dir, { seed: 7 });
  const legs = fileLegs(dir);
  const solution = filePairings(dir);
  const baseName = (inst: Instance) => inst.stations.find((s) => s.code === inst.group.base)!.name;

  it("reproduces the counts of the paper's table of instances (Kasirzadeh, Saddoune & Soumis 2017)", () => {
    expect(data.instances).toHaveLength(3);
    expect(data.instances.reduce((n, inst) => n + inst.pairings.length, 0)).toBe(table.pairings);
    expect(legs.size).toBe(table.legs);
    expect(Object.fromEntries(data.instances.map((inst) => [baseName(inst), inst.crew.length]))).toEqual(table.pilots);
    expect(data.bases).toEqual(data.instances.map((inst) => inst.group.base));
  });

  it("keeps every published pairing at its base with its legs in the published order", () => {
    for (const inst of data.instances) {
      for (const p of inst.pairings) {
        const src = solution.get(p.id)!;
        expect(src.base).toBe(baseName(inst));
        const ours = p.dutyPeriods.flatMap((d) => d.legs).map((l) => `${l.deadhead ? "TDH_" : ""}${l.flightNumber}`);
        expect(ours).toEqual(src.legs);
      }
    }
    expect(new Set(data.instances.flatMap((inst) => inst.pairings.map((p) => p.id)))).toEqual(new Set(solution.keys()));
  });

  it("names only legs of the day files, with their airports and times, and flies each leg exactly once", () => {
    const flown = new Map<string, number>();
    for (const inst of data.instances) {
      const nameOf = new Map(inst.stations.map((s) => [s.code, s.name]));
      for (const leg of inst.pairings.flatMap((p) => p.dutyPeriods.flatMap((d) => d.legs))) {
        const src = legs.get(leg.flightNumber);
        expect(src, leg.flightNumber).toBeDefined();
        expect([nameOf.get(leg.from), nameOf.get(leg.to)]).toEqual([src!.from, src!.to]);
        expect([Date.parse(leg.departure) / 60000, Date.parse(leg.arrival) / 60000]).toEqual([src!.dep, src!.arr]);
        if (!leg.deadhead) flown.set(leg.flightNumber, (flown.get(leg.flightNumber) ?? 0) + 1);
      }
    }
    // A crew-pairing solution covers each flight once; deadheads ride extra.
    expect(flown.size).toBe(legs.size);
    expect([...flown.values()].every((n) => n === 1)).toBe(true);
  });

  it("starts and ends every pairing at its base, by the day files' airports", () => {
    for (const inst of data.instances) {
      for (const p of inst.pairings) {
        const names = solution.get(p.id)!.legs.map(bare);
        expect(legs.get(names[0]!)!.from).toBe(baseName(inst));
        expect(legs.get(names.at(-1)!)!.to).toBe(baseName(inst));
      }
    }
  });

  it("keeps rests inside pairings of 8 h or more and duties of 12 h or less, as the data set's README says", () => {
    const ruleSet = data.instances[0]!.ruleSet;
    const param = (id: string, key: string) => ruleSet.rules.find((r) => r.id === id)?.params[key];
    expect(param("min-rest-in-pairing", "minMinutes")).toBe(8 * HOUR);
    expect(param("max-duty", "maxMinutes")).toBe(12 * HOUR);
    expect([MIN_REST_IN_PAIRING_MIN, MAX_DUTY_MIN]).toEqual([8 * HOUR, 12 * HOUR]);
    for (const inst of data.instances) {
      for (const p of inst.pairings) {
        const duties = p.dutyPeriods.map((d) => d.legs.map((l) => legs.get(l.flightNumber)!));
        duties.forEach((duty, k) => {
          expect(duty.at(-1)!.arr - duty[0]!.dep, `${p.id} duty ${k + 1}`).toBeLessThanOrEqual(12 * HOUR);
          // The split rule: sits inside a duty are shorter than 8 h.
          duty.slice(1).forEach((leg, j) => expect(leg.dep - duty[j]!.arr).toBeLessThan(8 * HOUR));
          const next = duties[k + 1];
          if (next) expect(next[0]!.dep - duty.at(-1)!.arr, `${p.id} rest ${k + 1}`).toBeGreaterThanOrEqual(8 * HOUR);
        });
      }
    }
  });

  it("reports 60 min before and releases 30 min after each duty, and credits flight time plus half the deadheads", () => {
    for (const p of data.instances.flatMap((inst) => inst.pairings)) {
      for (const d of p.dutyPeriods) {
        expect(legs.get(d.legs[0]!.flightNumber)!.dep - Date.parse(d.report) / 60000).toBe(60);
        expect(Date.parse(d.release) / 60000 - legs.get(d.legs.at(-1)!.flightNumber)!.arr).toBe(30);
      }
      const src = solution.get(p.id)!.legs;
      const span = (n: string) => legs.get(bare(n))!.arr - legs.get(bare(n))!.dep;
      const flown = src.filter((n) => !n.startsWith("TDH_")).reduce((s, n) => s + span(n), 0);
      const deadhead = src.filter((n) => n.startsWith("TDH_")).reduce((s, n) => s + span(n), 0);
      expect(p.blockMinutes).toBe(flown);
      expect(Math.abs(p.creditMinutes - (flown + deadhead / 2))).toBeLessThanOrEqual(0.5);
    }
  });

  it("gives every instance and bundle in a form the domain schemas return unchanged", () => {
    for (const inst of data.instances) expect(instanceSchema.parse(inst)).toStrictEqual(inst);
    data.bundles.forEach((bundle, k) => {
      expect(bundleSchema.parse(bundle)).toStrictEqual(bundle);
      expect(bundle.instances).toEqual([data.instances[k]]);
    });
    for (const inst of data.instances) {
      expect(inst.period).toMatchObject({ startDate: "2000-01-01", endDate: "2000-01-31", zone: "UTC", name: `January 2000, ${baseName(inst)}` });
      expect(inst.crew.map((c) => c.seniority)).toEqual(inst.crew.map((_, k) => k + 1));
      expect(inst.stations.every((s) => s.zone === "UTC" && s.longitude === 0 && /^[A-Z]{3}$/.test(s.code))).toBe(true);
    }
  });

  it("bids plausibly for every pilot: trips of the base, dates of the period, credit inside the line's maximum", () => {
    for (const inst of data.instances) {
      const ids = new Set(inst.pairings.map((p) => p.id));
      expect(Object.keys(inst.bids).sort()).toEqual(inst.crew.map((c) => c.id).sort());
      for (const wishes of Object.values(inst.bids)) {
        expect(wishes.map((w) => w.kind).sort()).toEqual(["credit", "free-days", "no-trip", "trip"]);
        for (const w of wishes) {
          if (w.kind === "trip") {
            expect(w.pairingIds!.length).toBeGreaterThanOrEqual(2);
            expect(w.pairingIds!.length).toBeLessThanOrEqual(3);
            expect(w.pairingIds!.every((id) => ids.has(id))).toBe(true);
          }
          if (w.kind === "free-days") expect(w.dates.every((d) => d >= "2000-01-01" && d <= "2000-01-31")).toBe(true);
          if (w.kind === "credit") expect(w.maxMinutes!).toBeLessThanOrEqual(MONTHLY_CREDIT_MAX_MIN);
          if (w.kind === "no-trip") expect(w.filter).toBeDefined();
        }
      }
    }
  });

  it("is byte-identical for the same seed; another seed changes only the bids", () => {
    const again = loadKasirzadeh(dir, { seed: 7 });
    const other = loadKasirzadeh(dir, { seed: 8 });
    expect(JSON.stringify(again)).toBe(JSON.stringify(data));
    expect(JSON.stringify(other)).not.toBe(JSON.stringify(data));
    expect(other.instances.map((i) => i.bids)).not.toEqual(data.instances.map((i) => i.bids));
    expect(other.instances.map((i) => ({ ...i, bids: {} }))).toEqual(data.instances.map((i) => ({ ...i, bids: {} })));
  });

  it("takes a bid maker of the caller's own", () => {
    const seen: string[] = [];
    const none = loadKasirzadeh(dir, { seed: 7, makeBids: ({ base }) => (seen.push(base), {}) });
    expect(seen).toEqual(data.bases);
    expect(none.instances.every((inst) => Object.keys(inst.bids).length === 0)).toBe(true);
  });

  it("prints its statistics", () => {
    const lines = data.instances.map((inst) => {
      const duties = inst.pairings.flatMap((p) => p.dutyPeriods);
      const perDuty = duties.map((d) => d.legs.length);
      const onLegs = duties.map((d) => (Date.parse(d.legs.at(-1)!.arrival) - Date.parse(d.legs[0]!.departure)) / 60000);
      const onDuty = duties.map((d) => (Date.parse(d.release) - Date.parse(d.report)) / 60000);
      const rests = inst.pairings.flatMap((p) =>
        p.dutyPeriods.slice(1).map((d, k) => (Date.parse(d.legs[0]!.departure) - Date.parse(p.dutyPeriods[k]!.legs.at(-1)!.arrival)) / 60000),
      );
      const credit = inst.pairings.map((p) => p.creditMinutes);
      const total = credit.reduce((s, c) => s + c, 0);
      const dutyCounts = inst.pairings.map((p) => p.dutyPeriods.length);
      const deadheads = duties.flatMap((d) => d.legs).filter((l) => l.deadhead).length;
      const [dMin, dMax] = range(onLegs);
      const [rMin, rMax] = range(onDuty);
      const [cMin, cMax] = range(credit);
      const [sMin, sMax] = range(rests);
      const [pMin, pMax] = range(dutyCounts);
      const [lMin, lMax] = range(perDuty);
      return (
        `${name} ${baseName(inst)}=${inst.group.base}: ${inst.pairings.length} pairings, ${inst.crew.length} pilots, ` +
        `${pMin}–${pMax} duty periods per pairing, legs per duty ${lMin}/${(perDuty.reduce((s, n) => s + n, 0) / perDuty.length).toFixed(2)}/${lMax} (min/mean/max), ` +
        `duty ${hours(dMin)}–${hours(dMax)} on the legs (${hours(rMin)}–${hours(rMax)} report to release), ` +
        `rest inside pairings ${hours(sMin)}–${hours(sMax)} on the legs, ` +
        `credit ${hours(cMin)}–${hours(cMax)} per pairing, ${deadheads} deadheads, ` +
        `total credit ${hours(total)} = ${(total / inst.crew.length / 60).toFixed(1)} h per pilot (line maximum 85 h)`
      );
    });
    console.log(lines.join("\n"));
    expect(lines).toHaveLength(3);
  });
});
