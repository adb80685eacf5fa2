/** What scoring a wish needs besides the wish and the line. */
export interface ScoreContext {
  /** The base's IANA zone: dates and clock times of wishes are base local. */
  zone: string;
  /** First and last date of the bid period, both included. */
  periodStart: string;
  periodEnd: string;
  /** The buddy's line (pairing ids) when the buddy wish is mutual within the award group; otherwise absent. */
  buddyLine?: readonly string[] | undefined;
}
