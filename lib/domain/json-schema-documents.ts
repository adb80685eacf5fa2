import { z } from "zod";
import { awardSchema } from "./award.ts";
import { bidSchema } from "./bid.ts";
import { bundleSchema } from "./bundle.ts";
import { explanationsSchema } from "./explanation.ts";
import { instanceSchema } from "./instance.ts";
import { ruleSetSchema } from "./rule-set.ts";
import { awardSettingsSchema } from "./settings.ts";
import { statsSchema } from "./stats.ts";

/** The documents published as JSON Schema under docs/schemas, by file name. */
export const jsonSchemaSources = {
  "instance.json": instanceSchema,
  "bundle.json": bundleSchema,
  "bid.json": bidSchema,
  "award.json": awardSchema,
  "stats.json": statsSchema,
  "explanations.json": explanationsSchema,
  "rule-set.json": ruleSetSchema,
  "award-settings.json": awardSettingsSchema,
} as const;

/**
 * The text of each JSON Schema file, by file name. Schemas describe what a
 * parser accepts (zod's "input" side: fields with defaults are optional).
 * Cross checks written as refinements (unique ids, stations known, …) have no
 * JSON Schema form and are left out; the zod schemas remain the authority.
 */
export function jsonSchemaFiles(): Record<string, string> {
  return Object.fromEntries(
    Object.entries(jsonSchemaSources).map(([file, schema]) => [
      file,
      `${JSON.stringify(z.toJSONSchema(schema, { io: "input" }), null, 2)}\n`,
    ]),
  );
}
