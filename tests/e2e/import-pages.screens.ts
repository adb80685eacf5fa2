import path from "node:path";
import { expect, signIn, test } from "./helpers.ts";
import { monthFiles } from "./period-files.ts";

const OUT = path.resolve(import.meta.dirname, "../../docs/screens");

// A draft period for March 2027 (no crew sees it): the new-period form, the import page refusing a bad file, then importing.
test("screenshots of creating a period and importing its files", async ({ page }) => {
  test.setTimeout(90_000);
  const files = monthFiles("2027-02-01");
  await page.setViewportSize({ width: 1280, height: 800 });
  await signIn(page, "planning@larkfield.test");
  await page.getByRole("link", { name: "New period" }).click();
  const form = page.getByRole("form", { name: "New bid period" });
  await form.getByLabel("First day").fill("2027-03-01");
  await form.getByLabel("Last day").fill("2027-03-31");
  await page.screenshot({ path: path.join(OUT, "period-new.png"), fullPage: true });
  await form.getByRole("button", { name: "Create period" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Import trips and crew");

  const upload = page.getByRole("form", { name: "Import CSV files" });
  const legs = files["legs.csv"].buffer.toString().split("\n");
  legs[4] = legs[4]!.replace(/(,[A-Z]{3},[A-Z]{3},)\d{4}-\d\d-\d\dT/, "$12027-02-30T");
  legs[9] = legs[9]!.replace(/,([A-Z]{3}),([A-Z]{3}),/, ",$1,QQQ,");
  const trips = files["trips.csv"].buffer.toString().trimEnd().split("\n");
  await upload.getByLabel("trips.csv").setInputFiles({ ...files["trips.csv"], buffer: Buffer.from([...trips, trips[3]].join("\n") + "\n") });
  await upload.getByLabel("legs.csv").setInputFiles({ ...files["legs.csv"], buffer: Buffer.from(legs.join("\n")) });
  await upload.getByRole("button", { name: "Import files" }).click();
  await expect(upload.getByRole("alert")).toContainText("nothing was imported");
  await page.screenshot({ path: path.join(OUT, "import-refused.png"), fullPage: true });
  await page.setViewportSize({ width: 360, height: 780 });
  await page.screenshot({ path: path.join(OUT, "import-refused-phone.png"), fullPage: true });

  await page.setViewportSize({ width: 1280, height: 800 });
  for (const name of ["trips", "legs", "crew", "activities"] as const) await upload.getByLabel(`${name}.csv`).setInputFiles(files[`${name}.csv`]);
  await upload.getByRole("button", { name: "Import files" }).click();
  await expect(upload.getByRole("status")).toHaveText(/^Imported\./);
  await page.screenshot({ path: path.join(OUT, "import-done.png"), fullPage: true });
});
