import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { LEGALITY_CAUTION } from "@/lib/rules";

describe("the legality caution", () => {
  it("says what the checks are not, what governs, and who reviews", () => {
    expect(LEGALITY_CAUTION).toMatch(/not a certified compliance system/);
    expect(LEGALITY_CAUTION).toMatch(/regulations.*approved flight-time scheme.*collective agreement govern/);
    expect(LEGALITY_CAUTION).toMatch(/qualified person must review/);
  });

  it("is the README's caution, word for word", () => {
    expect(fs.readFileSync("README.md", "utf8")).toContain(LEGALITY_CAUTION);
  });
});
