/**
 * The reads a screen can watch through the device host (lib/sync/device-host.ts): each is sent again whenever
 * a write anywhere on the phone changes its answer. Plain functions of the device store (lib/sync/read.ts).
 */
import { readDeviceUser, readSyncState, type DeviceDb, type DeviceUser } from "./device-db";
import { syncStatus, ticketsForToday, type SyncStatus, type TicketCard } from "./read";

export interface TodayRead {
  /** This phone has synced at least once (read first: a pull's rows are committed before its time is). */
  synced: boolean;
  cards: TicketCard[];
}

export const WATCHED = {
  syncStatus: (db: DeviceDb): Promise<SyncStatus> => syncStatus(db),
  deviceUser: (db: DeviceDb): Promise<DeviceUser | null> => readDeviceUser(db),
  today: async (db: DeviceDb): Promise<TodayRead> => {
    const { lastSyncAt } = await readSyncState(db);
    return { synced: Boolean(lastSyncAt), cards: await ticketsForToday(db) };
  },
} as const;

export type WatchName = keyof typeof WATCHED;
export type WatchValue<N extends WatchName> = Awaited<ReturnType<(typeof WATCHED)[N]>>;
export const WATCH_NAMES = Object.keys(WATCHED) as WatchName[];
