// The public face of lib/domain: the shared contracts (zod schemas and the types
// inferred from them), the time module, canonical hashing and wish scoring.

export * from "./award-group.ts";
export * from "./award.ts";
export * from "./bid.ts";
export * from "./bundle.ts";
export * from "./crew.ts";
export * from "./duty-period.ts";
export * from "./errors.ts";
export * from "./explanation.ts";
export * from "./hash.ts";
export * from "./ids.ts";
export * from "./instance.ts";
export * from "./issues.ts";
export * from "./json-schema-documents.ts";
export * from "./line-dates.ts";
export * from "./line-score.ts";
export * from "./match-trip-filter.ts";
export * from "./pairing-facts.ts";
export * from "./pairing.ts";
export * from "./period.ts";
export * from "./position.ts";
export * from "./red-eye.ts";
export * from "./rule-set.ts";
export * from "./schema-version.ts";
export * from "./score-context.ts";
export * from "./score-shortfall.ts";
export * from "./score-wish.ts";
export * from "./settings.ts";
export * from "./stats.ts";
export * from "./station.ts";
export * from "./time-schemas.ts";
export * from "./time.ts";
export * from "./trip-facts.ts";
export * from "./trip-filter.ts";
export * from "./wish.ts";
