import { IANAZone } from "luxon";

// The one time module. Instants are UTC ISO strings; calendar dates and clock
// times exist only relative to a station's IANA zone and are computed here, so
// that daylight-saving days (23 or 25 hours long) are handled in one place.
// Zone offsets come from luxon's IANAZone (which caches its Intl formatters);
// the arithmetic around them is plain epoch milliseconds, because building a
// luxon DateTime per call made scoring a line take milliseconds.

const MINUTE_MS = 60_000;
const DAY_MS = 86_400_000;
const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const CLOCK = /^([01]\d|2[0-3]):([0-5]\d)$/;

const HOUR_MS = 3_600_000;

/**
 * A zone's UTC offset in minutes at epoch ms, memoised per whole UTC hour: an
 * hour whose start and end have the same offset holds no change (tzdata has
 * no zone that changes twice within an hour), so every instant in it shares
 * that offset; in an hour that does hold a change, each instant asks the zone.
 * Asking Intl for every instant made a line check take about a millisecond.
 */
interface CachedZone {
  zone: IANAZone;
  hours: Map<number, number>;
}

const zones = new Map<string, CachedZone>();
const CHANGES = Number.NaN;

function zoneOf(zone: string): CachedZone {
  let found = zones.get(zone);
  if (!found) {
    const tz = IANAZone.create(zone);
    if (!tz.isValid) throw new RangeError(`"${zone}" is not a known IANA time zone`);
    found = { zone: tz, hours: new Map() };
    zones.set(zone, found);
  }
  return found;
}

function offsetAt(cached: CachedZone, ms: number): number {
  const hour = Math.floor(ms / HOUR_MS);
  let offset = cached.hours.get(hour);
  if (offset === undefined) {
    const first = cached.zone.offset(hour * HOUR_MS);
    offset = first === cached.zone.offset((hour + 1) * HOUR_MS) ? first : CHANGES;
    if (cached.hours.size > 200_000) cached.hours.clear();
    cached.hours.set(hour, offset);
  }
  return Number.isNaN(offset) ? cached.zone.offset(ms) : offset;
}

const pad = (n: number, width = 2) => String(n).padStart(width, "0");

/** Epoch ms of a date's midnight on the neutral UTC calendar: dates are zone-free labels. */
function civilMs(date: string): number {
  const match = DATE.exec(date);
  const ms = match ? Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3])) : Number.NaN;
  if (Number.isNaN(ms) || formatCivil(ms) !== date) throw new RangeError(`"${date}" is not a YYYY-MM-DD date`);
  return ms;
}

