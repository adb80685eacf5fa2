import { expect, signIn, test } from "./helpers.ts";
import { closeAndRunBothGroups, setTimeLimit } from "./planning-steps.ts";

// Runs after the bid specs (it closes bidding): a scheduler runs both groups, publishes, and a captain sees their line.
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
