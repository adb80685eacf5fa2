import { describe, expect, it } from "vitest";
import { fairnessReport, gini, jainIndex, mean, percentile } from "@/lib/fairness";

describe("Jain's index (Jain, Chiu & Hawe, DEC-TR-301, 1984)", () => {
  it("is 1 for equal shares, whatever their size", () => {
    expect(jainIndex([0.7, 0.7, 0.7, 0.7])).toBeCloseTo(1, 12);
    expect(jainIndex([0.2, 0.2])).toBeCloseTo(1, 12);
  });
  it("is k/n when k of n share equally and the rest get nothing", () => {
    expect(jainIndex([0.5, 0.5, 0.5, 0, 0])).toBeCloseTo(3 / 5, 12);
    expect(jainIndex([1, 0, 0, 0])).toBeCloseTo(1 / 4, 12);
  });
  it("falls as shares spread: (1 + 0.5)² / (2 · 1.25) = 0.9", () => {
    expect(jainIndex([1, 0.5])).toBeCloseTo(0.9, 12);
  });
});

describe("Gini coefficient: G = Σᵢ Σⱼ |xᵢ − xⱼ| / (2 n² μ) (C. Gini, Variabilità e mutabilità, 1912; the mean-difference form, cited from memory)", () => {
  it("is 0 for equality and (n − 1)/n when one holds everything", () => {
    expect(gini([0.4, 0.4, 0.4])).toBeCloseTo(0, 12);
    expect(gini([0, 0, 0, 1])).toBeCloseTo(3 / 4, 12);
  });
  it("matches a hand computation: shares 0.2, 0.4, 0.6, 0.8", () => {
    // Σ|xi − xj| over all ordered pairs = 2 × (0.2+0.4+0.6 + 0.2+0.4 + 0.2) = 4.0; n = 4, mean 0.5:
    // G = 4.0 / (2 · 16 · 0.5) = 0.25.
    expect(gini([0.8, 0.2, 0.6, 0.4])).toBeCloseTo(0.25, 12);
  });
});

describe("percentiles and the award report", () => {
  it("interpolates between closest ranks", () => {
    expect(percentile([1, 2, 3, 4, 5], 50)).toBe(3);
    expect(percentile([1, 2, 3, 4], 50)).toBe(2.5);
    expect(percentile([0, 10], 10)).toBeCloseTo(1, 12);
    expect(() => percentile([1], 101)).toThrow(/outside 0–100/);
    expect(mean([])).toBe(0);
  });

  it("reports spread, Jain, Gini and seniority deciles, most senior first", () => {
    const entries = Array.from({ length: 20 }, (_, k) => ({ seniority: k + 1, satisfaction: 1 - k * 0.05 }));
    const r = fairnessReport([...entries].reverse());
    expect(r.crew).toBe(20);
    expect(r.max).toBe(1);
    expect(r.min).toBeCloseTo(0.05, 12);
    expect(r.spread).toBeCloseTo(0.95, 12);
    expect(r.byDecile).toHaveLength(10);
    expect(r.byDecile[0]).toBeCloseTo((1 + 0.95) / 2, 12);
    expect(r.byDecile[9]).toBeCloseTo((0.1 + 0.05) / 2, 12);
    expect(r.jain).toBeLessThan(1);
    expect(r.gini).toBeGreaterThan(0);
    expect(() => fairnessReport([{ seniority: 1, satisfaction: 1.2 }])).toThrow(/entries\[0\]\.satisfaction is 1.2/);
  });
});
