import { expect, signIn, test } from "./helpers.ts";
import { monthFiles } from "./period-files.ts";

// A scheduler creates March 2027 (a draft no crew sees), gets a template, uploads a file with a bad time and
// sees the row named, then imports the good files, and again with nothing changed.
test("a scheduler creates a period and imports its CSV files, with bad rows named", async ({ page }) => {
  test.setTimeout(90_000);
  const files = monthFiles("2027-02-01");
  await signIn(page, "planning@larkfield.test");
  await page.getByRole("link", { name: "New period" }).click();
  let form = page.getByRole("form", { name: "New bid period" });
  // Dates the wrong way round: refused by field name, with what was typed still in the form.
  await form.getByLabel("First day").fill("2027-03-31");
  await form.getByLabel("Last day").fill("2027-03-01");
  await form.getByRole("button", { name: "Create period" }).click();
  await expect(form.getByRole("alert")).toHaveText("The new period was not created: Last day: the last day is before the first day.");
  form = page.getByRole("form", { name: "New bid period" });
  await expect(form.getByLabel("First day")).toHaveValue("2027-03-31");
  await expect(form.getByLabel("Last day")).toHaveValue("2027-03-01");
  await form.getByLabel("First day").fill("2027-03-01");
  await form.getByLabel("Last day").fill("2027-03-31");
  await form.getByRole("button", { name: "Create period" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Import trips and crew");
  await expect(page.getByRole("status").first()).toHaveText("March 2027 was created as a draft. Import its trips next.");
  await expect(page.getByLabel("What the period holds")).toContainText("0 trips");
  await expect(page.getByLabel("What the period holds")).toContainText("Captains, First officers");

  // The template is the header row the import reads.
  const template = await page.request.get("/api/import-templates/legs.csv");
  expect(template.headers()["content-type"]).toContain("text/csv");
  expect(await template.text()).toBe("trip,duty,report_utc,release_utc,leg,flight,from,to,departs_utc,arrives_utc,deadhead,block_minutes,equipment\n");

  // legs.csv with a departure on 30 February: the row is named and nothing is imported.
  const legs = files["legs.csv"].buffer.toString().split("\n");
  legs[4] = legs[4]!.replace(/(,[A-Z]{3},[A-Z]{3},)\d{4}-\d\d-\d\dT/, "$12027-02-30T");
  const upload = page.getByRole("form", { name: "Import CSV files" });
  await upload.getByLabel("trips.csv").setInputFiles(files["trips.csv"]);
  await upload.getByLabel("legs.csv").setInputFiles({ ...files["legs.csv"], buffer: Buffer.from(legs.join("\n")) });
  await upload.getByRole("button", { name: "Import files" }).click();
  await expect(upload.getByRole("alert")).toContainText("1 problem in the files; nothing was imported.");
  const problems = upload.getByRole("table", { name: "Problems in the files" });
  // On a phone the place stands above the problem.
  await expect(problems.getByRole("row").nth(1)).toContainText(/legs\.csv · line 5 · departs_utc"2027-02-30T[\d:]+Z" is not a UTC instant/);
  await expect(page.getByLabel("What the period holds")).toContainText("0 trips");

  await upload.getByLabel("legs.csv").setInputFiles(files["legs.csv"]);
  await upload.getByLabel("crew.csv").setInputFiles(files["crew.csv"]);
  await upload.getByLabel("activities.csv").setInputFiles(files["activities.csv"]);
  await upload.getByRole("button", { name: "Import files" }).click();
  await expect(upload.getByRole("status")).toHaveText(/^Imported\. trips: 36 added; crew: 12 unchanged; activities: 1 written for 1 crew, 11 crew unchanged/);
  await expect(page.getByLabel("What the period holds")).toContainText("36 trips");
  await upload.getByRole("button", { name: "Import files" }).click();
  await expect(upload.getByRole("status")).toHaveText("Nothing changed: the files match what the period holds already.");

  // Crew members may not import, nor fetch templates; only a table's own files are templates.
  const importUrl = new URL(page.url()).pathname.replace(/^\/planning\/periods\//, "/api/periods/");
  expect((await page.request.get("/api/import-templates/constructor")).status()).toBe(404);
  await page.context().clearCookies();
  await signIn(page, "ines@larkfield.test");
  await expect(page).toHaveURL(/\/trips$/);
  const asCrew = await page.request.post(importUrl, { multipart: { trips: files["trips.csv"], legs: files["legs.csv"] } });
  expect(asCrew.status()).toBe(403);
  expect(await asCrew.json()).toEqual({ error: "Imports are for schedulers." });
  expect((await page.request.post("/api/periods/import", { multipart: { file: { name: "p.json", mimeType: "application/json", buffer: Buffer.from("{}") } } })).status()).toBe(403);
  expect((await page.request.get("/api/import-templates/legs.csv")).status()).toBe(403);
});
