import fs from "node:fs";
import pg from "pg";
import { E2E_DATABASE_FILE } from "./constants.ts";
import path from "node:path";
import { expect, signIn, test } from "./helpers.ts";

const OUT = path.resolve(import.meta.dirname, "../../docs/screens");

// Last of the screens (it closes bidding): the publish form on a laptop, the crew member's line on a phone.
test("screenshots of publishing and of a published line", async ({ page }) => {
  test.setTimeout(180_000);
  const { url } = JSON.parse(fs.readFileSync(E2E_DATABASE_FILE, "utf8")) as { url: string };
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(`UPDATE "AwardGroup" SET settings = jsonb_set(settings::jsonb, '{timeLimitSeconds}', '6')`);
  } finally {
    await client.end();
  }
  await signIn(page, "planning@larkfield.test");
  await expect(page).toHaveURL(/\/planning$/);
  // Before the deadline (the server's clock starts on 1 December), closing is "close early", confirmed.
  await page.getByRole("link", { name: "January 2027" }).click();
  const close = page.getByRole("form", { name: "Close bidding early" });
  await close.getByRole("checkbox").check();
  await close.getByRole("button", { name: "Close bidding early" }).click();
  await expect(page.getByText("State: closed")).toBeVisible();
  for (const group of ["Captains", "First officers"]) {
    await page.goto("/planning");
    await page.getByRole("link", { name: "January 2027" }).click();
    await page.getByRole("button", { name: `Run award: ${group}` }).click();
    await expect(page.getByRole("progressbar", { name: "Award run progress" })).toHaveAttribute("aria-valuenow", "100", { timeout: 90_000 });
  }
  await page.goto("/planning");
  await page.getByRole("link", { name: "January 2027" }).click();
  await page.setViewportSize({ width: 1280, height: 800 });
  const form = page.getByRole("form", { name: "Publish" });
  // Without the review confirmed the browser refuses the form; with it, the award is published.
  await form.getByRole("checkbox").check();
  await form.getByRole("button", { name: "Publish award" }).click();
  await expect(form.getByRole("status")).toHaveText("January 2027 is published: crew now see their lines");
  await expect(page.getByText("State: published")).toBeVisible();
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "period-published.png"), fullPage: true });
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
