/** Steps the planning specs and screens share: a time limit set behind the server's back, and a scheduler's way to a published award. */
import fs from "node:fs";
import pg from "pg";
import type { Page } from "@playwright/test";
import { E2E_DATABASE_FILE } from "./constants.ts";
import { expect, signIn } from "./helpers.ts";

/** Sets the award groups' time limit (seconds) in the test server's database, for `position` or every group. */
export async function setTimeLimit(seconds: number, position?: "captain" | "first_officer"): Promise<void> {
  const { url } = JSON.parse(fs.readFileSync(E2E_DATABASE_FILE, "utf8")) as { url: string };
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(
      `UPDATE "AwardGroup" SET settings = jsonb_set(settings::jsonb, '{timeLimitSeconds}', to_jsonb($1::int))${position ? ` WHERE position = $2` : ""}`,
      position ? [seconds, position] : [seconds],
    );
  } finally {
    await client.end();
  }
}

/**
 * As the scheduler: close the period's bidding early (confirmed), run the
 * award for both groups to 100 %, and end on the period page.
 */
export async function closeAndRunBothGroups(page: Page, period = "January 2027"): Promise<void> {
  await signIn(page, "planning@larkfield.test");
  await expect(page).toHaveURL(/\/planning$/);
  // Before the deadline (the server's clock starts on 1 December), closing is "close early", confirmed.
  await page.getByRole("link", { name: period }).click();
  const close = page.getByRole("form", { name: "Close bidding early" });
  await close.getByRole("checkbox").check();
  await close.getByRole("button", { name: "Close bidding early" }).click();
  await expect(page.getByText("State: closed")).toBeVisible();
  for (const group of ["Captains", "First officers"]) {
    await page.goto("/planning");
    await page.getByRole("link", { name: period }).click();
    await page.getByRole("button", { name: `Run award: ${group}` }).click();
    await expect(page.getByRole("progressbar", { name: "Award run progress" })).toHaveAttribute("aria-valuenow", "100", { timeout: 90_000 });
  }
  await page.goto("/planning");
  await page.getByRole("link", { name: period }).click();
}
