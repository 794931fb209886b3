import { expect, test, type Page } from "@playwright/test";
import { DEMO, signInAs } from "./pages/sign-in";
import {
  checkForNewWorker,
  clearOutbox,
  deviceTickets,
  controllerVersion,
  expectUpdateBanner,
  fontLoaded,
  goOffline,
  hasWaitingWorker,
  outboxCount,
  publishNewWorker,
  putOutboxEntry,
  waitForServiceWorker,
} from "./pages/pwa";

// Sources for the checks: W3C Service Workers (registration, waiting, skipWaiting, clients.claim) [read];
// W3C Web App Manifest (name, short_name, start_url, scope, display, icons with sizes and purpose, shortcuts)
// [read]; PNG spec §5.2–5.3 (signature, IHDR width/height big-endian) [read].

const OUTBOX_ROW = {
  seq: 1,
  mutationId: "e2e-mutation-1",
  deviceId: "e2e-device",
  name: "note.add",
  args: { text: "Pull cord frayed" },
  at: "2026-05-04T10:00:00.000Z",
};

test.describe("service worker and manifest", () => {
  test("the service worker registers, controls the page and is never served stale", async ({ page, request }) => {
    await page.goto("/sign-in");
    await waitForServiceWorker(page);
    const reg = await page.evaluate(async () => {
      const r = await navigator.serviceWorker.getRegistration();
      return { scope: r?.scope, script: r?.active?.scriptURL, state: r?.active?.state };
    });
    expect(new URL(reg.scope!).pathname).toBe("/");
    expect(new URL(reg.script!).pathname).toBe("/sw.js");
    expect(reg.state).toBe("activated");

    const sw = await request.get("/sw.js");
    expect(sw.status()).toBe(200);
    expect(sw.headers()["cache-control"]).toContain("no-cache");
    const body = await sw.text();
    for (const url of ["/bench", "/bench/ticket", "/bench/device", "/offline"]) expect(body).toContain(`'url':'${url}'`);
  });

  test("the manifest has the right fields and every icon answers 200 with its stated size", async ({ page, request }) => {
    await page.goto("/sign-in");
    await expect(page.locator('link[rel="manifest"]')).toHaveAttribute("href", "/manifest.webmanifest");
    const res = await request.get("/manifest.webmanifest");
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toContain("application/manifest+json");
    const m = await res.json();
    expect(m).toMatchObject({
      name: "Benchwright",
      short_name: "Benchwright",
      start_url: "/bench",
      scope: "/",
      display: "standalone",
      background_color: "#f6f6f9",
      theme_color: "#f6f6f9",
    });
    expect(m.description.length).toBeGreaterThan(20);
    expect(m.shortcuts.map((s: { name: string; url: string }) => [s.name, s.url])).toEqual([
      ["Scan a tag", "/bench/scan"],
      ["Today's work", "/bench"],
    ]);
    const purposes = m.icons.map((i: { sizes: string; purpose: string }) => `${i.sizes} ${i.purpose}`).sort();
    expect(purposes).toEqual(["192x192 any", "192x192 maskable", "512x512 any", "512x512 maskable"]);

    const icons = [...m.icons, ...m.shortcuts.flatMap((s: { icons: unknown[] }) => s.icons)] as { src: string; sizes: string; type: string }[];
    for (const icon of icons) {
      const img = await request.get(icon.src);
      expect(img.status(), icon.src).toBe(200);
      expect(img.headers()["content-type"]).toBe(icon.type);
      const buf = await img.body();
      expect(buf.subarray(1, 4).toString("latin1")).toBe("PNG");
      expect(`${buf.readUInt32BE(16)}x${buf.readUInt32BE(20)}`, icon.src).toBe(icon.sizes);
    }
    const favicon = await request.get("/favicon.ico");
    expect(favicon.status()).toBe(200);
    expect((await favicon.body()).readUInt16LE(2)).toBe(1); // ICO type 1 = icon
  });

  test("API calls and the counter screens' router data skip the worker; bench screens still come from it", async ({ page }) => {
    await signInAs(page, DEMO.owner);
    await waitForServiceWorker(page);
    const fetched = async (url: string, headers: Record<string, string> = {}) => {
      const response = page.waitForResponse((r) => r.url().endsWith(url) && r.request().method() === "GET");
      await page.evaluate(([u, h]) => fetch(u, { headers: h }).then(() => undefined), [url, headers] as const);
      return (await response).fromServiceWorker();
    };
    // Chromium's static routes (W3C Service Workers, "static routing" [read]): these never reach the fetch handler.
    expect(await fetched("/api/me")).toBe(false);
    expect(await fetched("/counter?_rsc=e2e", { RSC: "1" })).toBe(false);
    // Controls: the precache still answers the manifest and a bench screen's router data.
    expect(await fetched("/manifest.webmanifest")).toBe(true);
    expect(await fetched("/bench?_rsc=e2e", { RSC: "1" })).toBe(true);
  });
});

