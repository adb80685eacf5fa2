/**
 * The caution every legality screen and the README carry. One sentence, kept
 * here so that every place says the same thing.
 */
export const LEGALITY_CAUTION =
  "These legality checks are an aid to planning, not a certified compliance system: the applicable regulations, " +
  "the operator's approved flight-time scheme and the collective agreement govern, and a qualified person must review every line before it is published.";
