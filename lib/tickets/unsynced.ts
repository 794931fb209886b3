import type { Db } from "../../db/client";

/** Bench work a device has recorded for a ticket but not yet pushed to the server. */
export interface UnsyncedWork {
  changes: number;
  deviceUser: string;
  reportedAt: Date;
}

/**
 * Placeholder until the sync engine lands: it will export `unsyncedBenchWork(db)` from lib/sync, built
 * from what devices report on each push and pull (pending outbox count and ticket ids). The queue board
 * already shows its answer; the lead re-points this import at the sync engine's function when merging.
 */
export function unsyncedBenchWork(_db: Db): Map<string, UnsyncedWork> {
  return new Map();
}
