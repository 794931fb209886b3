/**
 * The one way the bench writes: `record(name, args)`. It validates the change with the mutation's
 * schema, then writes the local row(s) and the outbox entry in ONE Dexie transaction, and resolves only
 * after that transaction committed — so when the UI says "saved", the change is on the phone.
 *
 * Fields the device can fill are optional: a new row's `id`, the time `at` (and `startedAt`/`endedAt`),
 * and a status change's `baseVersion` (the header version on this phone). A problem is thrown as a
 * RecordError (with `fields` for a form) and nothing is written, so the UI keeps what was typed.
 */
import { zodFields } from "../http/errors";
import {
  BENCH_STATUSES,
  CREATING_MUTATIONS,
  MUTATION_ENTITY,
  entityIdOf,
  mutationSchemas,
  type MutationArgs,
  type MutationName,
  type TuneEntryRow,
} from "./protocol";
import { ENTITY_TABLE, getDeviceDb, readDeviceUser, readIdentity, readSyncState, writeMeta, type AttentionEntry, type DeviceDb, type OutboxEntry } from "./device-db";
import { applyLocalEffect } from "./effects";
import { uuid } from "./ids";
import { createdRow } from "./rows";
import { tuneEntryProblem } from "./rules";

export class RecordError extends Error {
  readonly code: "invalid" | "not_signed_in" | "not_found" | "refused";
  readonly fields?: Record<string, string>;
  constructor(code: RecordError["code"], message: string, fields?: Record<string, string>) {
    super(message);
    this.name = "RecordError";
    this.code = code;
    this.fields = fields;
  }
}

/** The fields `record` fills when they are left out. */
type AutoFilled = {
  "bench.entry.recorded": "id" | "at";
  "bench.entry.voided": "at";
  "finding.added": "id" | "at";
  "finding.changed": "at";
  "tune.recorded": "id" | "at";
  "photo.attached": "id" | "at";
  "labor.started": "id" | "startedAt";
  "labor.stopped": "endedAt";
  "ticket.status_changed": "baseVersion" | "at";
  "ticket.note_added": "id" | "at";
  "parts.used": "id" | "at";
};
type Args<N extends MutationName> = MutationArgs<N> extends infer A ? (A extends object ? A : never) : never;
export type RecordInput<N extends MutationName> = Omit<Args<N>, AutoFilled[N] & keyof Args<N>> &
  Partial<Pick<Args<N>, AutoFilled[N] & keyof Args<N>>>;

export interface Recorded {
  mutationId: string;
  seq: number;
  /** The id of the row written (new for a creating change). */
  id: string;
}

export interface RecordOptions {
  db?: DeviceDb;
  /** The photo's bytes (for photo.attached): kept on the phone until the server has them. */
  blob?: Blob;
  now?: Date;
}

