import { describe, expect, it } from "vitest";
import { AppError, canonicalJson, sha256Hex, sha256Text } from "../../../lib/domain/index.ts";

describe("canonicalJson (RFC 8785)", () => {
  it("canonicalizes the sample of RFC 8785 §3.2.2 to the text given in §3.2.3", () => {
    // The sample's numbers are written here as JavaScript literals; JSON.parse
    // of the RFC's own text yields the same doubles.
    const sample = JSON.parse(
      '{"numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001],' +
        ' "string": "\\u20ac$\\u000F\\u000aA\'\\u0042\\u0022\\u005c\\\\\\"\\/",' +
        ' "literals": [null, true, false]}',
    );
    expect(canonicalJson(sample)).toBe(
      '{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"}',
    );
  });

  it("yields the UTF-8 bytes listed in RFC 8785 §3.2.4 for that sample", () => {
    const sample = {
      numbers: [333333333.33333329, 1e30, 4.5, 2e-3, 1e-27],
      string: "€$\u000f\nA'B\"\\\\\"/",
      literals: [null, true, false],
    };
    const bytes = Buffer.from(canonicalJson(sample), "utf8").toString("hex").match(/../g)?.join(" ");
    expect(bytes).toBe(
      [
        "7b 22 6c 69 74 65 72 61 6c 73 22 3a 5b 6e 75 6c 6c 2c 74 72",
        "75 65 2c 66 61 6c 73 65 5d 2c 22 6e 75 6d 62 65 72 73 22 3a",
        "5b 33 33 33 33 33 33 33 33 33 2e 33 33 33 33 33 33 33 2c 31",
        "65 2b 33 30 2c 34 2e 35 2c 30 2e 30 30 32 2c 31 65 2d 32 37",
        "5d 2c 22 73 74 72 69 6e 67 22 3a 22 e2 82 ac 24 5c 75 30 30",
        "30 66 5c 6e 41 27 42 5c 22 5c 5c 5c 5c 5c 22 2f 22 7d",
      ].join(" "),
    );
  });

  it("sorts properties by UTF-16 code units as in the test vector of RFC 8785 §3.2.3", () => {
    const vector = {
      "\u20ac": "Euro Sign",
      "\r": "Carriage Return",
      "\ufb33": "Hebrew Letter Dalet With Dagesh",
      "1": "One",
      "\ud83d\ude00": "Emoji: Grinning Face",
      "\u0080": "Control",
      "\u00f6": "Latin Small Letter O With Diaeresis",
    };
    // Read the order from the text: JSON.parse would put the integer-like key "1" first again.
    const text = canonicalJson(vector);
    const positions = Object.values(vector).map((name) => [name, text.indexOf(`"${name}"`)] as const);
    const sorted = [...positions].sort((a, b) => a[1] - b[1]).map(([name]) => name);
    expect(sorted).toEqual([
      "Carriage Return",
      "One",
      "Control",
      "Latin Small Letter O With Diaeresis",
      "Euro Sign",
      "Emoji: Grinning Face",
      "Hebrew Letter Dalet With Dagesh",
    ]);
  });

  it("writes numbers as RFC 8785 Appendix B lists them", () => {
    expect(canonicalJson([-0, 5e-324, 1e21, 0.000001, 9007199254740992, 1424953923781206.2, 1e23])).toBe(
      "[0,5e-324,1e+21,0.000001,9007199254740992,1424953923781206.2,1e+23]",
    );
  });

  it("refuses values JSON cannot hold", () => {
    expect(() => canonicalJson(undefined)).toThrow(AppError);
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(AppError);
    expect(() => canonicalJson([Infinity])).toThrow(AppError);
  });
});

describe("sha256Hex", () => {
  it("hashes UTF-8 text as the FIPS 180-2 example \"abc\" gives", () => {
    // FIPS 180-2, Appendix B.1 (SHA-256 of "abc").
    expect(sha256Text("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("does not depend on key order, at any depth", () => {
    const a = { crewId: "004711", wishes: [{ kind: "free-days", dates: ["2027-03-14"] }], periodId: "P1" };
    const b = { periodId: "P1", wishes: [{ dates: ["2027-03-14"], kind: "free-days" }], crewId: "004711" };
    expect(sha256Hex(a)).toBe(sha256Hex(b));
    expect(sha256Hex(a)).toMatch(/^[0-9a-f]{64}$/);
    expect(sha256Hex(a)).toBe(sha256Text(canonicalJson(b)));
  });

  it("changes when a value or the array order changes", () => {
    expect(sha256Hex({ ranks: [1, 2] })).not.toBe(sha256Hex({ ranks: [2, 1] }));
    expect(sha256Hex({ minutes: 60 })).not.toBe(sha256Hex({ minutes: 61 }));
  });
});
