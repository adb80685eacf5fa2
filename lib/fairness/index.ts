// lib/fairness: distribution measures of satisfaction and the fairness report of an award.
export { gini, jainIndex, mean, percentile } from "./measures.ts";
export { fairnessReport, type FairnessReport } from "./award-fairness.ts";
export { LEDGER, ledgerFor, ledgerStep, type LedgerStep } from "./ledger.ts";
