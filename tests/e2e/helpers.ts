import fs from "node:fs";
import { expect, test as base, type Page } from "@playwright/test";
import { CHROMIUM } from "./constants.ts";
import { DEMO_PASSWORD } from "../../seed/small-scenario.ts";

/** Every spec imports `test` from here: it skips cleanly where Chromium is missing (outside CI). */
export const test = base;
test.beforeEach(() => {
  test.skip(!fs.existsSync(CHROMIUM), `no Chromium at ${CHROMIUM}`);
});
export { expect };

/** Signs in through the real form, as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}
