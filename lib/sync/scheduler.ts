/**
 * When the device syncs (browser only): "Sync now", the `online` event, the app becoming visible, every
 * few minutes while online, and app start — one sync at a time across tabs (a Web Lock; where the
 * browser has none, an in-tab flag plus a short lease in localStorage). Running two at once would
 * still be safe (the server answers repeats with `duplicate`, pulls check their cursor), only wasteful.
 *
 * The live state (online, running, progress) is kept in memory for `useSyncExternalStore`; what
 * must survive a reload (cursor, last sync, errors) is in the device store.
 */
import { getDeviceDb } from "./device-db";
import type { SyncProgress, SyncResult } from "./engine";
import type { SyncWorkerReply } from "./sync-worker-messages";

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

// ---- where a round runs: the sync worker, or this page where there is none ---------------------------------

type Pending = { resolve: (r: SyncResult | null) => void; reject: (e: Error) => void };
/** undefined: not started yet; null: no worker here (or it failed to start), rounds run in the page. */
let worker: Worker | null | undefined;
let nextRoundId = 1;
const rounds = new Map<number, Pending>();

function syncWorker(): Worker | null {
  if (worker !== undefined) return worker;
  worker = null;
  try {
    // For a comparison in benchmarks: localStorage "benchwright.syncInPage" = "1" keeps rounds in the page.
    if (typeof Worker === "undefined" || localStorage.getItem("benchwright.syncInPage") === "1") return null;
    const w = new Worker(new URL("./sync-worker.ts", import.meta.url), { name: "benchwright-sync" });
    w.onmessage = (event: MessageEvent<SyncWorkerReply>) => {
      const m = event.data;
      if (m.type === "ready") return;
      const round = rounds.get(m.id);
      if (!round) return;
      if (m.type === "progress") return set({ progress: m.progress });
      rounds.delete(m.id);
      if (m.type === "done") round.resolve(m.result);
      else round.reject(new Error(`sync worker: ${m.message}`));
    };
    w.onerror = (event) => {
      // The worker's script did not load or start: this round and later ones run in the page instead.
      event.preventDefault();
      w.terminate();
      worker = null;
      for (const [, round] of rounds) round.resolve(null);
      rounds.clear();
    };
    worker = w;
  } catch {
    worker = null;
  }
  return worker;
}

/** One round in the worker; null when there is no worker to run it. */
function runInWorker(): Promise<SyncResult | null> {
  const w = syncWorker();
  if (!w) return Promise.resolve(null);
  const id = nextRoundId++;
  return new Promise((resolve, reject) => {
    rounds.set(id, { resolve, reject });
    w.postMessage({ type: "sync", id });
  });
}

async function runInPage(): Promise<SyncResult> {
  // The engine and the protocol's schemas load with the first sync, not with the screen.
  const [db, { syncOnce }] = await Promise.all([getDeviceDb(), import("./engine")]);
  return syncOnce({ db, fetch: (...a) => fetch(...a), onProgress: (progress) => set({ progress }) });
}

async function runOnce(): Promise<SyncResult> {
  set({ running: true, progress: null });
  try {
    const result = (await runInWorker()) ?? (await runInPage());
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
