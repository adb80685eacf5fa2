import path from "node:path";
import { expect, signIn, test } from "./helpers.ts";

const OUT = path.resolve(import.meta.dirname, "../../docs/screens");

test("phone screenshots of the trip list, a trip page and the bid page", async ({ page }) => {
  test.setTimeout(60_000);
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.screenshot({ path: path.join(OUT, "trip-list.png") });
  await page.locator("summary", { hasText: "Filters" }).click();
  await page.getByRole("button", { name: "3 days" }).click();
  await page.screenshot({ path: path.join(OUT, "trip-list-filters.png"), fullPage: true });

  await page.goto("/trips/T112");
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Trip T112");
  await page.screenshot({ path: path.join(OUT, "trip-page.png") });
  await page.screenshot({ path: path.join(OUT, "trip-page-full.png"), fullPage: true });
  await page.getByRole("button", { name: "Add to my bid" }).click();
  await expect(page).toHaveURL(/\/bid/);

  const add = async (kind: string, fill: () => Promise<void>) => {
    await page.getByRole("button", { name: "Add a wish" }).click();
    await page.getByRole("button", { name: kind }).click();
    await fill();
    await page.getByRole("button", { name: "Add wish" }).click();
  };
  await add("Days to keep free", async () => {
    await page.getByLabel("First day").fill("2027-01-24");
    await page.getByLabel("Last day").fill("2027-01-26");
  });
  await add("Trips to avoid", () => page.getByLabel("Report before").fill("06:00"));
  await add("Credit range", async () => {
    await page.getByLabel("At least (hours)").fill("70");
    await page.getByLabel("At most (hours)").fill("80");
  });
  await expect(page.locator('[data-save-status="saved"]')).toContainText("Draft saved");
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "bid-page.png") });
  await page.getByRole("button", { name: "Submit bid" }).click();
  await expect(page.getByRole("status", { name: "Receipt" })).toBeVisible();
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(OUT, "bid-receipt.png") });

  await page.getByRole("button", { name: "Add a wish" }).click();
  await page.getByRole("button", { name: "Trips I want" }).click();
  await page.getByLabel("Days, at least").fill("4");
  await page.getByLabel("Days, at most").fill("2");
  await page.getByRole("button", { name: "Add wish" }).click();
  await page.screenshot({ path: path.join(OUT, "wish-form-error.png"), fullPage: true });
});