test.describe("offline", () => {
  test("after one online visit the bench and an open ticket reload and work with no network", async ({ page, context }) => {
    await signInAs(page, DEMO.tech);
    await expect(page.getByText("Signed in as")).toContainText("Tomas Brevik");
    await waitForServiceWorker(page);
    const [ticket] = await deviceTickets(page);
    if (!ticket) throw new Error("the first sync brought no tickets");

    await goOffline(context, page);
    await page.reload();
    await expect(page.getByRole("heading", { name: "Today's work" })).toBeVisible();
    await expect(page.getByText("Signed in as")).toContainText("Tomas Brevik");
    expect(await fontLoaded(page)).toBe(true);

    // Moving between bench screens with no network (the router's RSC payload comes from the phone).
    await page.getByRole("navigation", { name: "Bench" }).getByRole("link", { name: "Device" }).click();
    await expect(page.getByRole("heading", { name: "This phone", exact: true })).toBeVisible();
    await expect(page.getByTestId("offline-state")).toHaveText("Ready");

    // A ticket the phone holds opens from the phone's copy of the ticket screen; one it does not hold says so.
    await page.goto(`/bench/ticket?id=${ticket.id}`);
    await expect(page.getByTestId("bench-ticket")).toHaveAttribute("data-ticket", ticket.id);
    await expect(page.getByRole("heading", { level: 1 })).toContainText(`#${ticket.number}`);
    await page.reload();
    await expect(page.getByTestId("bench-ticket")).toHaveAttribute("data-ticket", ticket.id);
    await page.goto("/bench/ticket?id=7d1f3c2a-0000-4000-8000-00000000e2e1");
    await expect(page.getByText("This ticket is not on this phone")).toBeVisible();
    await page.getByRole("navigation", { name: "Bench" }).getByRole("link", { name: "Today" }).click();
    await expect(page.getByRole("heading", { name: "Today's work" })).toBeVisible();
  });

  test("control: with service workers blocked, the same reload fails offline", async ({ browser }) => {
    const context = await browser.newContext({ serviceWorkers: "block" });
    const page = await context.newPage();
    await signInAs(page, DEMO.tech);
    await expect(page.getByRole("heading", { name: "Today's work" })).toBeVisible();
    expect(await page.evaluate(async () => Boolean(await navigator.serviceWorker?.getRegistration()))).toBe(false);
    await goOffline(context, page);
    await expect(page.reload()).rejects.toThrow(/ERR_INTERNET_DISCONNECTED/);
    await context.close();
  });

  test("a counter page with no network shows the offline page, and the bench opens from it", async ({ page, context }) => {
    await signInAs(page, DEMO.counter);
    await expect(page.getByRole("heading", { name: "Queue" })).toBeVisible();
    await waitForServiceWorker(page);

    await goOffline(context, page);
    await page.reload();
    await expect(page).toHaveURL(/\/counter$/);
    await expect(page.getByRole("heading", { name: "No network right now" })).toBeVisible();
    const works = page.getByRole("region", { name: "Works with no network" });
    const waits = page.getByRole("region", { name: "Waits for the network" });
    await expect(works).toContainText("The bench");
    await expect(works).toContainText("Scanning");
    await expect(works).toContainText("shop tools");
    for (const text of ["queue", "Taking a machine in", "Estimates", "shop settings"]) await expect(waits).toContainText(text);

    await page.getByRole("link", { name: "Open the bench" }).click();
    await expect(page.getByRole("heading", { name: "Today's work" })).toBeVisible();
  });
});

