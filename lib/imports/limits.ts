/**
 * Upload limits for imports (our choice, sized from the generator's largest
 * period: 300 crew and 1,650 trips give a legs.csv of about 0.6 MB and
 * 7,000 rows, and a JSON bundle of about 12 MB with a year of daily flight
 * totals per crew member).
 */
export const IMPORT_LIMITS = {
  /** one CSV file */
  csvBytes: 4 * 1024 * 1024,
  /** data rows in one CSV file */
  rows: 50_000,
  /** one JSON bundle or instance */
  jsonBytes: 32 * 1024 * 1024,
} as const;

/** A byte count in megabytes, one decimal: "4.0 MB". */
export function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
