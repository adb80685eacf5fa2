import { bundleSchema } from "../../lib/domain/index.ts";
import { expect, signIn, test } from "./helpers.ts";
import { setTimeLimit } from "./planning-steps.ts";

// While bidding is open, a scheduler runs a preview for one group and watches the progress bar reach 100 %.
test("a scheduler runs a preview, watches its progress and sees the lines", async ({ page }) => {
  test.setTimeout(120_000);
  // A short time limit for the captains' group, so the run ends within the test.
  await setTimeLimit(8, "captain");
  await signIn(page, "planning@larkfield.test");
  await page.getByRole("link", { name: "January 2027" }).click();
  // The period exports as the engine's bundle: one instance per award group, as a download.
  const href = await page.getByRole("link", { name: "Export as JSON" }).getAttribute("href");
  const exported = await page.request.get(href!);
  expect(exported.headers()["content-disposition"]).toBe('attachment; filename="january-2027-hlv.json"');
  const bundle = bundleSchema.parse(await exported.json());
  expect(bundle.period.name).toBe("January 2027");
  expect(bundle.instances.map((i) => i.group.position).sort()).toEqual(["captain", "first_officer"]);
  await page.getByRole("button", { name: "Run preview: Captains" }).click();
  await expect(page).toHaveURL(/\/planning\/runs\//);
  const bar = page.getByRole("progressbar", { name: "Award run progress" });
  await expect(bar).toBeVisible();
  // The bar moves while the worker works, then reaches 100 % and the results appear.
  await expect(bar).toHaveAttribute("aria-valuenow", "100", { timeout: 90_000 });
  await expect(page.getByText("Finished", { exact: true })).toBeVisible();
  await expect(page.getByRole("table", { name: "Lines by seniority" })).toBeVisible({ timeout: 15_000 });
  await expect(page.getByRole("note")).toContainText("not a certified compliance system");
  const rows = page.getByRole("table", { name: "Lines by seniority" }).locator("tbody tr");
  await expect(rows).toHaveCount(6);
  // The review's charts: every crew member in the histogram's bars and as a dot of the scatter.
  await expect(page.getByRole("img", { name: "Histogram: crew members per satisfaction band" })).toBeVisible();
  await expect(page.getByRole("img", { name: "Scatter: satisfaction of each crew member by seniority place" }).locator("circle")).toHaveCount(6);
  await expect(page.getByText("Jain's index")).toBeVisible();
  // Coverage by day and the legality re-check (lib/rules on every line of the run's own instance).
  await expect(page.getByRole("grid", { name: "Open time by day of the period" }).getByRole("gridcell")).toHaveCount(31);
  await expect(page.getByRole("region", { name: "Legality" })).toContainText("6 of 6 lines pass the rule set's checks.");
  // The period page lists the run as finished.
  await page.getByRole("link", { name: "January 2027" }).click();
  await expect(page.getByRole("region", { name: "Captains" }).getByText("Finished")).toBeVisible();
  await expect(page.getByRole("region", { name: "Captains" }).getByText("Strict seniority · preview")).toBeVisible();
});
