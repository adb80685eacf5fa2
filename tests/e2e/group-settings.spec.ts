import { expect, signIn, test } from "./helpers.ts";

// Runs before publish.spec.ts (it closes bidding): a scheduler edits the first officers' rule set and settings.
test("a scheduler changes the mode, the time limit and a rule, and the period page shows them", async ({ page }) => {
  test.setTimeout(60_000);
  await signIn(page, "planning@larkfield.test");
  await page.getByRole("link", { name: "January 2027" }).click();
  const officers = page.getByRole("region", { name: "First officers" });
  await expect(officers).toContainText("Strict seniority · time limit 10 min 00 s");
  await officers.getByRole("link", { name: "Rule set and settings" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Rule set and settings · First officers");
  await expect(page.getByRole("note")).toContainText("not a certified compliance system");
  await expect(page.getByText("Also used by HLV captains, January 2027.")).toBeVisible();

  // Choosing another preset asks first; keeping the current rules leaves them as they were.
  await page.getByLabel("Start from", { exact: true }).selectOption({ label: "Cabin (US 121.467)" });
  const ask = page.getByRole("alertdialog", { name: "Load the preset's rules" });
  await expect(ask).toContainText("replaces every rule below");
  await ask.getByRole("button", { name: "Keep the current rules" }).click();
  await expect(ask).toBeHidden();
  await expect(page.getByRole("listitem", { name: "Rule fdp-limit" })).toBeVisible();
  // Replacing loads the cabin preset's own rules into the form; "Undo changes" brings back the stored ones.
  await page.getByLabel("Start from", { exact: true }).selectOption({ label: "Cabin (US 121.467)" });
  await ask.getByRole("button", { name: "Replace the rules" }).click();
  await expect(page.getByRole("listitem", { name: "Rule max-scheduled-duty" })).toBeVisible();
  await expect(page.getByRole("listitem", { name: "Rule fdp-limit" })).toHaveCount(0);
  await page.getByRole("button", { name: "Undo changes" }).click();
  await expect(page.getByRole("listitem", { name: "Rule fdp-limit" })).toBeVisible();
  await expect(page.getByRole("listitem", { name: "Rule max-scheduled-duty" })).toHaveCount(0);
  await expect(page.getByLabel("Start from", { exact: true })).toHaveValue("us-flightcrew");

  // The fairness floor is offered in weighted balance only; the wish weights follow the rank decay.
  await expect(page.getByLabel("Fairness floor", { exact: true })).toHaveCount(0);
  await page.getByRole("radio", { name: /Weighted balance/ }).check();
  await page.getByLabel("Fairness floor", { exact: true }).fill("0.3");
  await page.getByLabel("Rank decay", { exact: true }).fill("0.5");
  const weights = page.getByRole("group", { name: "Weights of wishes 1 to 5" });
  await expect(weights).toHaveText("wish #1: 1wish #2: 0.5wish #3: 0.25wish #4: 0.13wish #5: 0.06");
  const daysOn = page.getByRole("listitem", { name: "Rule max-days-on" });
  await daysOn.getByRole("switch", { name: "In force: max-days-on" }).click();
  await expect(daysOn.getByRole("switch")).toHaveAttribute("aria-checked", "false");

  // A time limit over 24 hours is refused, naming the field; nothing is saved.
  await page.getByLabel("Minutes", { exact: true }).fill("2000");
  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expect(page.getByRole("alert").filter({ hasText: "Time limit (settings.timeLimitSeconds): must be at most 86400 seconds" }).first()).toBeVisible();
  // The form keeps what was typed after a refusal.
  await expect(page.getByRole("radio", { name: /Weighted balance/ })).toBeChecked();
  await expect(page.getByLabel("Minutes", { exact: true })).toHaveValue("2000");

  await page.getByLabel("Minutes", { exact: true }).fill("1");
  await page.getByLabel("Seconds", { exact: true }).fill("30");
  await page.getByRole("button", { name: "Save", exact: true }).click();
  const saved = page.getByRole("status");
  await expect(saved).toContainText("Saved for HLV first officers, January 2027: Mode: strict → balanced");
  await expect(saved).toContainText("Time limit: 600 → 90");
  await expect(saved).toContainText("rule max-days-on: off");
  await expect(saved).toContainText('a rule set of their own, "Flight deck (US Part 117) · HLV first officers, January 2027"');

  await page.getByRole("link", { name: "January 2027" }).click();
  await expect(page.getByRole("region", { name: "First officers" })).toContainText("Weighted balance · time limit 1 min 30 s");
  // The captains' group, which shared the rule set, is unchanged.
  await expect(page.getByRole("region", { name: "Captains" })).toContainText("Strict seniority");

  // Opened again, the form shows what was saved.
  await page.getByRole("region", { name: "First officers" }).getByRole("link", { name: "Rule set and settings" }).click();
  await expect(page.getByRole("radio", { name: /Weighted balance/ })).toBeChecked();
  await expect(page.getByLabel("Fairness floor", { exact: true })).toHaveValue("0.3");
  await expect(page.getByLabel("Minutes", { exact: true })).toHaveValue("1");
  await expect(page.getByLabel("Seconds", { exact: true })).toHaveValue("30");
  await expect(page.getByRole("switch", { name: "In force: max-days-on" })).toHaveAttribute("aria-checked", "false");
  await expect(page.getByText("Rule set in use: Flight deck (US Part 117) · HLV first officers, January 2027")).toBeVisible();
});
