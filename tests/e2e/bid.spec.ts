import fs from "node:fs";
import AxeBuilder from "@axe-core/playwright";
import pg from "pg";
import type { Locator, Page } from "@playwright/test";
import { E2E_DATABASE_FILE } from "./constants.ts";
import { expect, signIn, test } from "./helpers.ts";

// The tests share one seeded database and run in this order.
test.describe.configure({ mode: "serial" });

/** No serious or critical violations, by axe-core (npm @axe-core/playwright) against WCAG 2 A/AA rules. */
async function expectAccessible(page: Page) {
  const result = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  const bad = result.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
}

const sentences = (page: Page) => page.locator("[data-wish] [data-sentence]").allInnerTexts();
const saved = (page: Page) => expect(page.locator('[data-save-status="saved"]')).toContainText("Draft saved");

async function addWish(page: Page, kind: string, fill: () => Promise<void>) {
  await page.getByRole("button", { name: "Add a wish" }).click();
  await page.getByRole("button", { name: kind }).click();
  await fill();
  await page.getByRole("button", { name: "Add wish" }).click();
}

/** A touch drag from the middle of one element to another, through the DevTools protocol (Playwright has no touch-move). */
async function touchDrag(page: Page, from: Locator, to: Locator) {
  const a = (await from.boundingBox())!;
  const b = (await to.boundingBox())!;
  const cdp = await page.context().newCDPSession(page);
  const x = a.x + a.width / 2;
  const y0 = a.y + a.height / 2;
  const y1 = b.y + b.height / 2 - 8;
  await cdp.send("Input.dispatchTouchEvent", { type: "touchStart", touchPoints: [{ x, y: y0 }] });
  await page.waitForTimeout(250); // past the touch sensor's hold delay
  for (let k = 1; k <= 12; k++) {
    await cdp.send("Input.dispatchTouchEvent", { type: "touchMove", touchPoints: [{ x, y: y0 + ((y1 - y0) * k) / 12 }] });
    await page.waitForTimeout(16);
  }
  await cdp.send("Input.dispatchTouchEvent", { type: "touchEnd", touchPoints: [] });
  await cdp.detach();
}

let versionUrl = "";