function formatCivil(ms: number): string {
  const d = new Date(ms);
  return `${pad(d.getUTCFullYear(), 4)}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
}

/** The wall clock of `instant` in `zone`, as if it were UTC. */
function wallMs(instant: string, zone: string): number {
  const ms = instantMs(instant);
  return ms + offsetAt(zoneOf(zone), ms) * MINUTE_MS;
}

/** Minutes after local midnight in `zone` of an instant given in epoch ms (seconds dropped). */
export function minuteOfLocalDay(ms: number, zone: string): number {
  const wall = ms + offsetAt(zoneOf(zone), ms) * MINUTE_MS;
  return Math.floor((((wall % DAY_MS) + DAY_MS) % DAY_MS) / MINUTE_MS);
}

/** Whether `zone` is an IANA zone name the runtime knows. */
export function isValidZone(zone: string): boolean {
  return IANAZone.isValidZone(zone);
}

/** The canonical text of an instant: `YYYY-MM-DDTHH:MM:SSZ`, milliseconds only when not zero. */
export function canonicalInstant(text: string): string {
  return toInstant(new Date(text));
}

/** A JavaScript Date (for example from the database) as a canonical UTC instant. */
export function toInstant(date: Date): string {
  if (Number.isNaN(date.getTime())) throw new RangeError("invalid Date");
  return date.toISOString().replace(".000Z", "Z");
}

/** Milliseconds since the epoch, for ordering and arithmetic. */
export function instantMs(instant: string): number {
  const ms = Date.parse(instant);
  if (Number.isNaN(ms)) throw new RangeError(`"${instant}" is not an ISO-8601 instant`);
  return ms;
}

/** Minutes from `start` to `end` (negative when `end` is earlier; fractional for seconds). */
export function minutesBetween(start: string, end: string): number {
  return (instantMs(end) - instantMs(start)) / MINUTE_MS;
}

/** The instant `minutes` after `instant`. */
export function addMinutes(instant: string, minutes: number): string {
  return toInstant(new Date(instantMs(instant) + minutes * MINUTE_MS));
}

/** The calendar date of `instant` in `zone`. */
export function localDate(instant: string, zone: string): string {
  return formatCivil(wallMs(instant, zone));
}

/** The clock time "HH:MM" of `instant` in `zone`. */
export function localTime(instant: string, zone: string): string {
  const wall = new Date(wallMs(instant, zone));
  return `${pad(wall.getUTCHours())}:${pad(wall.getUTCMinutes())}`;
}

/** The instant at which local date `date` begins in `zone` (its first existing minute). */
export function startOfLocalDay(date: string, zone: string): string {
  return atLocalTime(date, "00:00", zone);
}

/**
 * The instant of clock time `time` ("HH:MM") on `date` in `zone`. A time the
 * fall-back repeats means its first occurrence; a time the spring-forward gap
 * skips is read with the offset before the gap, so it moves forward by the gap
 * (02:30 → 03:30). This is RFC 5545 §3.3.5's rule (from memory), chosen
 * because luxon's own choice for repeated times depends on today's date.
 */
export function atLocalTime(date: string, time: string, zone: string): string {
  const clock = CLOCK.exec(time);
  if (!clock) throw new RangeError(`"${time}" is not an HH:MM clock time`);
  const wall = civilMs(date) + (Number(clock[1]) * 60 + Number(clock[2])) * MINUTE_MS;
  const tz = zoneOf(zone);
  // Offsets a day either side cover the one change a local day can hold.
  const before = offsetAt(tz, wall - DAY_MS);
  const after = offsetAt(tz, wall + DAY_MS);
  const fits = [before, after]
    .map((offset) => wall - offset * MINUTE_MS)
    .filter((candidate) => wall - offsetAt(tz, candidate) * MINUTE_MS === candidate);
  const instant = fits.length > 0 ? Math.min(...fits) : wall - before * MINUTE_MS;
  return toInstant(new Date(instant));
}

/** How many minutes local date `date` lasts in `zone`: 1440, or 1380 / 1500 on a daylight-saving change. */
export function localDayMinutes(date: string, zone: string): number {
  return minutesBetween(startOfLocalDay(date, zone), startOfLocalDay(addDays(date, 1), zone));
}

/**
 * The local dates in `zone` that the interval [start, end) touches. The end is
 * exclusive, so a release at exactly local midnight leaves the next date free;
 * an empty interval touches the date of its start.
 */
export function localDatesTouched(start: string, end: string, zone: string): string[] {
  const first = localDate(start, zone);
  const lastMs = Math.max(instantMs(start), instantMs(end) - 1);
  return periodDates(first, localDate(toInstant(new Date(lastMs)), zone));
}

/** The date `days` after `date` (negative goes back). */
export function addDays(date: string, days: number): string {
  return formatCivil(civilMs(date) + days * DAY_MS);
}

/** The day number of `date`: whole days since 1970-01-01, for cheap date arithmetic. */
export function dayNumber(date: string): number {
  return Math.round(civilMs(date) / DAY_MS);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return Math.round((civilMs(to) - civilMs(from)) / DAY_MS);
}

/** Every date from `startDate` to `endDate`, both included; empty when `endDate` is earlier. */
export function periodDates(startDate: string, endDate: string): string[] {
  const start = civilMs(startDate);
  const count = Math.round((civilMs(endDate) - start) / DAY_MS) + 1;
  return Array.from({ length: Math.max(0, count) }, (_, i) => formatCivil(start + i * DAY_MS));
}

/** ISO day of the week of `date`: 1 = Monday … 7 = Sunday. */
export function dayOfWeek(date: string): number {
  return new Date(civilMs(date)).getUTCDay() || 7;
}

/** Whether [aStart, aEnd) and [bStart, bEnd) share at least a moment. */
export function overlaps(aStart: string, aEnd: string, bStart: string, bEnd: string): boolean {
  return instantMs(aStart) < instantMs(bEnd) && instantMs(bStart) < instantMs(aEnd);
}

/** An instant as people read it in a zone, e.g. "Sun, Dec 20, 18:00 MST" (en-US, 24-hour clock). */
export function localDateTimeLabel(instant: string, zone: string): string {
  return new Date(instantMs(instant)).toLocaleString("en-US", {
    weekday: "short",
    month: "short",
    day: "numeric",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
    timeZone: zone,
    timeZoneName: "short",
  });
}

const MONTH_NAMES = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

/** The month of a date as people name it, e.g. "2027-03-14" → "March 2027". */
export function monthLabel(date: string): string {
  return `${MONTH_NAMES[Number(date.slice(5, 7)) - 1]} ${date.slice(0, 4)}`;
}
