"use client";

import { useCallback, useEffect, useState, useSyncExternalStore } from "react";
import type { SyncStatus } from "@/lib/sync/read";
import { subscribeWatched, watchedValue } from "@/lib/sync/device-client";
import type { WatchName, WatchValue } from "@/lib/sync/watched";
import { getServerSnapshot, getSnapshot, startSyncScheduler, subscribe, type LiveSyncState } from "@/lib/sync/scheduler";

/** Online / running / progress, live; starts the sync triggers on first use. */
export function useLiveSync(): LiveSyncState {
  useEffect(() => {
    startSyncScheduler();
  }, []);
  return useSyncExternalStore(subscribe, getSnapshot, getServerSnapshot);
}

/** A watched read of the device store (lib/sync/watched.ts), live; undefined until its first answer. */
export function useWatched<N extends WatchName>(name: N): WatchValue<N> | undefined {
  const sub = useCallback((listener: () => void) => subscribeWatched(name, listener), [name]);
  return useSyncExternalStore(sub, () => watchedValue(name), () => undefined);
}

/** What the device store says about sync (waiting, needs attention, last sync, errors), live. */
export function useSyncStatus(): SyncStatus | undefined {
  return useWatched("syncStatus");
}

/** The current time, refreshed every `ms` (for "5 min ago"). */
export function useNow(ms = 30_000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const id = window.setInterval(() => setNow(Date.now()), ms);
    return () => window.clearInterval(id);
  }, [ms]);
  return now;
}
