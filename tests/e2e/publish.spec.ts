import { expect, signIn, test } from "./helpers.ts";
import { closeAndRunBothGroups, setTimeLimit } from "./planning-steps.ts";
import { monthFiles } from "./period-files.ts";

// Runs after the bid specs (it closes bidding), in order: January is published, then February goes round the whole cycle.
test.describe.configure({ mode: "serial" });

// A scheduler runs both groups, publishes, and a captain sees their line.
test("a scheduler publishes the award and a crew member sees their line", async ({ page }) => {
  test.setTimeout(180_000);
  await setTimeLimit(6);
  await closeAndRunBothGroups(page);
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

// The next month from the start, after January is published: a scheduler creates February, imports its files
// (the generator's CSV for the same crew), opens bidding; a captain bids; the scheduler closes, runs the award,
// watches it reach 100 %, reviews the charts and publishes; the captain sees February's line.
test("the next month end to end: create, import, open, bid, close, run, review, publish, and the crew member's line", async ({ page }) => {
  test.setTimeout(240_000);
  const files = monthFiles("2027-01-01");
  await signIn(page, "planning@larkfield.test");
  await page.getByRole("link", { name: "New period" }).click();
  const create = page.getByRole("form", { name: "New bid period" });
  await create.getByLabel("First day").fill("2027-02-01");
  await create.getByLabel("Last day").fill("2027-02-28");
  await create.getByRole("button", { name: "Create period" }).click();
  const upload = page.getByRole("form", { name: "Import CSV files" });
  for (const name of ["trips", "legs", "crew", "activities"] as const) await upload.getByLabel(`${name}.csv`).setInputFiles(files[`${name}.csv`]);
  await upload.getByRole("button", { name: "Import files" }).click();
  await expect(upload.getByRole("status")).toHaveText(/^Imported\. trips: 36 added; crew: 12 unchanged/);
  await page.getByRole("link", { name: "Back to February 2027" }).click();
  const open = page.getByRole("form", { name: "Open bidding" });
  await open.getByRole("checkbox").check();
  await open.getByRole("button", { name: "Open bidding" }).click();
  await expect(page.getByText("State: open")).toBeVisible();

  // A captain bids for a trip of February and submits.
  await page.context().clearCookies();
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  await expect(page.getByRole("region", { name: "Notices" })).toContainText("Bidding for February 2027 is open");
  const trip = page.getByRole("list", { name: "Trips" }).getByRole("listitem").first();
  await trip.getByRole("link").click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(/^Trip T\d+$/);
  const code = (await page.getByRole("heading", { level: 1 }).innerText()).replace("Trip ", "");
  await page.getByRole("button", { name: "Add to my bid" }).click();
  await page.goto("/bid");
  await expect(page.locator("[data-wish] [data-sentence]").first()).toContainText(code);
  await page.getByRole("button", { name: "Submit bid" }).click();
  await expect(page.getByRole("status", { name: "Receipt" })).toContainText("Submitted: version 1");

  // The scheduler closes early, runs both groups and reviews a run.
  await page.context().clearCookies();
  await setTimeLimit(6);
  await closeAndRunBothGroups(page, "February 2027");
  await page.getByRole("region", { name: "First officers" }).getByRole("link", { name: "Open" }).first().click();
  await expect(page.getByRole("img", { name: "Histogram: crew members per satisfaction band" })).toBeVisible({ timeout: 15_000 });
  await expect(page.getByRole("img", { name: "Scatter: satisfaction of each crew member by seniority place" }).locator("circle")).toHaveCount(6);
  await expect(page.getByRole("grid", { name: "Open time by day of the period" }).getByRole("gridcell")).toHaveCount(28);
  await expect(page.getByRole("region", { name: "Legality" })).toContainText("of 6 lines pass the rule set's checks.");
  await page.goto("/planning");
  await page.getByRole("link", { name: "February 2027" }).click();
  const publish = page.getByRole("form", { name: "Publish" });
  await publish.getByRole("checkbox").check();
  await publish.getByRole("button", { name: "Publish award" }).click();
  await expect(publish.getByRole("status")).toHaveText("February 2027 is published: crew now see their lines");
  await expect(page.getByRole("region", { name: "Fairness carried forward" })).toContainText("Fairness carried into the next period");

  await page.context().clearCookies();
  await signIn(page, "ines@larkfield.test");
  await page.getByRole("link", { name: "My line" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("My line · February 2027");
  await expect(page.getByRole("listitem").first()).toContainText(/T\d+/);
});
