// Figures, not assertions: the trip list with several hundred trips on a 360 px
// phone viewport, without and with Chromium's CPU throttling (4× slower, through
// the DevTools protocol, a rough stand-in for a mid-range phone). Each figure is
// the median of RUNS tries. Run with `npm run measure:trips`.
import type { Page } from "@playwright/test";
import { expect, signIn, test } from "./helpers.ts";

const RUNS = 7;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const ms = (x: number) => `${x.toFixed(0)} ms`;

/** Clicks `selector` inside the page and times until the trip count line changes (DOM) and until the frame after it (paint). */
async function timeClick(page: Page, selector: string): Promise<{ dom: number; frame: number }> {
  return page.evaluate(async (sel) => {
    const count = document.querySelector('[aria-live="polite"]')!;
    const before = count.textContent;
    const el = document.querySelector<HTMLElement>(sel)!;
    const t0 = performance.now();
    let dom = 0;
    const changed = new Promise<void>((resolve) => {
      const mo = new MutationObserver(() => {
        if (count.textContent !== before) {
          dom = performance.now() - t0;
          mo.disconnect();
          resolve();
        }
      });
      mo.observe(count, { childList: true, subtree: true, characterData: true });
    });
    el.click();
    await changed;
    await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)));
    return { dom, frame: performance.now() - t0 };
  }, selector);
}

/** Types `text` into the search box one key at a time; the time from each key to the frame after the list changed. */
async function timeTyping(page: Page, text: string): Promise<number[]> {
  const out: number[] = [];
  const box = page.getByPlaceholder("Trip or station");
  await box.fill("");
  await box.focus();
  for (const ch of text) {
    await page.evaluate(() => {
      (window as unknown as { __t0: number }).__t0 = performance.now();
    });
    await page.keyboard.type(ch);
    out.push(await page.evaluate(() => new Promise<number>((r) => requestAnimationFrame(() => setTimeout(() => r(performance.now() - (window as unknown as { __t0: number }).__t0), 0)))));
  }
  return out;
}

for (const throttle of [1, 4]) {
  test(`trip list with several hundred trips, CPU ${throttle}×`, async ({ page }) => {
    await signIn(page, "ines@larkfield.test");
    await expect(page).toHaveURL(/\/trips$/);
    const total = Number((await page.locator('[aria-live="polite"]').innerText()).match(/^(\d+) trips$/)![1]);
    const cdp = await page.context().newCDPSession(page);
    await cdp.send("Emulation.setCPUThrottlingRate", { rate: throttle });

    // Opening the list, timed inside the page from navigation start: every card
    // in the DOM (a mutation observer from the first byte), then the search box
    // answering a key (tried every frame until the count changes: hydrated).
    await page.addInitScript((n) => {
      const w = window as unknown as { __cards?: number; __ready?: number };
      const mo = new MutationObserver(() => {
        if (w.__cards === undefined && document.querySelectorAll("[data-trip]").length >= Math.min(n, 20)) {
          w.__cards = performance.now();
          mo.disconnect();
        }
      });
      mo.observe(document, { childList: true, subtree: true });
      // The value changes on every try: React ignores an input event whose value it has already seen.
      let tries = 0;
      const tryKey = () => {
        const box = document.querySelector<HTMLInputElement>('input[type="search"]');
        const count = document.querySelector('[aria-live="polite"]');
        if (box && count && w.__cards !== undefined) {
          if (count.textContent?.includes(" of ")) {
            w.__ready = performance.now();
            return;
          }
          Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, "value")!.set!.call(box, tries++ % 2 ? "T10" : "T1");
          box.dispatchEvent(new Event("input", { bubbles: true }));
        }
        requestAnimationFrame(tryKey);
      };
      requestAnimationFrame(tryKey);
    }, total);
    const shown: number[] = [];
    const ready: number[] = [];
    let htmlBytes = 0;
    for (let k = 0; k < RUNS; k++) {
      const response = await page.goto("/trips");
      htmlBytes = (await response!.body()).length;
      await page.waitForFunction(() => (window as unknown as { __ready?: number }).__ready !== undefined, null, { timeout: 60_000 });
      shown.push(await page.evaluate(() => (window as unknown as { __cards: number }).__cards));
      ready.push(await page.evaluate(() => (window as unknown as { __ready: number }).__ready));
    }

    // Filtering: a length chip on and off, a select, then typing a station.
    await page.getByPlaceholder("Trip or station").fill("");
    await page.locator("summary", { hasText: "Filters" }).click();
    const chip = 'button[aria-pressed]:nth-of-type(3)'; // "3 days"
    const chipOn: number[] = [];
    const chipOff: number[] = [];
    for (let k = 0; k < RUNS; k++) {
      chipOn.push((await timeClick(page, chip)).frame);
      chipOff.push((await timeClick(page, chip)).frame);
    }
    const keys: number[] = [];
    for (let k = 0; k < 3; k++) keys.push(...(await timeTyping(page, "PLM")));
    const after = await page.locator('[aria-live="polite"]').innerText();
    // The next cards: "Show more trips" tapped until every trip is on the page.
    await page.getByPlaceholder("Trip or station").fill("");
    await page.locator("summary", { hasText: "Filters" }).click();
    const step: number[] = [];
    while ((await page.getByRole("button", { name: /^Show more trips/ }).count()) > 0) {
      step.push(
        await page.evaluate(async () => {
          const button = [...document.querySelectorAll("button")].find((b) => b.textContent?.startsWith("Show more trips"))!;
          const t0 = performance.now();
          button.click();
          await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)));
          return performance.now() - t0;
        }),
      );
    }
    const allCards = await page.locator("[data-trip]").count();
    await cdp.send("Emulation.setCPUThrottlingRate", { rate: 1 });

    const lines = [
      `trip list at 360 px, ${total} trips, CPU ${throttle}× (median of ${RUNS})`,
      `  page HTML (with the trips' data): ${(htmlBytes / 1024).toFixed(0)} KiB`,
      `  navigation to the first 20 cards in the DOM: ${ms(median(shown))}`,
      `  navigation to the search box filtering (hydrated): ${ms(median(ready))}`,
      `  "3 days" chip on, click to next frame: ${ms(median(chipOn))}; off: ${ms(median(chipOff))}`,
      `  search, key to next frame (9 keys): median ${ms(median(keys))}, worst ${ms(Math.max(...keys))}; last count "${after}"`,
      `  "Show more trips", tap to next frame: median ${ms(median(step))} over ${step.length} taps, ${allCards} cards in the end`,
    ];
    console.log(lines.join("\n"));
    expect(total).toBeGreaterThan(300); // the figures are about a big month, not the tests' small one
  });
}