test.describe("this phone (/bench/device)", () => {
  test("asks for persistent storage once at the first sign-in and shows storage, install help and version", async ({ page }) => {
    // Count the app's calls to persist(); the browser's own answer stays in charge.
    await page.addInitScript(() => {
      const storage = navigator.storage;
      const original = storage.persist.bind(storage);
      let calls = Number(sessionStorage.getItem("persistCalls") ?? 0);
      storage.persist = async () => {
        sessionStorage.setItem("persistCalls", String(++calls));
        return original();
      };
    });
    const persistCalls = () => page.evaluate(() => Number(sessionStorage.getItem("persistCalls") ?? 0));

    await signInAs(page, DEMO.tech);
    await expect(page.getByText("Signed in as")).toContainText("Tomas Brevik");
    await expect.poll(persistCalls).toBe(1);
    await page.reload();
    await expect(page.getByText("Signed in as")).toContainText("Tomas Brevik");
    await waitForServiceWorker(page);

    await page.getByRole("navigation", { name: "Bench" }).getByRole("link", { name: "Device" }).click();
    await expect(page.getByRole("heading", { name: "This phone", exact: true })).toBeVisible();
    const persisted = await page.evaluate(() => navigator.storage.persisted());
    await expect(page.getByTestId("storage-persisted")).toHaveText(persisted ? "Yes" : "No");
    await expect(page.getByTestId("storage-usage")).toContainText(/^\d+(\.\d+)? (bytes?|kB|MB|GB)/);
    await expect(page.getByTestId("pending-changes")).toHaveText("0");
    expect(await persistCalls()).toBe(1); // asked at the first sign-in only

    // No install prompt offered (headless): the menu instructions show.
    await expect(page.getByRole("region", { name: "Install on this phone" })).toContainText("Add to Home Screen");
    await expect(page.getByRole("button", { name: "Install on this phone" })).toHaveCount(0);

    await expect(page.getByTestId("app-version")).toHaveText(/^0\.1\.0\+[0-9a-f]{12}$/);
    const version = await controllerVersion(page);
    await expect(page.getByTestId("worker-version")).toHaveText(version!);
    await expect(page.getByTestId("update-state")).toHaveText("Up to date");
  });

  test("offers the install button when the browser offers installation", async ({ page }) => {
    await page.goto("/bench/device");
    await expect(page.getByRole("heading", { name: "This phone", exact: true })).toBeVisible();
    await page.evaluate(() => {
      const event = new Event("beforeinstallprompt", { cancelable: true }) as Event & Record<string, unknown>;
      event.prompt = async () => undefined;
      event.userChoice = Promise.resolve({ outcome: "accepted", platform: "web" });
      window.dispatchEvent(event);
    });
    await page.getByRole("button", { name: "Install on this phone" }).click();
    await expect(page.getByRole("region", { name: "Install on this phone" })).toContainText("Installed");
  });
});

