import { expect, test, type Page } from "@playwright/test";
import AxeBuilder from "@axe-core/playwright";
import { DEMO, signInAs } from "./pages/sign-in";

// axe-core (Deque's open-source WCAG rule engine) checks each main page against WCAG 2.1 A/AA rules [read: its
// rule descriptions]. The bar: no violation of "serious" or "critical" impact.

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "best-practice"]).analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => ({ rule: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => n.target.join(" ")).slice(0, 5) }));
}

const PAGES: { name: string; as?: string; path: string; ready: (page: Page) => Promise<void> }[] = [
  { name: "sign-in", path: "/sign-in", ready: (p) => expect(p.getByRole("heading", { name: "Sign in" })).toBeVisible() },
  { name: "bench", as: DEMO.tech, path: "/bench", ready: (p) => expect(p.getByText("Signed in as")).toContainText("Tomas") },
  {
    name: "bench, today's list",
    as: DEMO.tech,
    path: "/bench",
    ready: (p) => expect(p.getByTestId("today-card").first()).toBeVisible({ timeout: 20_000 }),
  },
  {
    name: "bench/scan, a tag not on this phone",
    as: DEMO.tech,
    path: "/bench/scan",
    ready: async (p) => {
      await p.getByLabel("Or type the tag code").fill("HAW-BR7H"); // the app's example code; no demo ticket carries it
      await p.getByRole("button", { name: "Open" }).click();
      await expect(p.getByRole("heading", { name: "Tag HAW-BR7H is not on this phone" })).toBeVisible();
    },
  },
  {
    name: "bench/device",
    as: DEMO.tech,
    path: "/bench/device",
    ready: (p) => expect(p.getByTestId("storage-usage")).toContainText(/\d/),
  },
  { name: "counter queue", as: DEMO.counter, path: "/counter", ready: (p) => expect(p.getByRole("heading", { name: "Queue" })).toBeVisible() },
  { name: "owner people", as: DEMO.owner, path: "/owner/people", ready: (p) => expect(p.getByRole("heading", { name: "People" })).toBeVisible() },
  {
    name: "owner settings",
    as: DEMO.owner,
    path: "/owner/settings",
    ready: (p) => expect(p.getByRole("heading", { name: "Shop settings" })).toBeVisible(),
  },
  { name: "offline page", path: "/offline", ready: (p) => expect(p.getByRole("heading", { name: "No network right now" })).toBeVisible() },
  {
    name: "not-allowed page",
    as: DEMO.tech,
    path: "/owner/people",
    ready: (p) => expect(p.getByRole("heading", { name: "Not allowed for your role" })).toBeVisible(),
  },
];

for (const { name, as, path, ready } of PAGES) {
  test(`no serious or critical accessibility violations: ${name}`, async ({ page }) => {
    if (as) await signInAs(page, as);
    await page.goto(path);
    await ready(page);
    expect(await seriousViolations(page)).toEqual([]);
  });
}

test("no serious or critical accessibility violations: the update warning dialog", async ({ page }) => {
  // The dialog as the app shows it, opened on the bench (its content is the same whatever the reason).
  await page.goto("/offline");
  // Until the page has hydrated, React's own effect closes a dialog opened from outside: open it until it stays.
  const dialog = page.getByRole("dialog", { name: "Update before syncing?" });
  await expect(async () => {
    await page.evaluate(() => {
      const d = document.querySelector("dialog") as HTMLDialogElement;
      if (!d.open) d.showModal();
    });
    await expect(dialog).toBeVisible({ timeout: 1000 });
  }).toPass({ timeout: 15_000 });
  expect(await seriousViolations(page)).toEqual([]);
});
