import fs from "node:fs";
import path from "node:path";
import { expect, type BrowserContext, type Page } from "@playwright/test";

/**
 * Waits until a service worker controls the page. On the first visit the worker installs and then claims the
 * open pages; a page that was still loading at that moment stays uncontrolled until it loads again (W3C Service
 * Workers, Clients.claim() [read]), so such a page is reloaded once.
 */
export async function waitForServiceWorker(page: Page) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  if (!(await page.evaluate(() => Boolean(navigator.serviceWorker.controller)))) await page.reload();
  try {
    await page.waitForFunction(() => Boolean(navigator.serviceWorker?.controller), null, { timeout: 20_000 });
  } catch (err) {
    const state = await page.evaluate(async () => {
      const r = await navigator.serviceWorker.getRegistration();
      return { installing: r?.installing?.state, waiting: r?.waiting?.state, active: r?.active?.state, url: location.href };
    });
    throw new Error(`no service worker controls the page: ${JSON.stringify(state)}`, { cause: err });
  }
}

/** No network at all: the HTTP cache emptied (so only the service worker can answer) and the context offline. */
export async function goOffline(context: BrowserContext, page: Page) {
  const cdp = await context.newCDPSession(page);
  await cdp.send("Network.clearBrowserCache");
  await cdp.detach();
  await context.setOffline(true);
}

export async function fontLoaded(page: Page): Promise<boolean> {
  return page.evaluate(async () => {
    await document.fonts.ready;
    return [...document.fonts].some((f) => f.status === "loaded" && !/fallback/i.test(f.family));
  });
}

export interface OutboxRow {
  seq: number;
  mutationId: string;
  deviceId: string;
  name: string;
  args: unknown;
  at: string;
}

/** Writes straight into the device store's outbox (IndexedDB "benchwright-device", table "outbox"). */
export async function putOutboxEntry(page: Page, row: OutboxRow) {
  await page.evaluate(
    (entry) =>
      new Promise<void>((resolve, reject) => {
        const req = indexedDB.open("benchwright-device");
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          const tx = db.transaction("outbox", "readwrite");
          tx.objectStore("outbox").put(entry);
          tx.oncomplete = () => (db.close(), resolve());
          tx.onerror = () => reject(tx.error);
        };
      }),
    row,
  );
}

export async function clearOutbox(page: Page) {
  await page.evaluate(
    () =>
      new Promise<void>((resolve, reject) => {
        const req = indexedDB.open("benchwright-device");
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          const tx = db.transaction("outbox", "readwrite");
          tx.objectStore("outbox").clear();
          tx.oncomplete = () => (db.close(), resolve());
          tx.onerror = () => reject(tx.error);
        };
      }),
  );
}

export async function outboxCount(page: Page): Promise<number> {
  return page.evaluate(
    () =>
      new Promise<number>((resolve, reject) => {
        const req = indexedDB.open("benchwright-device");
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          const count = db.transaction("outbox").objectStore("outbox").count();
          count.onsuccess = () => (db.close(), resolve(count.result));
          count.onerror = () => reject(count.error);
        };
      }),
  );
}

export async function hasWaitingWorker(page: Page): Promise<boolean> {
  return page.evaluate(async () => Boolean((await navigator.serviceWorker.getRegistration())?.waiting));
}

/** Asks the controlling worker which version it is (its GET_VERSION answer). */
export async function controllerVersion(page: Page): Promise<string | null> {
  return page.evaluate(
    () =>
      new Promise<string | null>((resolve) => {
        const sw = navigator.serviceWorker.controller;
        if (!sw) return resolve(null);
        const channel = new MessageChannel();
        channel.port1.onmessage = (e) => resolve((e.data as { version?: string }).version ?? null);
        sw.postMessage({ type: "GET_VERSION" }, [channel.port2]);
      }),
  );
}

const SW_FILE = path.join(process.cwd(), "public", "sw.js");
/** The built worker, kept while a test serves another version (outside public/, so it is never served or hashed). */
const BACKUP = path.join(process.cwd(), "tests", ".tmp", "sw.js.e2e-original");
const MARK = "/* e2e: next version */";

/**
 * Publishes a "new version" of the worker: the built public/sw.js with every revision of this build replaced,
 * which is what a rebuild with changed sources produces. `restore()` puts the built file back.
 */
export function publishNewWorker(version: string): { oldVersion: string; restore: () => void } {
  let original = fs.readFileSync(SW_FILE, "utf8");
  // A run that crashed before restoring left its mark: the first line is the real build.
  if (original.startsWith(MARK)) original = fs.readFileSync(BACKUP, "utf8");
  else {
    fs.mkdirSync(path.dirname(BACKUP), { recursive: true });
    fs.writeFileSync(BACKUP, original);
  }
  const match = /'revision':'([^']+)','url':'\/offline'/.exec(original);
  if (!match) throw new Error("public/sw.js has no /offline precache entry: rebuild");
  const oldVersion = match[1]!;
  fs.writeFileSync(SW_FILE, `${MARK}\n${original.replaceAll(`'${oldVersion}'`, `'${version}'`)}`);
  return {
    oldVersion,
    restore: () => {
      fs.writeFileSync(SW_FILE, original);
      fs.rmSync(BACKUP, { force: true });
    },
  };
}

/** Makes the browser look for a new worker now (what it does by itself on navigation, at most daily). */
export async function checkForNewWorker(page: Page) {
  await page.evaluate(async () => {
    await (await navigator.serviceWorker.getRegistration())?.update();
  });
}

export async function expectUpdateBanner(page: Page, text: RegExp | string) {
  await expect(page.getByTestId("update-banner")).toContainText(text);
}

/** The tickets on the phone (id, number, tag code), once its first sync has brought at least one. */
export async function deviceTickets(page: Page): Promise<Array<{ id: string; number: number; tagCode: string; assignedTechId: string | null }>> {
  await expect
    .poll(
      () =>
        page.evaluate(
          () =>
            new Promise<number>((resolve) => {
              const req = indexedDB.open("benchwright-device");
              req.onsuccess = () => {
                const db = req.result;
                if (!db.objectStoreNames.contains("tickets")) return (db.close(), resolve(0));
                const c = db.transaction("tickets").objectStore("tickets").count();
                c.onsuccess = () => (db.close(), resolve(c.result));
              };
              req.onerror = () => resolve(0);
            }),
        ),
      { timeout: 20_000 },
    )
    .toBeGreaterThan(0);
  return page.evaluate(
    () =>
      new Promise((resolve, reject) => {
        const req = indexedDB.open("benchwright-device");
        req.onsuccess = () => {
          const db = req.result;
          const all = db.transaction("tickets").objectStore("tickets").getAll();
          all.onsuccess = () => (db.close(), resolve(all.result.map((t: { id: string; number: number; tagCode: string; assignedTechId: string | null }) => ({ id: t.id, number: t.number, tagCode: t.tagCode, assignedTechId: t.assignedTechId }))));
          all.onerror = () => reject(all.error);
        };
        req.onerror = () => reject(req.error);
      }),
  );
}
