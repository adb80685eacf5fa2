/**
 * One uploaded CSV file read as a table: the header checked against the
 * columns the file must have, every row checked with a zod schema, and every
 * problem reported with the file, its line number and the column.
 * Parsing is npm csv-parse (RFC 4180 quoting, a UTF-8 byte-order mark allowed).
 * Pure: text in, rows and problems out.
 */
import { parse } from "csv-parse/sync";
import type { z } from "zod";
import { IMPORT_LIMITS, megabytes } from "./limits";

/** A problem with one uploaded file, as the scheduler is shown it. */
export interface ImportProblem {
  file: string;
  /** 1-based line of the file (1 = the header); absent for a problem with the whole file */
  line?: number;
  column?: string;
  message: string;
}

/** A checked row and the line it came from. */
export interface Row<T> {
  line: number;
  value: T;
}

/** What a table's columns must be: `required` in any order, `optional` may be absent. */
export interface Columns {
  required: readonly string[];
  optional?: readonly string[];
}

/** A problem as one line of text: "legs.csv line 14, column departs_utc: …". */
export function problemText(p: ImportProblem): string {
  const where = [p.file, p.line === undefined ? undefined : `line ${p.line}`].filter(Boolean).join(" ");
  return `${where}${p.column ? `, column ${p.column}` : ""}: ${p.message}`;
}

/** The byte length of `text` as UTF-8. */
export function byteLength(text: string): number {
  return Buffer.byteLength(text, "utf8");
}

/**
 * Reads `text` as the CSV file `file`. Each row is an object of the header's
 * columns (cells trimmed; empty cells are ""), parsed with `schema`; a zod
 * issue on field f is reported at that row's line and column f.
 */
export function readTable<T>(
  file: string,
  text: string,
  columns: Columns,
  schema: z.ZodType<T>,
): { rows: Row<T>[]; problems: ImportProblem[]; rejected: Array<Row<Record<string, string>>>; unread?: true } {
  const problems: ImportProblem[] = [];
  const size = byteLength(text);
  if (size > IMPORT_LIMITS.csvBytes) {
    return { rows: [], rejected: [], unread: true, problems: [{ file, message: `the file is ${megabytes(size)}; a CSV file may be at most ${megabytes(IMPORT_LIMITS.csvBytes)}` }] };
  }
  let parsedRecords: Array<{ record: string[]; info: { lines: number } }>;
  try {
    // Line breaks made one kind first: csv-parse counts a CRLF inside quotes as two lines.
    const lf = text.replace(/\r\n?/g, "\n");
    parsedRecords = parse(lf, { bom: true, relax_column_count: true, skip_empty_lines: true, trim: true, info: true }) as unknown as typeof parsedRecords;
  } catch (error) {
    const e = error as { message?: string; lines?: number };
    return { rows: [], rejected: [], unread: true, problems: [{ file, line: e.lines, message: `not a readable CSV file (${e.message ?? String(error)})` }] };
  }
  // csv-parse skips empty lines; `info.lines` is the line a record ends on (its only line, but for a quoted line break).
  const records = parsedRecords.map((r) => r.record);
  const lines = parsedRecords.map((r) => r.info.lines);
  const header = records[0];
  if (!header) return { rows: [], rejected: [], unread: true, problems: [{ file, message: "the file is empty: it needs a header row and one row per record" }] };
  const headerLine = lines[0] ?? 1;
  const known = new Set([...columns.required, ...(columns.optional ?? [])]);
  const seen = new Set<string>();
  header.forEach((name, k) => {
    if (!known.has(name)) problems.push({ file, line: headerLine, column: name || `#${k + 1}`, message: `unknown column "${name}"; the columns are ${[...known].join(", ")}` });
    else if (seen.has(name)) problems.push({ file, line: headerLine, column: name, message: `column "${name}" appears twice` });
    seen.add(name);
  });
  for (const name of columns.required) {
    if (!seen.has(name)) problems.push({ file, line: headerLine, column: name, message: `missing column "${name}"` });
  }
  if (problems.length > 0) return { rows: [], rejected: [], unread: true, problems };
  const body = records.slice(1);
  if (body.length > IMPORT_LIMITS.rows) {
    return { rows: [], rejected: [], unread: true, problems: [{ file, message: `the file has ${body.length.toLocaleString("en-GB")} rows; a file may have at most ${IMPORT_LIMITS.rows.toLocaleString("en-GB")}` }] };
  }
  const rows: Row<T>[] = [];
  const rejected: Array<Row<Record<string, string>>> = [];
  body.forEach((cells, k) => {
    const line = lines[k + 1] ?? k + 2;
    if (cells.length !== header.length) {
      problems.push({ file, line, message: `the row has ${cells.length} fields but the header has ${header.length}` });
      rejected.push({ line, value: Object.fromEntries(header.map((name, i) => [name, cells[i] ?? ""])) });
      return;
    }
    const record = Object.fromEntries(header.map((name, i) => [name, cells[i] ?? ""]));
    const parsed = schema.safeParse(record);
    if (parsed.success) rows.push({ line, value: parsed.data });
    else {
      rejected.push({ line, value: record });
      for (const issue of parsed.error.issues) problems.push({ file, line, column: issue.path[0] === undefined ? undefined : String(issue.path[0]), message: issue.message });
    }
  });
  return { rows, problems, rejected };
}
