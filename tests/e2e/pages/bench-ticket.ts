import path from "node:path";
import { expect, type BrowserContext, type Page } from "@playwright/test";
import { demoChainSaw } from "../../fixtures/printed-tag";
import { DEMO, signInAs } from "./sign-in";
import { deviceTickets, goOffline, waitForServiceWorker } from "./pwa";

/** Where the e2e server keeps its demo shop (playwright.config.ts sets DATA_DIR to this). */
export const E2E_DATA_DIR = path.resolve("tests/.tmp/e2e-data");

/** One step of the bench sheet on /bench/ticket. */
export const step = (page: Page, id: string) => page.locator(`[data-step="${id}"]`);

/** Taps a chip answer and waits until the step shows it as recorded. */
export async function pick(page: Page, stepId: string, answer: string) {
  await step(page, stepId).getByRole("radio", { name: answer, exact: true }).click();
  await expect(page.getByTestId(`saved-${stepId}`)).toContainText(answer);
}

/**
 * Greasy hands: every button, photo button and bottom-bar link on the sheet is at least 56 px tall (WCAG 2.5.5
 * asks 44). Returns how many targets were measured; at least `atLeast` must be, so an empty match cannot pass.
 */
export async function expectBigTargets(page: Page, atLeast = 20): Promise<number> {
  const boxes = await page.locator("main button, main label[for]:has(svg), nav a").evaluateAll((els) =>
    els
      .map((e) => ({ text: (e.getAttribute("aria-label") ?? e.textContent ?? "").trim().slice(0, 40), h: e.getBoundingClientRect().height }))
      .filter((b) => b.h > 0),
  );
  expect(boxes.length).toBeGreaterThanOrEqual(atLeast);
  expect(boxes.filter((b) => b.h < 56)).toEqual([]);
  return boxes.length;
}

/**
 * Signs the demo tech in, lets the first sync bring today's work, opens the demo chain saw's ticket and waits until
 * the whole sheet is drawn (its last step is there). With `offline`, the network then goes away, so nothing the test
 * records leaves the phone (other specs check the server's copy of this ticket).
 */
export async function openDemoSaw(page: Page, context: BrowserContext, { offline }: { offline: boolean }) {
  const saw = demoChainSaw(E2E_DATA_DIR, DEMO.tech);
  await signInAs(page, DEMO.tech);
  await waitForServiceWorker(page);
  expect((await deviceTickets(page)).map((t) => t.id)).toContain(saw.id);
  await page.goto(`/bench/ticket?id=${saw.id}`);
  await expect(page.getByRole("heading", { level: 1 })).toContainText(`#${saw.number}`);
  await expect(step(page, "final-photo")).toBeAttached();
  if (offline) await goOffline(context, page);
  return saw;
}
