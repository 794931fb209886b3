import type { DeviceDb } from "@/lib/sync/device-db";

/** What the watcher listens to; the browser's `document` and `window` by default (tests pass their own). */
export interface PageEvents {
  document: Pick<Document, "addEventListener" | "removeEventListener"> & { readonly visibilityState: DocumentVisibilityState };
  window: Pick<Window, "addEventListener" | "removeEventListener">;
}

/**
 * Keeps the device store's connection open: browsers may close IndexedDB while the app sits in the background
 * (or when storage is cleared under it). When that happens, or when the app comes back to the foreground, the
 * connection is opened again so the next read or write does not fail. Started by getDeviceDb() on first use.
 */
export function keepDeviceDbOpen(open: () => Promise<DeviceDb>, events: PageEvents = { document, window }): () => void {
  const watched = new WeakSet<DeviceDb>();
  let stopped = false;

  async function reopen() {
    if (stopped) return;
    try {
      const db = await open();
      if (!watched.has(db)) {
        watched.add(db);
        db.on("close", onClose);
      }
    } catch {
      // Storage unavailable right now (e.g. private mode or disk full): the next foreground event tries again.
    }
  }

  function onClose() {
    // Dexie fires "close" before it finishes closing: reopen once the current task is done.
    if (events.document.visibilityState === "visible") queueMicrotask(() => void reopen());
  }
  function onVisibility() {
    if (events.document.visibilityState === "visible") void reopen();
  }
  const onShow = () => void reopen();

  events.document.addEventListener("visibilitychange", onVisibility);
  events.window.addEventListener("pageshow", onShow);
  events.window.addEventListener("focus", onShow);
  void reopen();

  return () => {
    stopped = true;
    events.document.removeEventListener("visibilitychange", onVisibility);
    events.window.removeEventListener("pageshow", onShow);
    events.window.removeEventListener("focus", onShow);
  };
}
