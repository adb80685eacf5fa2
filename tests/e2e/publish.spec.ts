import fs from "node:fs";
import pg from "pg";
import { E2E_DATABASE_FILE } from "./constants.ts";
import { expect, signIn, test } from "./helpers.ts";

// Runs after the bid specs (it closes bidding): a scheduler runs both groups, publishes, and a captain sees their line.
test("a scheduler publishes the award and a crew member sees their line", async ({ page }) => {
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
  const form = page.getByRole("form", { name: "Publish" });
  // Without the review confirmed the browser refuses the form; with it, the award is published.
  await form.getByRole("checkbox").check();
  await form.getByRole("button", { name: "Publish award" }).click();
  await expect(form.getByRole("status")).toHaveText("January 2027 is published: crew now see their lines");
  await expect(page.getByText("State: published")).toBeVisible();
  await form.getByRole("checkbox").check();
  await form.getByRole("button", { name: "Publish correction" }).click();
  await expect(form.getByRole("status")).toHaveText("January 2027 is already published with these runs; nothing was changed");

  await page.context().clearCookies();
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  // The crew home shows the notices: closed early, then published.
  const notices = page.getByRole("region", { name: "Notices" });
  await expect(notices).toContainText("The award for January 2027 is published: see your line.");
  await expect(notices).toContainText("Bidding for January 2027 was closed early");
  await page.getByRole("link", { name: "My line" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("My line · January 2027");
  await expect(page.getByRole("listitem").first()).toContainText(/T\d+/);
  await expect(page.getByRole("note")).toContainText("not a certified compliance system");
});
