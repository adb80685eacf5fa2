import path from "node:path";
import { expect, signIn, test } from "./helpers.ts";
import { setTimeLimit } from "./planning-steps.ts";

const OUT = path.resolve(import.meta.dirname, "../../docs/screens");

// Planning is laptop work: a laptop-sized window, and the run page on a phone as well.
test("laptop and phone screenshots of the period page and an award run", async ({ page }) => {
  test.setTimeout(120_000);
  // A short time limit for the captains' group, so the run ends within the test.
  await setTimeLimit(12, "captain");
  await page.setViewportSize({ width: 1280, height: 800 });
  await signIn(page, "planning@larkfield.test");
  await page.getByRole("link", { name: "January 2027" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("January 2027");
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "period-page.png"), fullPage: true });
  await page.getByRole("button", { name: "Run preview: Captains" }).click();
  const bar = page.getByRole("progressbar", { name: "Award run progress" });
  await expect(bar).not.toHaveAttribute("aria-valuenow", "0", { timeout: 30_000 });
  await page.screenshot({ path: path.join(OUT, "run-progress.png") });
  await expect(bar).toHaveAttribute("aria-valuenow", "100", { timeout: 90_000 });
  await expect(page.getByRole("table", { name: "Lines by seniority" })).toBeVisible({ timeout: 15_000 });
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "run-finished.png"), fullPage: true });
  await page.setViewportSize({ width: 360, height: 780 });
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "run-finished-phone.png"), fullPage: true });
  // The preview's verdict on a crew member's own wishes (Ines submitted a bid in crew-pages.screens.ts).
  await page.context().clearCookies();
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.goto("/bid");
  await expect(page.getByRole("region", { name: "Preview of the award" })).toBeVisible();
  await page.screenshot({ path: path.join(OUT, "bid-preview-verdict.png") });
});
