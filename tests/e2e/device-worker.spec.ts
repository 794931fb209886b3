/**
 * The device host in its worker: the bench's first screen draws today's list from what the worker sends (the page
 * itself loads no database code), a change recorded in the page shows on the list, and a browser whose worker cannot
 * start runs the same host in the page.
 */
import { expect, test, type Page, type Response } from "@playwright/test";
import { DEMO, signInAs } from "./pages/sign-in";
import { BenchSyncPage } from "./pages/bench-sync";

const cards = (page: Page) => page.getByTestId("today-card");

/** Bodies of the scripts the page itself (not a worker) loads. */
function pageScripts(page: Page): Promise<string>[] {
  const bodies: Promise<string>[] = [];
  page.on("response", (res: Response) => {
    if (res.request().resourceType() === "script" && !/benchwright-device/.test(res.url())) bodies.push(res.text().catch(() => ""));
  });
  return bodies;
}

test("today's list comes from the device worker; the page loads no database code; a change made in the page shows", async ({ page, context }) => {
  await signInAs(page, DEMO.tech);
  const workers: string[] = [];
  page.on("worker", (w) => workers.push(w.url()));
  const scripts = pageScripts(page);
  await page.goto("/bench");
  const sync = new BenchSyncPage(page);
  await sync.waitSynced();
  await expect(cards(page).first()).toBeVisible();
  expect(workers.some((u) => /\/_next\/static\/chunks\/benchwright-device\.[0-9a-f]+\.js$/.test(u))).toBe(true);
  // Dexie's own error class name is in its code, minified or not.
  const bodies = await Promise.all(scripts);
  expect(bodies.length).toBeGreaterThan(3);
  expect(bodies.filter((b) => b.includes("DexieError"))).toHaveLength(0);

  // The test hooks record in the page (as the ticket screen does); the worker sees the write and sends the list again.
  await page.evaluate(() => localStorage.setItem("benchwright.testHooks", "1"));
  await page.reload();
  await page.waitForFunction(() => Boolean((window as unknown as { __benchwrightSync?: unknown }).__benchwrightSync));
  const number = Number(await cards(page).first().getAttribute("data-ticket-number"));
  await context.setOffline(true);
  await sync.addNote(number, "Chain catcher missing.");
  await expect(cards(page).filter({ hasText: `#${number}` }).getByTestId("not-synced")).toHaveText("1 change not synced");
  await context.setOffline(false);
  await expect(cards(page).getByTestId("not-synced")).toHaveCount(0, { timeout: 20_000 });
});

test("where the worker cannot start, the same host runs in the page and the list still comes", async ({ page, context }) => {
  await context.addInitScript(() => localStorage.setItem("benchwright.deviceInPage", "1"));
  await signInAs(page, DEMO.tech2);
  const workers: string[] = [];
  page.on("worker", (w) => workers.push(w.url()));
  await page.goto("/bench");
  await new BenchSyncPage(page).waitSynced();
  await expect(cards(page).first()).toBeVisible();
  expect(workers.filter((u) => /benchwright-device/.test(u))).toEqual([]);
});
