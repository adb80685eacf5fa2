/**
 * The published network's own limits on a line (A. Kasirzadeh, M. Saddoune,
 * F. Soumis, "Airline crew scheduling: models, algorithms, and data sets",
 * EURO Journal on Transportation and Logistics 6 (2017) 111–137), shared by
 * published.test.ts and published-strict.test.ts.
 */
import type { Pairing } from "@/lib/domain";
import { MAX_DUTY_MIN, MIN_REST_IN_PAIRING_MIN, MONTHLY_CREDIT_MAX_MIN } from "@/seed/published/kasirzadeh-2017-rule-set";

const ms = (iso: string) => Date.parse(iso);

/**
 * An independent re-check of a line under the data set's own limits, written
 * from the data set's description, not through lib/rules: pairings of the
 * line never overlap (report to release), each duty lasts at most 12 h and
 * each rest inside a pairing at least 8 h, both on the legs (first departure
 * to last arrival), and the line's credit stays within 85 h.
 */
export function lineProblems(line: readonly Pairing[]): string[] {
  const problems: string[] = [];
  const sorted = [...line].sort((a, b) => ms(a.dutyPeriods[0]!.report) - ms(b.dutyPeriods[0]!.report));
  sorted.forEach((p, k) => {
    const next = sorted[k + 1];
    if (next && ms(next.dutyPeriods[0]!.report) < ms(p.dutyPeriods.at(-1)!.release)) problems.push(`${p.id} overlaps ${next.id}`);
    p.dutyPeriods.forEach((d, j) => {
      const onLegs = (ms(d.legs.at(-1)!.arrival) - ms(d.legs[0]!.departure)) / 60_000;
      if (onLegs > MAX_DUTY_MIN) problems.push(`${p.id} duty ${j + 1} lasts ${onLegs} min`);
      const following = p.dutyPeriods[j + 1];
      if (following) {
        const rest = (ms(following.legs[0]!.departure) - ms(d.legs.at(-1)!.arrival)) / 60_000;
        if (rest < MIN_REST_IN_PAIRING_MIN) problems.push(`${p.id} rest after duty ${j + 1} is ${rest} min`);
      }
    });
  });
  const credit = line.reduce((t, p) => t + p.creditMinutes, 0);
  if (credit > MONTHLY_CREDIT_MAX_MIN) problems.push(`credit ${credit} min`);
  return problems;
}