test("a captain filters trips, adds one from its page, builds a wish of every kind, reorders by touch and keyboard, submits, and gets version 2 after an edit", async ({ page }) => {
  test.setTimeout(90_000);
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  const trips = page.getByRole("list", { name: "Trips" }).getByRole("listitem");
  await expect(trips).toHaveCount(36);
  await expectAccessible(page);
  // Filters: only 3-day trips, then a search by trip number.
  await page.locator("summary", { hasText: "Filters" }).click();
  await page.getByRole("button", { name: "3 days" }).click();
  const threeDay = await trips.count();
  expect(threeDay).toBeGreaterThan(0);
  expect(threeDay).toBeLessThan(36);
  for (const text of await trips.allTextContents()) expect(text).toContain("3 days");
  // Hours that are not a number are named at their field.
  await page.getByLabel("Credit from (h)").fill("lots");
  await expect(page.getByText("Enter hours as a number, such as 5 or 5.5")).toBeVisible();
  await expect(page.getByLabel("Credit from (h)")).toHaveAttribute("aria-invalid", "true");
  await page.getByLabel("Credit from (h)").fill("");
  // Lengths that are not next to each other make no one wish: said, and the button is off.
  const fromFilters = page.getByRole("region", { name: "Make a wish from these filters" });
  await page.getByRole("button", { name: "1 day" }).click();
  await expect(fromFilters).toContainText("A trip wish takes lengths next to each other");
  await expect(fromFilters.getByRole("button", { name: "Use these filters as a trip wish" })).toBeDisabled();
  await page.getByRole("button", { name: "1 day" }).click();
  // 3-day trips without red-eyes, as a trip wish: the list's count and the wish's trips are the same filter.
  await page.getByLabel("Red-eye").selectOption("no");
  await expect(fromFilters.locator("[data-wish-preview]")).toHaveText("Give me trips of 3 days, without red-eyes");
  await expectAccessible(page);
  await fromFilters.getByRole("button", { name: "Use these filters as a trip wish" }).click();
  await expect(page).toHaveURL(/\/bid\?wish=1$/);
  await expect(page.getByText("Your trip filters became wish 1")).toBeVisible();
  expect(await sentences(page)).toEqual(["Give me trips of 3 days, without red-eyes"]);

  await page.goto("/trips");
  await page.getByPlaceholder("Trip or station").fill("T104");
  await expect(trips).toHaveCount(1);

  await trips.first().getByRole("link").click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Trip T104");
  await expect(page.getByRole("list", { name: "Duty periods" }).getByRole("listitem").first()).toContainText("Report");
  expect(await page.locator("[data-on]").count()).toBeGreaterThan(0);
  await expectAccessible(page);
  await page.getByRole("button", { name: "Add to my bid" }).click();
  await expect(page).toHaveURL(/\/bid\?added=T104$/);
  await expect(page.locator("[data-wish]")).toHaveCount(2);
  expect(await sentences(page)).toEqual(["Give me trips of 3 days, without red-eyes", "Give me trip T104"]);

  await addWish(page, "Trips to avoid", () => page.getByLabel("Report before").fill("06:00"));
  // A trip number or a day outside the period is named at its field before anything is saved.
  await page.getByRole("button", { name: "Add a wish" }).click();
  await page.getByRole("button", { name: "Trips to avoid" }).click();
  await page.getByLabel("Trip numbers").fill("T999");
  await page.getByRole("button", { name: "Add wish" }).click();
  await expect(page.getByText("There is no trip T999 in January 2027")).toBeVisible();
  await expect(page.getByLabel("Trip numbers")).toHaveAttribute("aria-invalid", "true");
  await page.getByRole("button", { name: "Cancel" }).click();
  await addWish(page, "Days to keep free", async () => {
    await page.getByLabel("First day").fill("2027-01-24");
    await page.getByLabel("Last day").fill("2027-02-02");
    await page.getByRole("button", { name: "Add wish" }).click();
    await expect(page.getByText("Choose days of January 2027 (2027-01-01 to 2027-01-31)")).toBeVisible();
    await page.getByLabel("Last day").fill("2027-01-26");
  });
  await addWish(page, "Work pattern", async () => {
    await page.getByLabel("At most this many days on in a row").fill("4");
    await page.getByLabel("Keep weekends free").check();
  });
  // A bad field is named where it is: the form stays open with the message under "At most (hours)".
  await page.getByRole("button", { name: "Add a wish" }).click();
  await page.getByRole("button", { name: "Credit range" }).click();
  await page.getByLabel("At least (hours)").fill("80");
  await page.getByLabel("At most (hours)").fill("70");
  await page.getByRole("button", { name: "Add wish" }).click();
  await expect(page.getByText("The credit minimum is above the maximum")).toBeVisible();
  await expect(page.getByLabel("At most (hours)")).toHaveAttribute("aria-invalid", "true");
  await page.getByLabel("At least (hours)").fill("70");
  await page.getByLabel("At most (hours)").fill("80");
  await page.getByRole("button", { name: "Add wish" }).click();
  await addWish(page, "Fly with a colleague", () => page.getByLabel("Colleague's employee number").fill("4114"));
  await saved(page);
  expect(await sentences(page)).toEqual([
    "Give me trips of 3 days, without red-eyes",
    "Give me trip T104",
    "Keep me off trips reporting before 06:00",
    "Keep 24–26 Jan free",
    "At most 4 days on in a row, and weekends free",
    "Credit between 70 and 80 h",
    "Fly the same trips as employee 4114",
  ]);
  await expectAccessible(page);

  // Touch: drag wish 4 onto place 1 (both on screen: wish 1 just under the page header).
  await page.locator('[data-wish="1"]').evaluate((el) => window.scrollTo(0, el.getBoundingClientRect().top + window.scrollY - 80));
  await touchDrag(page, page.locator('[data-wish="4"] [data-handle]'), page.locator('[data-wish="1"]'));
  await expect.poll(() => sentences(page)).toEqual([
    "Keep 24–26 Jan free",
    "Give me trips of 3 days, without red-eyes",
    "Give me trip T104",
    "Keep me off trips reporting before 06:00",
    "At most 4 days on in a row, and weekends free",
    "Credit between 70 and 80 h",
    "Fly the same trips as employee 4114",
  ]);
  // Keyboard: pick up wish 1 with space, one place down, drop with space.
  await page.getByRole("button", { name: "Move wish 1", exact: true }).focus();
  await page.keyboard.press("Space");
  await page.waitForTimeout(150);
  await page.keyboard.press("ArrowDown");
  await page.waitForTimeout(150);
  await page.keyboard.press("Space");
  await expect.poll(async () => (await sentences(page)).slice(0, 2)).toEqual(["Give me trips of 3 days, without red-eyes", "Keep 24–26 Jan free"]);
  // The button alternative.
  await page.getByRole("button", { name: "Move wish 7 up" }).click();
  await expect.poll(async () => (await sentences(page)).slice(5)).toEqual(["Fly the same trips as employee 4114", "Credit between 70 and 80 h"]);
  await saved(page);
  const order = await sentences(page);

  await page.getByRole("button", { name: "Submit bid" }).click();
  const receipt = page.getByRole("status", { name: "Receipt" });
  await expect(receipt).toContainText("Submitted: version 1");
  await expect(receipt.locator("[data-receipt-code]")).toHaveText(/^[0-9A-F]{4}-[0-9A-F]{4}-[0-9A-F]{4}$/);
  await expect(receipt.locator("[data-receipt-hash]")).toHaveText(/^[0-9a-f]{64}$/);
  const code1 = await receipt.locator("[data-receipt-code]").innerText();

  await page.reload();
  expect(await sentences(page)).toEqual(order);
  await expect(page.locator('[data-version-row="1"]')).toContainText(code1);

  // Editing after submission makes version 2; version 1 stays as it was.
  await page.getByRole("button", { name: "Remove wish 7" }).click();
  await saved(page);
  await expect(page.locator("[data-unsubmitted]")).toHaveText("You have changes since version 1. Until you submit them, version 1 is the bid that counts.");
  await page.getByRole("button", { name: "Submit changes" }).click();
  await expect(receipt).toContainText("Submitted: version 2");
  await expect(page.locator("[data-unsubmitted]")).toHaveCount(0);
  await expect(receipt.locator("[data-receipt-code]")).not.toHaveText(code1);
  versionUrl = (await page.locator('[data-version-row="1"]').getAttribute("href"))!;
  await page.goto(versionUrl);
  await expect(page.getByRole("list", { name: "Wishes of this version" }).getByRole("listitem")).toHaveCount(7);
});

