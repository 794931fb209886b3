/** What the page and the sync worker (lib/sync/sync-worker.ts) say to each other. Types only. */
import type { SyncProgress, SyncResult } from "./engine";

export type SyncWorkerRequest = { type: "sync"; id: number };

export type SyncWorkerReply =
  | { type: "ready" }
  | { type: "progress"; id: number; progress: SyncProgress }
  | { type: "done"; id: number; result: SyncResult }
  /** Something unexpected (a bug, not the network: syncOnce answers those itself). */
  | { type: "failed"; id: number; message: string };
