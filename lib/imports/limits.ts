/**
 * Upload limits for imports (our choice, sized from the generator's largest
 * benchmark period, 300 crew and 1,650 trips: its legs.csv is 0.9 MB with
 * 7,300 rows and its JSON bundle 3.9 MB, measured; the limits leave room for
 * a few times that).
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