/** Fills the optional fields and checks the change against what this phone holds. */
async function prepare(db: DeviceDb, name: MutationName, input: Record<string, unknown>, now: Date, role: string) {
  const args: Record<string, unknown> = { ...input };
  const iso = now.toISOString();
  if ((CREATING_MUTATIONS as readonly string[]).includes(name) && args.id === undefined) args.id = uuid();
  if (name === "labor.started") args.startedAt ??= iso;
  else if (name === "labor.stopped") args.endedAt ??= iso;
  else args.at ??= iso;
  if (name === "ticket.status_changed" && args.baseVersion === undefined && typeof args.ticketId === "string") {
    const t = await db.tickets.get(args.ticketId);
    if (t) args.baseVersion = t.version;
  }
  const parsed = mutationSchemas[name].safeParse(args);
  if (!parsed.success) {
    const fields = zodFields(parsed.error);
    throw new RecordError("invalid", Object.values(fields)[0] ?? "Some fields need attention.", fields);
  }
  const data = parsed.data as Record<string, unknown>;
  let ticketId: string | null = typeof data.ticketId === "string" ? data.ticketId : null;

  if (ticketId && !(await db.tickets.get(ticketId))) {
    throw new RecordError("not_found", "This ticket is not on this phone. Sync, then try again.");
  }
  switch (name) {
    case "bench.entry.voided": {
      const row = await db.benchEntries.get(String(data.id));
      if (!row) throw new RecordError("not_found", "That entry is not on this phone.");
      if (row.voidedAt) throw new RecordError("refused", "That entry was already voided.");
      ticketId = row.ticketId;
      break;
    }
    case "finding.changed": {
      const row = await db.findings.get(String(data.id));
      if (!row) throw new RecordError("not_found", "That finding is not on this phone.");
      ticketId = row.ticketId;
      break;
    }
    case "labor.stopped": {
      const row = await db.laborEntries.get(String(data.id));
      if (!row) throw new RecordError("not_found", "That timer is not on this phone.");
      if (row.endedAt) throw new RecordError("refused", "That timer was already stopped.");
      if (Date.parse(String(data.endedAt)) < Date.parse(row.startedAt)) {
        throw new RecordError("invalid", "The timer cannot stop before it started. Check the phone's clock.", { endedAt: "Before the start" });
      }
      ticketId = row.ticketId;
      break;
    }
    case "labor.started": {
      const running = await db.laborEntries.where("ticketId").equals(String(data.ticketId)).filter((l) => l.endedAt === null).first();
      if (running) throw new RecordError("refused", "A timer is already running on this ticket. Stop it first.");
      break;
    }
    case "ticket.status_changed":
      if (!(BENCH_STATUSES as readonly string[]).includes(String(data.status))) {
        throw new RecordError("refused", "That status is set at the counter, not from the bench.", { status: "Not a bench status" });
      }
      break;
    case "parts.used":
      if (data.unitPriceCents !== undefined && role === "tech") {
        throw new RecordError("refused", "A bench technician cannot set prices; the counter prices parts.", { unitPriceCents: "Leave the price to the counter" });
      }
      break;
    case "tune.recorded": {
      const existing = await db.tuneEntries.where("ticketId").equals(String(data.ticketId)).toArray();
      const problem = tuneEntryProblem(existing, createdRow("tune.recorded", data as MutationArgs<"tune.recorded">, "") as TuneEntryRow);
      if (problem) throw new RecordError("refused", problem, { eighths: problem });
      break;
    }
    default:
      break;
  }
  return { args: data, ticketId };
}

/**
 * The tables one change reads and writes. The transaction takes only these, so a screen reading other tables
 * (a live query re-reading the sheet, a sync reading another table) never holds the tap up.
 */
function recordTables(db: DeviceDb, name: MutationName) {
  const names = new Set<string>(["meta", "outbox", "tickets", ENTITY_TABLE[MUTATION_ENTITY[name]]]);
  if (name === "photo.attached") names.add("photoBlobs");
  return [...names];
}

/** Records a change on this phone (local rows + outbox entry, one transaction). */
export async function record<N extends MutationName>(name: N, input: RecordInput<N>, options: RecordOptions = {}): Promise<Recorded> {
  if (!(name in mutationSchemas)) throw new RecordError("invalid", `Unknown change "${String(name)}".`);
  const db = options.db ?? (await getDeviceDb());
  const now = options.now ?? new Date();
  return db.transaction("rw", recordTables(db, name), async () => {
    // Asked together: one round trip to the store instead of three (a tap waits for every one of them).
    const [user, sync, storedIdentity] = await Promise.all([readDeviceUser(db), readSyncState(db), readIdentity(db)]);
    if (!user || sync.signedOut) throw new RecordError("not_signed_in", "Sign in on this phone first.");
    if (sync.otherSignedIn) {
      throw new RecordError("not_signed_in", `${user.name}'s changes are still waiting on this phone. Sign in as ${user.name} to send them first.`);
    }
    const { args, ticketId } = await prepare(db, name, input as Record<string, unknown>, now, user.role);
    const identity = storedIdentity ?? { deviceId: uuid(), nextSeq: 1 };
    const entry: OutboxEntry = {
      seq: identity.nextSeq,
      mutationId: uuid(),
      deviceId: identity.deviceId,
      name,
      args,
      at: now.toISOString(),
      userId: user.id,
      entityId: entityIdOf(name, args),
      ticketId,
    };
    if (name === "photo.attached" && options.blob) {
      const sha256 = String(args.sha256);
      if (!(await db.photoBlobs.get(sha256))) {
        await db.photoBlobs.put({ sha256, blob: options.blob, mime: String(args.mime), bytes: Number(args.bytes), uploadedAt: null, uploadError: null });
      }
    }
    // The three writes go out together; any one failing aborts the transaction, so all or none are kept.
    await Promise.all([applyLocalEffect(db, entry), db.outbox.add(entry), writeMeta(db, "device", { ...identity, nextSeq: identity.nextSeq + 1 })]);
    return { mutationId: entry.mutationId, seq: entry.seq, id: entry.entityId };
  });
}

