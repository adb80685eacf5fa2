import { expect, signIn, test } from "./helpers.ts";

test("a crew member signs in on a phone and sees the open period's trips in base local time", async ({ page }) => {
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await expect(page.getByRole("heading", { level: 1 })).toContainText("January 2027");
  const trips = page.getByRole("list", { name: "Trips" }).getByRole("listitem");
  await expect(trips).toHaveCount(36);
  await expect(page.getByText("Times are local to HLV (America/Denver).")).toBeVisible();
  // The deadline is shown in the base's zone: 20 Dec 18:00 MST.
  await expect(page.getByText(/bids close .*Dec 20, 18:00 MST/)).toBeVisible();
  const first = trips.first();
  await expect(first.getByText("Report")).toBeVisible();
  await expect(first.getByText("Credit")).toBeVisible();
  // Nothing overflows the phone's width.
  const width = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(width).toBeLessThanOrEqual(390);
});

test("a wrong password is refused with a message, and nothing is signed in", async ({ page }) => {
  await signIn(page, "ines@larkfield.test", "not-the-password");
  await expect(page.getByRole("alert").filter({ hasText: /\S/ })).toHaveText("That e-mail and password do not match an account.");
  await page.goto("/trips");
  await expect(page).toHaveURL(/\/sign-in$/);
});

test("a scheduler sees the bid period with its state", async ({ page }) => {
  await signIn(page, "planning@larkfield.test");
  await expect(page).toHaveURL(/\/planning$/);
  const row = page.locator('tr[data-period="January 2027"]');
  await expect(row).toContainText("HLV");
  await expect(row).toContainText("open");
  await expect(row).toContainText("36");
});

test("a crew member cannot open a planning page", async ({ page }) => {
  await signIn(page, "sam@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.goto("/planning");
  await expect(page).toHaveURL(/\/not-allowed$/);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("This page is not open to your account");
  await expect(page.getByText("Bid periods")).toHaveCount(0);
  // Nor the planning data behind the pages: a run's progress or a period's export.
  expect((await page.request.get("/api/runs/any")).status()).toBe(403);
  expect((await page.request.get("/api/periods/any/export")).status()).toBe(403);
});

test("signing out ends the session", async ({ page }) => {
  await signIn(page, "dev@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await page.goto("/trips");
  await expect(page).toHaveURL(/\/sign-in$/);
});
