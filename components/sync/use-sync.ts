"use client";

import { useEffect, useState, useSyncExternalStore } from "react";
import { useLiveQuery } from "dexie-react-hooks";
import { syncStatus, type SyncStatus } from "@/lib/sync/read";
import { getServerSnapshot, getSnapshot, startSyncScheduler, subscribe, type LiveSyncState } from "@/lib/sync/scheduler";

/** Online / running / progress, live; starts the sync triggers on first use. */
export function useLiveSync(): LiveSyncState {
  useEffect(() => {
    startSyncScheduler();
  }, []);
  return useSyncExternalStore(subscribe, getSnapshot, getServerSnapshot);
}

/** What the device store says about sync (waiting, needs attention, last sync, errors), live. */
export function useSyncStatus(): SyncStatus | undefined {
  return useLiveQuery(() => syncStatus(), []);
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