test("a second device editing the same bid sees a conflict with both versions, and nothing is overwritten", async ({ browser }) => {
  const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  const laptop = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  try {
    const a = await phone.newPage();
    const b = await laptop.newPage();
    for (const p of [a, b]) {
      await signIn(p, "dev@larkfield.test");
      await expect(p).toHaveURL(/\/trips$/);
      await p.goto("/bid");
    }
    await addWish(a, "Work pattern", () => a.getByLabel("Keep weekends free").check());
    await saved(a);
    await addWish(b, "Credit range", () => b.getByLabel("At least (hours)").fill("75"));
    const conflict = b.getByRole("alert", { name: "Changed on another device" });
    await expect(conflict).toBeVisible();
    await expect(conflict.locator('[data-version="theirs"]')).toContainText("Weekends free");
    await expect(conflict.locator('[data-version="mine"]')).toContainText("Credit of at least 75 h");
    await conflict.getByRole("button", { name: "Keep this device's version" }).click();
    await saved(b);
    await a.reload();
    expect(await sentences(a)).toEqual(["Credit of at least 75 h"]);
  } finally {
    await phone.close();
    await laptop.close();
  }
});

test("changes made offline are kept on the phone and reach the server when it is back, on the same page or on the next load", async ({ page, context }) => {
  test.setTimeout(60_000);
  const status = page.locator("[data-save-status]");
  // "Nothing saved yet." is revision 0.
  const revisionOf = async (p: Page) => Number((await p.locator('[data-save-status="saved"]').innerText()).match(/revision (\d+)/)?.[1] ?? 0);
  await signIn(page, "dev@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.goto("/bid");
  await expect(status).toHaveAttribute("data-save-status", "saved");
  const before = await sentences(page);
  const rev = await revisionOf(page);

  // Same page: offline, a wish, then the connection comes back.
  await context.setOffline(true);
  await addWish(page, "Trips to avoid", () => page.getByLabel("Report before").fill("07:00"));
  await expect(status).toHaveAttribute("data-save-status", "offline");
  await expect(status).toHaveText("No connection: your changes are kept on this phone and will be saved when it is back.");
  const first = [...before, "Keep me off trips reporting before 07:00"];
  expect(await sentences(page)).toEqual(first);
  await context.setOffline(false);
  await saved(page);
  expect(await revisionOf(page)).toBe(rev + 1);
  // Past the editor's 5 s retry of the failed save: the save made on reconnecting was the only one.
  await page.waitForTimeout(5_500);
  await expect(status).toHaveAttribute("data-save-status", "saved");
  expect(await revisionOf(page)).toBe(rev + 1);
  await page.reload();
  expect(await sentences(page)).toEqual(first);
  expect(await revisionOf(page)).toBe(rev + 1);

  // Next load: offline, a wish, the page closed; a new page online restores the copy and saves it.
  await context.setOffline(true);
  await addWish(page, "Work pattern", () => page.getByLabel("At most this many days on in a row").fill("5"));
  await expect(status).toHaveAttribute("data-save-status", "offline");
  await page.close();
  await context.setOffline(false);
  const next = await context.newPage();
  await next.goto("/bid");
  const second = [...first, "At most 5 days on in a row"];
  await expect(next.getByRole("status").filter({ hasText: "kept on this phone" })).toHaveText("Changes kept on this phone while it was offline are being saved now.");
  await saved(next);
  expect(await revisionOf(next)).toBe(rev + 2);
  expect(await next.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith("bidwright:draft:")))).toEqual([]);
  await next.reload();
  expect(await sentences(next)).toEqual(second);
  expect(await revisionOf(next)).toBe(rev + 2);
  await expect(next.getByRole("status").filter({ hasText: "kept on this phone" })).toHaveCount(0);
});

