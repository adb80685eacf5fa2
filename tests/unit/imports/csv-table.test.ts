/** readTable: the line and column of every problem, RFC 4180 quoting (csv-parse), the header and size checks. */
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { problemText, readTable } from "@/lib/imports/csv-table";
import { IMPORT_LIMITS } from "@/lib/imports/limits";
import { wholeCell } from "@/lib/imports/cells";

const schema = z.object({ id: z.string().min(1, "needs an id"), n: wholeCell(1, "a count") });
const columns = { required: ["id", "n"], optional: ["note"] };

describe("readTable", () => {
  it("reads rows with their file lines, past blank lines, a byte-order mark and a quoted line break", () => {
    const text = '\uFEFFid,n,note\r\na,1,\r\n\r\n"b",2,"two\nlines"\nc,3,"say ""hi"""\n';
    const { rows, problems } = readTable("x.csv", text, columns, schema);
    expect(problems).toEqual([]);
    expect(rows.map((r) => [r.line, r.value])).toEqual([
      [2, { id: "a", n: 1 }],
      [5, { id: "b", n: 2 }],
      [6, { id: "c", n: 3 }],
    ]);
  });

  it("counts a CRLF inside quotes as one line, and finds the header after blank lines", () => {
    const text = '\r\n\r\nid,n,note\r\na,1,"x\r\ny"\r\nb,0,\r\n';
    const { rows, problems } = readTable("x.csv", text, columns, schema);
    expect(rows.map((r) => [r.line, r.value.id])).toEqual([[5, "a"]]);
    expect(problems).toEqual([{ file: "x.csv", line: 6, column: "n", message: "expected a count of 1 or more" }]);
    expect(readTable("x.csv", "\n\nid,colour\n", columns, schema).problems[0]).toMatchObject({ line: 3, column: "colour" });
  });

  it("names each bad row's line and column, and rows of the wrong width", () => {
    const { rows, problems, rejected } = readTable("x.csv", "n,id\n0,a\nx,\n5\n", columns, schema);
    expect(rows).toEqual([]);
    expect(problems).toEqual([
      { file: "x.csv", line: 2, column: "n", message: "expected a count of 1 or more" },
      { file: "x.csv", line: 3, column: "id", message: "needs an id" },
      { file: "x.csv", line: 3, column: "n", message: "expected a count, a whole number" },
      { file: "x.csv", line: 4, message: "the row has 1 fields but the header has 2" },
    ]);
    expect(rejected.map((r) => r.line)).toEqual([2, 3, 4]);
    expect(problemText(problems[0]!)).toBe("x.csv line 2, column n: expected a count of 1 or more");
  });

  it("checks the header: missing, unknown and repeated columns", () => {
    const { problems, unread } = readTable("x.csv", "id,colour,id\na,red,b\n", columns, schema);
    expect(unread).toBe(true);
    expect(problems.map((p) => p.message)).toEqual(['unknown column "colour"; the columns are id, n, note', 'column "id" appears twice', 'missing column "n"']);
  });

  it("refuses a file over the size limit before reading it, and an empty file", () => {
    const big = "id,n\n" + "a,1\n".repeat(IMPORT_LIMITS.csvBytes / 4 + 1);
    expect(readTable("x.csv", big, columns, schema).problems).toEqual([{ file: "x.csv", message: "the file is 4.0 MB; a CSV file may be at most 4.0 MB" }]);
    expect(readTable("x.csv", "", columns, schema).problems[0]!.message).toMatch(/the file is empty/);
  });
});
