// The legality engine's public face: presets, the checks, the caution.
export { LEGALITY_CAUTION } from "./caution.ts";
export { canFollow, checkLine, extend, extendAll, finish, start, type EngineContext, type LineResult, type LineState } from "./engine.ts";
export type { LineItem } from "./duty.ts";
export { PRESET_IDS, agreementRules, presetFor, presetRuleSet, type PresetId } from "./presets.ts";
export { REGISTRY, bindRules, dutyRulesOnly } from "./registry.ts";
export type { Violation } from "./rule.ts";
export { US_117_TABLE_A, US_117_TABLE_B, usTableAMinutes, usTableBMinutes } from "./tables/us-117.ts";
export { EU_TABLE_2, euTableTwoMinutes } from "./tables/eu-oro-ftl.ts";
export { requiredDaysOff } from "./checks/line-rules.ts";
