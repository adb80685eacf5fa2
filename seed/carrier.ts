/**
 * Larkfield Air, the fictional carrier of the demo and the tests. Station names
 * and codes are invented; each sits in a real IANA zone at a plausible
 * longitude, across several UTC offsets (one without daylight-saving time, one
 * across the Atlantic for acclimation cases).
 */
import type { Station } from "../lib/domain/index.ts";

export const CARRIER = { name: "Larkfield Air", flightPrefix: "LK", mailDomain: "larkfield.test" } as const;

export type StationSeed = Station;

export const STATIONS: readonly StationSeed[] = [
  { code: "HLV", name: "Halvern", zone: "America/Denver", longitude: -104.9 },
  { code: "PSB", name: "Port Sable", zone: "America/Los_Angeles", longitude: -122.4 },
  { code: "CRB", name: "Corrin Bay", zone: "America/Chicago", longitude: -87.7 },
  { code: "EMR", name: "Eastmarch", zone: "America/New_York", longitude: -73.9 },
  { code: "TLR", name: "Tallow Rock", zone: "America/Phoenix", longitude: -112.0 },
  { code: "KMN", name: "Kaimana", zone: "Pacific/Honolulu", longitude: -157.9 },
  { code: "OSY", name: "Ostry", zone: "Europe/Berlin", longitude: 13.4 },
];

/** Scheduled block minutes between stations (symmetric; invented but plausible). */
const BLOCK: Record<string, number> = {
  "HLV-PSB": 150, "HLV-CRB": 140, "HLV-EMR": 235, "HLV-TLR": 95, "HLV-KMN": 420, "HLV-OSY": 600,
  "PSB-CRB": 250, "PSB-EMR": 330, "PSB-TLR": 105, "PSB-KMN": 335,
  "CRB-EMR": 130, "CRB-TLR": 200, "EMR-TLR": 290, "EMR-OSY": 500,
};

/** Block minutes of a direct leg, or undefined where the carrier flies none. */
export function blockMinutes(from: string, to: string): number | undefined {
  return BLOCK[`${from}-${to}`] ?? BLOCK[`${to}-${from}`];
}

/** Stations with a direct leg from `from`. */
export function destinations(from: string): string[] {
  return STATIONS.map((s) => s.code).filter((c) => c !== from && blockMinutes(from, c) !== undefined);
}
