import Dexie, { type DexieOptions, type EntityTable } from "dexie";
import { keepDeviceDbOpen } from "@/lib/pwa/device-db-watch";
import type {
  BenchEntryRow,
  CustomerRow,
  Entity,
  FindingRow,
  LaborEntryRow,
  MachineRow,
  MutationName,
  PartUsedRow,
  PhotoRow,
  ProcedureRow,
  RejectReason,
  TicketNoteRow,
  TicketRow,
  TuneEntryRow,
} from "./protocol";

/**
 * The device store (IndexedDB through Dexie): what this phone holds of the shop (pulled rows, with the
 * tech's own waiting changes applied on top), the outbox of changes not yet acknowledged by the server,
 * the "needs attention" list of changes the server refused, photo bytes until uploaded, and sync state.
 *
 * Schema changes go in a NEW `version(n)` below that keeps existing data (with an `upgrade()` when rows
 * need a new field); a version that shipped is never edited.
 */
export interface OutboxEntry {
  /** Local, gap-free order of this device's mutations (the server refuses a gap). */
  seq: number;
  mutationId: string;
  deviceId: string;
  name: MutationName;
  args: Record<string, unknown>;
  /** ISO time the change was made on the device. */
  at: string;
  /** Who recorded it on this device. */
  userId: string;
  /** The row it writes, and its ticket (for "changes waiting on this ticket"). */
  entityId: string;
  ticketId: string | null;
}

/** A change the server refused, with its reason; kept until the tech retries or dismisses it. */
export interface AttentionEntry extends OutboxEntry {
  reason: RejectReason;
  rejectedAt: string;
  /** Why the photo's bytes could not be uploaded, when that was the cause. */
  uploadError: string | null;
}

export interface PhotoBlobRow {
  sha256: string;
  blob: Blob;
  mime: string;
  bytes: number;
  uploadedAt: string | null;
  uploadError: string | null;
}

export interface MetaRow {
  key: string;
  value: unknown;
}

/** Who signed in on this device (remembered, so the bench opens offline and work is never mixed). */
export interface DeviceUser {
  id: string;
  name: string;
  email: string;
  role: string;
  signedInAt: string;
}

export interface DeviceIdentity {
  deviceId: string;
  /** The seq the next recorded change gets. */
  nextSeq: number;
}

export interface SyncError {
  code: "offline" | "session_expired" | "device_owner" | "update_required" | "server" | "gap" | "photo_upload" | "not_signed_in";
  message: string;
  at: string;
}

export interface SyncState {
  /** Server version this device has every change up to (0 before the first complete pull). */
  cursor: number;
  /** Continuation of a first pull still in progress. */
  snapshot: string | null;
  lastSyncAt: string | null;
  lastAttemptAt: string | null;
  lastError: SyncError | null;
  /** The server answered 401: the outbox is kept; the tech signs in again and the push goes out. */
  sessionExpired: boolean;
  /** The tech signed out on this device (changes waiting are kept for when they sign in again). */
  signedOut: boolean;
  /** Someone else is signed in while this device's person still has changes here: nothing is recorded or sent. */
  otherSignedIn: { id: string; name: string } | null;
}

export const INITIAL_SYNC_STATE: SyncState = {
  cursor: 0,
  snapshot: null,
  lastSyncAt: null,
  lastAttemptAt: null,
  lastError: null,
  sessionExpired: false,
  signedOut: false,
  otherSignedIn: null,
};

/** Dexie's table for each entity a pull hands out. */
export const ENTITY_TABLE = {
  ticket: "tickets",
  machine: "machines",
  customer: "customers",
  procedure: "procedures",
  bench_entry: "benchEntries",
  finding: "findings",
  tune_entry: "tuneEntries",
  photo: "photos",
  labor_entry: "laborEntries",
  ticket_note: "ticketNotes",
  part_used: "partsUsed",
} as const satisfies Record<Entity, string>;

export const FACT_TABLES = ["benchEntries", "findings", "tuneEntries", "photos", "laborEntries", "ticketNotes", "partsUsed"] as const;
/** Tables filled by pulls (cleared when a first pull starts over). */
export const PULLED_TABLES = ["tickets", "machines", "customers", "procedures", ...FACT_TABLES] as const;

