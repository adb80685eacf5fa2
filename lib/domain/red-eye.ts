import type { DutyPeriod } from "./duty-period.ts";
import type { Pairing } from "./pairing.ts";
import { atLocalTime, localDatesTouched, overlaps } from "./time.ts";

/**
 * The night window a red-eye flies through, base local time: 01:00 up to 05:00
 * (common practice, no published source). Not the whole window of circadian
 * low of 14 CFR 117.3 (0200–0559): with that, every ordinary 05:30 departure
 * would count as a red-eye, and crew mean an overnight flight by the word.
 */
export const redEyeWindow = { from: "01:00", until: "05:00" } as const;

/**
 * Whether a duty period is a red-eye: one of its legs (operated or deadhead) is
 * under way at some moment of the night window in `zone` (the base's zone, where
 * the crew's body clock is). Legs are used rather than report and release so
 * that an early report for a 06:00 departure counts as an early start, not a
 * red-eye. On a spring-forward night the window is an hour shorter.
 */
export function isRedEyeDuty(duty: DutyPeriod, zone: string): boolean {
  return duty.legs.some((leg) =>
    localDatesTouched(leg.departure, leg.arrival, zone).some((date) =>
      overlaps(
        leg.departure,
        leg.arrival,
        atLocalTime(date, redEyeWindow.from, zone),
        atLocalTime(date, redEyeWindow.until, zone),
      ),
    ),
  );
}

/** Whether any duty period of the pairing is a red-eye; see {@link isRedEyeDuty}. */
export function isRedEye(pairing: Pairing, zone: string): boolean {
  return pairing.dutyPeriods.some((duty) => isRedEyeDuty(duty, zone));
}
