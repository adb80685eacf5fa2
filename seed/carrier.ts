/**
 * Larkfield Air, the fictional carrier of the demo, the tests and the
 * benchmarks. Station names and codes are invented; each sits in a real IANA
 * zone at a plausible position, across several UTC offsets: zones that change
 * to daylight-saving time in March and back in November, two that never do
 * (America/Phoenix, Pacific/Honolulu), one across the Atlantic (for
 * acclimation cases) and one in Mexico (no DST since 2022).
 */
import type { Station } from "../lib/domain/index.ts";

export const CARRIER = { name: "Larkfield Air", flightPrefix: "LK", mailDomain: "larkfield.test" } as const;

export type StationSeed = Station;

interface Place extends Station {
  latitude: number;
}

const PLACES: readonly Place[] = [
  { code: "HLV", name: "Halvern", zone: "America/Denver", latitude: 39.7, longitude: -104.9 },
  { code: "PSB", name: "Port Sable", zone: "America/Los_Angeles", latitude: 37.6, longitude: -122.4 },
  { code: "CRB", name: "Corrin Bay", zone: "America/Chicago", latitude: 41.9, longitude: -87.7 },
  { code: "EMR", name: "Eastmarch", zone: "America/New_York", latitude: 40.7, longitude: -73.9 },
  { code: "TLR", name: "Tallow Rock", zone: "America/Phoenix", latitude: 33.4, longitude: -112.0 },
  { code: "KMN", name: "Kaimana", zone: "Pacific/Honolulu", latitude: 21.3, longitude: -157.9 },
  { code: "OSY", name: "Ostry", zone: "Europe/Berlin", latitude: 52.5, longitude: 13.4 },
  { code: "GRV", name: "Greyvale", zone: "America/Boise", latitude: 43.6, longitude: -116.2 },
  { code: "MRW", name: "Merrow", zone: "America/Chicago", latitude: 29.8, longitude: -95.4 },
  { code: "SLT", name: "Saltmere", zone: "America/Los_Angeles", latitude: 47.4, longitude: -122.3 },
  { code: "BKW", name: "Brackwater", zone: "America/New_York", latitude: 25.8, longitude: -80.3 },
  { code: "QNT", name: "Quintara", zone: "America/Mexico_City", latitude: 19.4, longitude: -99.1 },
  { code: "ALD", name: "Aldmoor", zone: "America/Edmonton", latitude: 51.1, longitude: -114.0 },
  // Short hops, so that a duty period of four or five legs fits a working day.
  { code: "PLM", name: "Pellham", zone: "America/Denver", latitude: 41.1, longitude: -104.8 },
  { code: "CBS", name: "Cobb Springs", zone: "America/Denver", latitude: 38.8, longitude: -104.7 },
  { code: "KTG", name: "Kittering", zone: "America/Los_Angeles", latitude: 45.6, longitude: -122.6 },
  { code: "WLN", name: "Wellan", zone: "America/Chicago", latitude: 43.0, longitude: -89.4 },
];

export const STATIONS: readonly StationSeed[] = PLACES.map(({ latitude: _lat, ...station }) => station);

/** Long legs only from and to these stations (an oceanic qualification is needed). */
export const OCEANIC = new Set(["KMN", "OSY"]);
/** The qualification a crew member needs for trips touching an oceanic station. */
export const OCEANIC_QUALIFICATION = "oceanic";

/** Great-circle distance in km (haversine, mean Earth radius 6,371 km). */
function distanceKm(a: Place, b: Place): number {
  const rad = Math.PI / 180;
  const dLat = (b.latitude - a.latitude) * rad;
  const dLon = (b.longitude - a.longitude) * rad;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.latitude * rad) * Math.cos(b.latitude * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * 6371 * Math.asin(Math.sqrt(h));
}

const place = (code: string) => PLACES.find((p) => p.code === code);

/**
 * Scheduled block minutes of a direct leg, or undefined where the carrier flies
 * none: 30 min of taxi and climb plus 780 km/h, rounded to 5 min (an invented
 * but plausible rule). Oceanic stations are served from three gateways only.
 */
export function blockMinutes(from: string, to: string): number | undefined {
  const a = place(from);
  const b = place(to);
  if (!a || !b || a === b) return undefined;
  const gateways: Record<string, string[]> = { KMN: ["HLV", "PSB", "SLT"], OSY: ["EMR", "CRB"] };
  for (const [oceanic, gates] of Object.entries(gateways)) {
    if ((from === oceanic && !gates.includes(to)) || (to === oceanic && !gates.includes(from))) return undefined;
  }
  const km = distanceKm(a, b);
  if (!OCEANIC.has(from) && !OCEANIC.has(to) && km > 3300) return undefined;
  return Math.round((30 + km / 13) / 5) * 5;
}

/** Stations with a direct leg from `from`, in a fixed order. */
export function destinations(from: string): string[] {
  return STATIONS.map((s) => s.code).filter((c) => blockMinutes(from, c) !== undefined);
}
