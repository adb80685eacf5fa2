import path from "node:path";
import { expect, signIn, test } from "./helpers.ts";
import { closeAndRunBothGroups, setTimeLimit } from "./planning-steps.ts";

const OUT = path.resolve(import.meta.dirname, "../../docs/screens");

// Last of the screens (it closes bidding): the publish form on a laptop, the crew member's line on a phone.
test("screenshots of publishing and of a published line", async ({ page }) => {
  test.setTimeout(180_000);
  await setTimeLimit(6);
  await closeAndRunBothGroups(page);
  await page.setViewportSize({ width: 1280, height: 800 });
  const form = page.getByRole("form", { name: "Publish" });
  // Without the review confirmed the browser refuses the form; with it, the award is published.
  await form.getByRole("checkbox").check();
  await form.getByRole("button", { name: "Publish award" }).click();
  await expect(form.getByRole("status")).toHaveText("January 2027 is published: crew now see their lines");
  await expect(page.getByText("State: published")).toBeVisible();
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "period-published.png"), fullPage: true });
  const ledger = page.getByRole("region", { name: "Fairness carried forward" });
  await ledger.getByText("Show every crew member").click();
  await ledger.scrollIntoViewIfNeeded();
  await ledger.screenshot({ path: path.join(OUT, "fairness-ledger.png") });
  await form.getByRole("checkbox").check();
  await form.getByRole("button", { name: "Publish correction" }).click();
  await expect(form.getByRole("status")).toHaveText("January 2027 is already published with these runs; nothing was changed");

  // The captains have two finished runs by now (planning-pages.screens.ts ran one): compare them.
  await page.getByRole("region", { name: "Captains" }).getByRole("link", { name: "Compare with previous" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Compare runs");
  await page.screenshot({ path: path.join(OUT, "compare-runs.png"), fullPage: true });
  await page.context().clearCookies();
  await page.setViewportSize({ width: 360, height: 780 });
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.getByRole("link", { name: "My line" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("My line · January 2027");
  await expect(page.getByRole("listitem").first()).toContainText(/T\d+/);
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "my-line.png"), fullPage: true });
});