/** Each schema version, in order. Never edit one that shipped; add the next. */
export const DEVICE_SCHEMA_VERSIONS: Array<{ version: number; stores: Record<string, string | null>; upgrade?: (tx: import("dexie").Transaction) => Promise<void> }> = [
  {
    version: 1,
    stores: {
      tickets: "id, number, tagCode, status, assignedTechId, machineId, customerId",
      machines: "id, stickerCode, customerId",
      customers: "id",
      procedures: "id, machineKind",
      benchEntries: "id, ticketId",
      findings: "id, ticketId",
      tuneEntries: "id, ticketId",
      photos: "id, ticketId, sha256",
      photoBlobs: "sha256",
      laborEntries: "id, ticketId, userId",
      ticketNotes: "id, ticketId",
      partsUsed: "id, ticketId",
      outbox: "seq, &mutationId, ticketId",
      attention: "mutationId, seq, ticketId",
      meta: "key",
    },
  },
  {
    // The bench sheet reads "latest per step" by ticket and step; the outbox finds waiting changes by row.
    version: 2,
    stores: {
      benchEntries: "id, ticketId, [ticketId+stepId]",
      outbox: "seq, &mutationId, ticketId, entityId",
    },
    upgrade: async (tx) => {
      await tx
        .table("outbox")
        .toCollection()
        .modify((e: Partial<OutboxEntry>) => {
          if (!e.entityId) e.entityId = String(e.name === "ticket.status_changed" ? e.args?.ticketId : e.args?.id);
        });
    },
  },
];

export const DEVICE_DB_NAME = "benchwright-device";

export class DeviceDb extends Dexie {
  tickets!: EntityTable<TicketRow, "id">;
  machines!: EntityTable<MachineRow, "id">;
  customers!: EntityTable<CustomerRow, "id">;
  procedures!: EntityTable<ProcedureRow, "id">;
  benchEntries!: EntityTable<BenchEntryRow, "id">;
  findings!: EntityTable<FindingRow, "id">;
  tuneEntries!: EntityTable<TuneEntryRow, "id">;
  photos!: EntityTable<PhotoRow, "id">;
  photoBlobs!: EntityTable<PhotoBlobRow, "sha256">;
  laborEntries!: EntityTable<LaborEntryRow, "id">;
  ticketNotes!: EntityTable<TicketNoteRow, "id">;
  partsUsed!: EntityTable<PartUsedRow, "id">;
  outbox!: EntityTable<OutboxEntry, "seq">;
  attention!: EntityTable<AttentionEntry, "mutationId">;
  meta!: EntityTable<MetaRow, "key">;

  /** `upTo` opens an older schema (for upgrade tests); `options` can pass another IndexedDB (tests). */
  constructor(name = DEVICE_DB_NAME, options: DexieOptions & { upTo?: number } = {}) {
    const { upTo, ...dexieOptions } = options;
    super(name, dexieOptions);
    for (const v of DEVICE_SCHEMA_VERSIONS) {
      if (upTo !== undefined && v.version > upTo) break;
      const declared = this.version(v.version).stores(v.stores);
      if (v.upgrade) declared.upgrade(v.upgrade);
    }
  }
}

let instance: DeviceDb | undefined;

/** The one connection (sync access: Dexie opens on first use). */
export function deviceDb(): DeviceDb {
  instance ??= new DeviceDb();
  return instance;
}

let watching = false;

/** The one connection, opened; reopened if the browser closed it while the app was in the background. */
export async function getDeviceDb(): Promise<DeviceDb> {
  const db = deviceDb();
  // In the browser, reopen it as soon as it is dropped or the app comes back to the foreground.
  if (!watching && typeof document !== "undefined") {
    watching = true;
    keepDeviceDbOpen(getDeviceDb);
  }
  if (!db.isOpen()) await db.open();
  return db;
}

/** For tests and tools: use another store as "the" device store. */
export function setDeviceDb(db: DeviceDb | undefined): void {
  instance = db;
}

/** Changes recorded on this device that the server has not acknowledged yet. */
export async function pendingChangeCount(db?: DeviceDb): Promise<number> {
  const d = db ?? (await getDeviceDb());
  return d.outbox.count();
}

// ---------------------------------------------------------------------------------------------
// Meta rows

export async function readMeta<T>(db: DeviceDb, key: string, fallback: T): Promise<T> {
  const row = await db.meta.get(key);
  return row ? (row.value as T) : fallback;
}

export async function writeMeta(db: DeviceDb, key: string, value: unknown): Promise<void> {
  await db.meta.put({ key, value });
}

export async function readSyncState(db: DeviceDb): Promise<SyncState> {
  return { ...INITIAL_SYNC_STATE, ...(await readMeta<Partial<SyncState>>(db, "sync", {})) };
}

export async function updateSyncState(db: DeviceDb, patch: Partial<SyncState>): Promise<SyncState> {
  return db.transaction("rw", db.meta, async () => {
    const next = { ...(await readSyncState(db)), ...patch };
    await writeMeta(db, "sync", next);
    return next;
  });
}

export async function readDeviceUser(db: DeviceDb): Promise<DeviceUser | null> {
  return readMeta<DeviceUser | null>(db, "user", null);
}

export async function readIdentity(db: DeviceDb): Promise<DeviceIdentity | null> {
  return readMeta<DeviceIdentity | null>(db, "device", null);
}