test.describe("safe updates", () => {
  async function techOnDevicePage(page: Page) {
    await signInAs(page, DEMO.tech);
    await waitForServiceWorker(page);
    await page.getByRole("navigation", { name: "Bench" }).getByRole("link", { name: "Device" }).click();
    await expect(page.getByTestId("pending-changes")).toHaveText("0"); // the device store exists
  }

  test("a waiting update does not take over while the outbox has an entry, and does once it is empty", async ({ page }) => {
    await techOnDevicePage(page);
    await putOutboxEntry(page, OUTBOX_ROW);
    const next = publishNewWorker("e2e-version-2");
    try {
      await expect(page.getByTestId("worker-version")).toHaveText(next.oldVersion);
      await checkForNewWorker(page);
      // The app has seen the new version and counted the outbox: it says why it waits.
      await expectUpdateBanner(page, "Update ready");
      await expectUpdateBanner(page, "once the 1 change on this phone has reached the shop");
      expect(await hasWaitingWorker(page)).toBe(true);
      expect(await controllerVersion(page)).toBe(next.oldVersion);

      // Asking to update now warns first; "Not now" leaves the old version in charge.
      await page.getByTestId("update-banner").getByRole("button", { name: "Update now" }).click();
      const dialog = page.getByRole("dialog", { name: "Update before syncing?" });
      await expect(dialog).toContainText("1 change on this phone has not reached the shop yet");
      await dialog.getByRole("button", { name: "Not now" }).click();
      await expect(dialog).toBeHidden();
      expect(await hasWaitingWorker(page)).toBe(true);
      expect(await controllerVersion(page)).toBe(next.oldVersion);
      expect(await outboxCount(page)).toBe(1);

      // The shop acknowledged the change (the outbox empties): the update takes over and the page reloads.
      await clearOutbox(page);
      await expect(page.getByTestId("worker-version")).toHaveText("e2e-version-2", { timeout: 20_000 });
      expect(await hasWaitingWorker(page)).toBe(false);
      await expect(page.getByTestId("update-state")).toHaveText("Up to date");
    } finally {
      next.restore();
    }
  });

  test("the tech may update anyway after the warning, and the unsynced change survives the update", async ({ page }) => {
    await techOnDevicePage(page);
    await putOutboxEntry(page, OUTBOX_ROW);
    const next = publishNewWorker("e2e-version-3");
    try {
      await checkForNewWorker(page);
      await expectUpdateBanner(page, "once the 1 change on this phone has reached the shop");
      await page.getByRole("region", { name: "Version" }).getByRole("button", { name: "Update now" }).click();
      const dialog = page.getByRole("dialog", { name: "Update before syncing?" });
      await dialog.getByRole("button", { name: "Update anyway" }).click();
      await expect(page.getByTestId("worker-version")).toHaveText("e2e-version-3", { timeout: 20_000 });
      expect(await outboxCount(page)).toBe(1);
      await expect(page.getByTestId("pending-changes")).toHaveText("1");
    } finally {
      next.restore();
    }
  });

  test("a half-filled form holds the update even with an empty outbox, until the screen is left", async ({ page }) => {
    await signInAs(page, DEMO.owner);
    await waitForServiceWorker(page);
    await page.goto("/owner/settings");
    const field = page.getByLabel("Shop name");
    await field.fill(`${await field.inputValue()} (typing)`);
    const next = publishNewWorker("e2e-version-4");
    try {
      await checkForNewWorker(page);
      await expectUpdateBanner(page, "It installs when you leave this screen");
      expect(await hasWaitingWorker(page)).toBe(true);
      await expect(field).toHaveValue(/\(typing\)$/);

      await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Queue" }).click();
      await expect(page.getByRole("heading", { name: "Queue" })).toBeVisible();
      // Wait without messaging the old worker: Chromium holds a waiting worker's activation while the active one
      // still has events in flight, so polling it with GET_VERSION would itself delay the update.
      await expect
        .poll(() => hasWaitingWorker(page).catch(() => true), { timeout: 20_000, intervals: [500] })
        .toBe(false);
      await expect.poll(() => controllerVersion(page).catch(() => null), { timeout: 10_000, intervals: [1000] }).toBe("e2e-version-4");
    } finally {
      next.restore();
    }
  });
});