/**
 * Sends a refused change again as a new change (new id, next seq). A status change is re-based on the
 * header version this phone holds now. The server decides again; a second refusal comes back here.
 */
export async function retryAttention(mutationId: string, options: { db?: DeviceDb; now?: Date } = {}): Promise<Recorded> {
  const db = options.db ?? (await getDeviceDb());
  const now = options.now ?? new Date();
  return db.transaction("rw", db.tables, async () => {
    const item = await db.attention.get(mutationId);
    if (!item) throw new RecordError("not_found", "That change is no longer waiting for attention.");
    const user = await readDeviceUser(db);
    if (!user || user.id !== item.userId) throw new RecordError("not_signed_in", "Only the person who recorded this change can send it again.");
    const args = { ...item.args };
    if (item.name === "ticket.status_changed") {
      const t = await db.tickets.get(String(args.ticketId));
      if (!t) throw new RecordError("not_found", "This ticket is not on this phone any more (it was closed or removed).");
      args.baseVersion = t.version;
    }
    const identity = (await readIdentity(db)) ?? { deviceId: uuid(), nextSeq: 1 };
    const entry: OutboxEntry = {
      seq: identity.nextSeq,
      mutationId: uuid(),
      deviceId: identity.deviceId,
      name: item.name,
      args,
      at: now.toISOString(),
      userId: item.userId,
      entityId: item.entityId,
      ticketId: item.ticketId,
    };
    if (item.name === "photo.attached") {
      const blob = await db.photoBlobs.get(String(args.sha256));
      if (blob) await db.photoBlobs.put({ ...blob, uploadError: null });
    }
    await applyLocalEffect(db, entry, { rebase: true });
    await db.outbox.add(entry);
    await db.attention.delete(mutationId);
    await writeMeta(db, "device", { ...identity, nextSeq: identity.nextSeq + 1 });
    return { mutationId: entry.mutationId, seq: entry.seq, id: entry.entityId };
  });
}

/** Drops a refused change for good (the UI asks for confirmation first). */
export async function dismissAttention(mutationId: string, options: { db?: DeviceDb } = {}): Promise<AttentionEntry | undefined> {
  const db = options.db ?? (await getDeviceDb());
  return db.transaction("rw", db.tables, async () => {
    const item = await db.attention.get(mutationId);
    if (!item) return undefined;
    await db.attention.delete(mutationId);
    if (item.name === "photo.attached") await dropBlobIfUnused(db, String(item.args.sha256));
    return item;
  });
}

/** Deletes a photo's bytes once no waiting or refused change needs them. Inside a transaction. */
export async function dropBlobIfUnused(db: DeviceDb, sha256: string): Promise<void> {
  const uses = (e: OutboxEntry) => e.name === "photo.attached" && e.args.sha256 === sha256;
  if ((await db.outbox.filter(uses).count()) > 0) return;
  if ((await db.attention.filter(uses).count()) > 0) return;
  await db.photoBlobs.delete(sha256);
}
