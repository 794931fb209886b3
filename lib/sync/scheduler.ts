/**
 * When the device syncs (browser only): "Sync now", the `online` event, the app becoming visible, every
 * few minutes while online, and app start — one sync at a time across tabs (a Web Lock; where the
 * browser has none, an in-tab flag plus a short lease in localStorage). Running two at once would
 * still be safe (the server answers repeats with `duplicate`, pulls check their cursor), only wasteful.
 *
 * The live state (online, running, progress) is kept in memory for `useSyncExternalStore`; what
 * must survive a reload (cursor, last sync, errors) is in the device store.
 */
import { deviceCall } from "./device-client";
import type { SyncProgress, SyncResult } from "./engine";

export interface LiveSyncState {
  online: boolean;
  running: boolean;
  progress: SyncProgress | null;
  last: SyncResult | null;
}

export const SYNC_INTERVAL_MS = 3 * 60_000;
const LOCK = "benchwright-sync";
const LEASE_KEY = "benchwright.syncLease";
const LEASE_MS = 60_000;

let state: LiveSyncState = { online: true, running: false, progress: null, last: null };
const listeners = new Set<() => void>();
let started = false;
let again = false;
let inTab: Promise<SyncResult | null> | null = null;
const tabId = Math.random().toString(36).slice(2);

function set(patch: Partial<LiveSyncState>) {
  state = { ...state, ...patch };
  for (const l of listeners) l();
}

export function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}
export const getSnapshot = (): LiveSyncState => state;
const SERVER_STATE: LiveSyncState = { online: true, running: false, progress: null, last: null };
export const getServerSnapshot = (): LiveSyncState => SERVER_STATE;

async function runOnce(): Promise<SyncResult> {
  set({ running: true, progress: null });
  try {
    // In the device worker (lib/sync/device-host.ts), or in the page where there is none.
    const result = await deviceCall({ type: "sync" }, (progress) => set({ progress }));
    set({ last: result });
    return result;
  } finally {
    set({ running: false, progress: null });
  }
}

function takeLease(): boolean {
  try {
    const now = Date.now();
    const held = JSON.parse(localStorage.getItem(LEASE_KEY) ?? "null") as { tab: string; until: number } | null;
    if (held && held.tab !== tabId && held.until > now) return false;
    localStorage.setItem(LEASE_KEY, JSON.stringify({ tab: tabId, until: now + LEASE_MS }));
    return true;
  } catch {
    return true; // no storage: this tab alone decides
  }
}
function dropLease() {
  try {
    const held = JSON.parse(localStorage.getItem(LEASE_KEY) ?? "null") as { tab: string } | null;
    if (held?.tab === tabId) localStorage.removeItem(LEASE_KEY);
  } catch {
    // nothing to drop
  }
}

/** Runs a sync now unless one is already running (in this tab or another); returns its result, or null when skipped. */
export async function requestSync(): Promise<SyncResult | null> {
  if (inTab) {
    again = true; // something changed meanwhile: go once more when this one ends
    return inTab;
  }
  inTab = (async () => {
    try {
      let result: SyncResult | null = null;
      do {
        again = false;
        const locks = typeof navigator !== "undefined" ? navigator.locks : undefined;
        if (locks?.request) {
          result = await locks.request(LOCK, { ifAvailable: true }, async (lock) => (lock ? runOnce() : null));
        } else if (takeLease()) {
          try {
            result = await runOnce();
          } finally {
            dropLease();
          }
        }
      } while (again);
      return result;
    } finally {
      inTab = null;
    }
  })();
  return inTab;
}

/**
 * A sync once the screen has drawn and the main thread is free (at most `IDLE_SYNC_MAX_WAIT_MS` later): used when
 * a screen opens, so a fresh phone's first pull never competes with drawing the screen.
 */
export function requestSyncWhenIdle(): void {
  if (typeof window === "undefined") return;
  const go = () => void requestSync();
  if (typeof window.requestIdleCallback === "function") window.requestIdleCallback(go, { timeout: IDLE_SYNC_MAX_WAIT_MS });
  else window.setTimeout(go, 200);
}
const IDLE_SYNC_MAX_WAIT_MS = 2000;

/** Starts the triggers once per page (the sync badge does this on every bench screen). */
export function startSyncScheduler(): void {
  if (started || typeof window === "undefined") return;
  started = true;
  set({ online: navigator.onLine });
  window.addEventListener("online", () => {
    set({ online: true });
    void requestSync();
  });
  window.addEventListener("offline", () => set({ online: false }));
  document.addEventListener("visibilitychange", () => {
    if (document.visibilityState === "visible" && navigator.onLine) void requestSync();
  });
  window.setInterval(() => {
    if (navigator.onLine && document.visibilityState === "visible") void requestSync();
  }, SYNC_INTERVAL_MS);
  if (navigator.onLine) requestSyncWhenIdle();
  exposeTestHooks();
}

/** For browser tests and benchmarks only: with localStorage "benchwright.testHooks" = "1", the page exposes record/sync. */
function exposeTestHooks() {
  try {
    if (localStorage.getItem("benchwright.testHooks") !== "1") return;
  } catch {
    return;
  }
  void Promise.all([import("./record"), import("./device-db"), import("./effects"), import("./protocol")]).then(([rec, store, effects, protocol]) => {
    (window as unknown as Record<string, unknown>).__benchwrightSync = {
      record: rec.record,
      requestSync,
      getDeviceDb: store.getDeviceDb,
      // For the device benchmark: apply pull pages to a scratch store the way a sync does.
      DeviceDb: store.DeviceDb,
      applyServerChanges: effects.applyServerChanges,
      pullResponseSchema: protocol.pullResponseSchema,
    };
  });
}
