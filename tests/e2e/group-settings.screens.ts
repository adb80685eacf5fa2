import path from "node:path";
import { expect, signIn, test } from "./helpers.ts";

const OUT = path.resolve(import.meta.dirname, "../../docs/screens");

// The rule-set and settings screen on a laptop and on a phone (390 px); nothing is saved, so the screens after it see the seeded settings.
test("laptop and phone screenshots of an award group's rule set and settings", async ({ page }) => {
  test.setTimeout(60_000);
  await page.setViewportSize({ width: 1280, height: 800 });
  await signIn(page, "planning@larkfield.test");
  await page.getByRole("link", { name: "January 2027" }).click();
  await page.getByRole("region", { name: "Captains" }).getByRole("link", { name: "Rule set and settings" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Rule set and settings · Captains");
  await page.getByRole("radio", { name: /Weighted balance/ }).check();
  await page.screenshot({ path: path.join(OUT, "group-settings.png"), fullPage: true });

  await page.setViewportSize({ width: 390, height: 844 });
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "group-settings-phone.png"), fullPage: true });
  // Choosing another preset asks before the rules are replaced.
  await page.getByLabel("Start from", { exact: true }).selectOption({ label: "Crew (EU ORO.FTL)" });
  await expect(page.getByRole("alertdialog")).toBeVisible();
  await page.screenshot({ path: path.join(OUT, "group-settings-preset-phone.png") });
  await page.getByRole("button", { name: "Keep the current rules" }).click();
  // A refused save: the message names the field, beside it and under Save; nothing is written.
  await page.getByLabel("Minutes", { exact: true }).fill("2000");
  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expect(page.getByRole("alert").filter({ hasText: "Time limit (settings.timeLimitSeconds)" }).first()).toBeVisible();
  await page.getByLabel("Minutes", { exact: true }).evaluate((e) => e.scrollIntoView({ block: "center" }));
  await page.screenshot({ path: path.join(OUT, "group-settings-refused-phone.png") });
});
