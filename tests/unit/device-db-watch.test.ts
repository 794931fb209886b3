import "fake-indexeddb/auto";
import { forceCloseDatabase } from "fake-indexeddb";
import { afterEach, describe, expect, it } from "vitest";
import { DeviceDb } from "@/lib/sync/device-db";
import { keepDeviceDbOpen, type PageEvents } from "@/lib/pwa/device-db-watch";

// fake-indexeddb (a general-purpose implementation of the W3C IndexedDB API) provides forceCloseDatabase, which
// closes a connection the way a browser does when it drops it, firing the connection's "close" event [read: its README].

class FakePage implements PageEvents {
  visibility: DocumentVisibilityState = "visible";
  readonly doc = new EventTarget();
  readonly win = new EventTarget();
  get document() {
    const self = this;
    return {
      addEventListener: this.doc.addEventListener.bind(this.doc),
      removeEventListener: this.doc.removeEventListener.bind(this.doc),
      get visibilityState() {
        return self.visibility;
      },
    } as PageEvents["document"];
  }
  get window() {
    return this.win as unknown as PageEvents["window"];
  }
}

/** The browser dropping the connection. (fake-indexeddb 6.2.8 types the argument as the class, not an instance.) */
const dropConnection = (db: DeviceDb) => forceCloseDatabase(db.backendDB() as unknown as typeof IDBDatabase);

let n = 0;
const cleanups: (() => Promise<void> | void)[] = [];
afterEach(async () => {
  for (const c of cleanups.splice(0)) await c();
});

/** One device store per test, opened the way getDeviceDb() opens it. */
function store() {
  const db = new DeviceDb(`watch-test-${++n}`);
  const open = async () => {
    if (!db.isOpen()) await db.open();
    return db;
  };
  cleanups.push(() => db.delete());
  return { db, open };
}

/** Waits for the watcher's async reopen; a plain condition, no clock involved. */
async function until(condition: () => boolean) {
  for (let i = 0; i < 200 && !condition(); i++) await new Promise((r) => setImmediate(r));
}

describe("keepDeviceDbOpen", () => {
  it("opens the store at start", async () => {
    const page = new FakePage();
    const { db, open } = store();
    cleanups.push(keepDeviceDbOpen(open, page));
    await until(() => db.isOpen());
    expect(db.isOpen()).toBe(true);
  });

  it("reopens at once when the browser drops the connection while the app is visible", async () => {
    const page = new FakePage();
    const { db, open } = store();
    cleanups.push(keepDeviceDbOpen(open, page));
    await until(() => db.isOpen());
    await db.outbox.add({ seq: 1, mutationId: "m-1", deviceId: "d-1", name: "ticket.note_added", args: {}, at: "2026-05-04T10:00:00.000Z", userId: "u-1", entityId: "n-1", ticketId: "t-1" });

    dropConnection(db);
    expect(db.isOpen()).toBe(false);
    await until(() => db.isOpen());
    expect(db.isOpen()).toBe(true);
    expect(await db.outbox.count()).toBe(1);
  });

  it("in the background waits, then reopens when the app comes back to the foreground", async () => {
    const page = new FakePage();
    const { db, open } = store();
    cleanups.push(keepDeviceDbOpen(open, page));
    await until(() => db.isOpen());

    page.visibility = "hidden";
    dropConnection(db);
    await until(() => false); // give a wrongly eager reopen every chance to happen
    expect(db.isOpen()).toBe(false);

    page.visibility = "visible";
    page.doc.dispatchEvent(new Event("visibilitychange"));
    await until(() => db.isOpen());
    expect(db.isOpen()).toBe(true);
  });

  it("reopens on pageshow (a page restored from the back-forward cache)", async () => {
    const page = new FakePage();
    const { db, open } = store();
    const stop = keepDeviceDbOpen(open, page);
    cleanups.push(stop);
    await until(() => db.isOpen());
    page.visibility = "hidden";
    dropConnection(db);
    page.visibility = "visible";
    page.win.dispatchEvent(new Event("pageshow"));
    await until(() => db.isOpen());
    expect(db.isOpen()).toBe(true);
  });

  it("stops listening when stopped", async () => {
    const page = new FakePage();
    const { db, open } = store();
    const stop = keepDeviceDbOpen(open, page);
    await until(() => db.isOpen());
    stop();
    page.visibility = "hidden";
    dropConnection(db);
    page.visibility = "visible";
    page.doc.dispatchEvent(new Event("visibilitychange"));
    await until(() => false);
    expect(db.isOpen()).toBe(false);
  });
});
