/** The fairness ledger's step, worked by hand (the formula in lib/fairness/ledger.ts is our own; these are its arithmetic). */
import { describe, expect, it } from "vitest";
import { LEDGER, ledgerFor, ledgerStep } from "@/lib/fairness/index";

describe("the fairness ledger", () => {
  it("owes a crew member who fell short of the group's mean, and fades it the next period", () => {
    // Mean 0.8, satisfaction 0.5: owed 0.3, weight 1.3.
    const first = ledgerStep(0, 0.5, 0.8);
    expect(first.balance).toBeCloseTo(0.3, 12);
    expect(first.carriedWeight).toBeCloseTo(1.3, 12);
    // Next period 0.9 against a mean of 0.8: half of 0.3, less 0.1.
    const second = ledgerStep(first.balance, 0.9, 0.8);
    expect(second.balance).toBeCloseTo(0.05, 12);
    expect(second.carriedWeight).toBeCloseTo(1.05, 12);
  });

  it("keeps the weight between its bounds", () => {
    expect(ledgerStep(1, 0, 1).carriedWeight).toBe(LEDGER.maxWeight);
    expect(ledgerStep(-1, 1, 0).carriedWeight).toBe(LEDGER.minWeight);
  });

  it("balances an award group around its mean: the balances of a first period sum to zero", () => {
    const steps = ledgerFor(
      [
        { crewMemberId: "a", satisfaction: 1 },
        { crewMemberId: "b", satisfaction: 0.6 },
        { crewMemberId: "c", satisfaction: 0.2 },
      ],
      new Map(),
    );
    expect([...steps.values()].reduce((s, x) => s + x.balance, 0)).toBeCloseTo(0, 12);
    expect(steps.get("c")!.carriedWeight).toBeCloseTo(1.4, 12);
    expect(steps.get("a")!.carriedWeight).toBeCloseTo(0.6, 12);
  });
});