test("another crew member's bid is not reachable by its address", async ({ page }) => {
  expect(versionUrl).toMatch(/^\/bid\/versions\//);
  await signIn(page, "sam@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  const response = await page.goto(versionUrl);
  expect(response?.status()).toBe(404);
  await expect(page.getByText("Fly the same trips as employee 4114")).toHaveCount(0);
});

test("a crew member starts from last period's bid: what carries over is copied and saved, what belonged to that month is named", async ({ page }) => {
  await signIn(page, "sam@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.goto("/bid");
  await expect(page.locator("[data-wish]")).toHaveCount(0);
  await page.getByRole("button", { name: "Start from my December 2026 bid" }).click();
  // seed/past-period.ts: six wishes; the free days and the named trip belonged to December.
  await expect(page.getByRole("status").filter({ hasText: "Copied 4 wishes" })).toHaveText(
    "Copied 4 wishes from last period. Left out: wish 2: free days named last period's dates; wish 5: it named last period's trips (T105).",
  );
  const copied = ["At least 2 of: trips of 3–4 days, without red-eyes", "Keep me off trips reporting before 06:00", "At most 4 days on in a row", "Credit between 72 and 84 h"];
  expect(await sentences(page)).toEqual(copied);
  await saved(page);
  await page.reload();
  expect(await sentences(page)).toEqual(copied);
  await expect(page.getByRole("button", { name: "Start from my December 2026 bid" })).toHaveCount(0);
});

test("a submission after the deadline is refused with a clear message", async ({ page }) => {
  const { url } = JSON.parse(fs.readFileSync(E2E_DATABASE_FILE, "utf8")) as { url: string };
  await signIn(page, "sam@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await page.goto("/bid");
  await addWish(page, "Work pattern", () => page.getByLabel("At most this many days on in a row").fill("5"));
  await saved(page);
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const { rows } = await client.query<{ deadline: Date }>(`SELECT deadline FROM "BidPeriod" WHERE name = 'January 2027'`);
  try {
    // The deadline passes while the page is open (the server's clock started at 1 Dec 2026).
    await client.query(`UPDATE "BidPeriod" SET deadline = '2026-11-30T01:00:00Z' WHERE name = 'January 2027'`);
    await page.getByRole("button", { name: "Submit bid" }).click();
    await expect(page.locator('[data-save-status="refused"]')).toHaveText(
      "Bidding for January 2027 closed at Sun, Nov 29, 18:00 MST; your bid was not changed.",
    );
    await expect(page.getByRole("status", { name: "Receipt" })).toHaveCount(0);
  } finally {
    await client.query(`UPDATE "BidPeriod" SET deadline = $1 WHERE name = 'January 2027'`, [rows[0]!.deadline]);
    await client.end();
  }
});
