import Dexie, { type EntityTable } from "dexie";
import { keepDeviceDbOpen } from "@/lib/pwa/device-db-watch";

/**
 * The device store (IndexedDB through Dexie). Skeleton: the sync engine owns and extends this schema;
 * other code reads it only through the functions exported here and from lib/sync.
 */
export interface OutboxEntry {
  /** Local, gap-free order of this device's mutations. */
  seq: number;
  mutationId: string;
  deviceId: string;
  name: string;
  args: unknown;
  /** ISO time the change was made on the device. */
  at: string;
}

export interface MetaRow {
  key: string;
  value: unknown;
}

export class DeviceDb extends Dexie {
  outbox!: EntityTable<OutboxEntry, "seq">;
  meta!: EntityTable<MetaRow, "key">;

  constructor(name = "benchwright-device") {
    super(name);
    this.version(1).stores({
      outbox: "seq, &mutationId",
      meta: "key",
    });
  }
}

let instance: DeviceDb | undefined;
let watching = false;

/** The one connection; reopened if the browser closed it while the app was in the background. */
export async function getDeviceDb(): Promise<DeviceDb> {
  instance ??= new DeviceDb();
  // In the browser, reopen it as soon as it is dropped or the app comes back to the foreground.
  if (!watching && typeof document !== "undefined") {
    watching = true;
    keepDeviceDbOpen(getDeviceDb);
  }
  if (!instance.isOpen()) await instance.open();
  return instance;
}

/** Changes recorded on this device that the server has not acknowledged yet. */
export async function pendingChangeCount(): Promise<number> {
  const db = await getDeviceDb();
  return db.outbox.count();
}
