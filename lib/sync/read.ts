/**
 * Typed reads of the device store for the bench screens. Each is a plain async function over Dexie, so
 * a screen wraps it in dexie-react-hooks' `useLiveQuery(() => benchEntriesFor(id), [id])` and re-renders
 * when the rows change (a sync, a recorded change, another tab).
 */
import { normalizeTagCode } from "../trade/tag-code";
import type {
  BenchEntryRow,
  CustomerRow,
  FindingRow,
  LaborEntryRow,
  MachineRow,
  PartUsedRow,
  PhotoRow,
  TicketNoteRow,
  TicketRow,
  TuneEntryRow,
} from "./protocol";
import { deviceDb, readDeviceUser, readSyncState, type AttentionEntry, type DeviceDb, type DeviceUser, type OutboxEntry, type SyncState } from "./device-db";

const pick = (db?: DeviceDb) => db ?? deviceDb();
const byTime = <T extends { at: string; id: string }>(a: T, b: T) => (a.at < b.at ? -1 : a.at > b.at ? 1 : a.id < b.id ? -1 : 1);

export interface TicketCard {
  ticket: TicketRow;
  machine: MachineRow | null;
  customer: CustomerRow | null;
  /** Assigned to the person signed in on this phone. */
  mine: boolean;
  /** Changes recorded on this phone for this ticket that have not reached the server. */
  waiting: number;
}

async function cards(db: DeviceDb, tickets: TicketRow[], me: string | null): Promise<TicketCard[]> {
  const machines = new Map((await db.machines.bulkGet(tickets.map((t) => t.machineId))).filter(Boolean).map((m) => [m!.id, m!]));
  const customers = new Map((await db.customers.bulkGet(tickets.map((t) => t.customerId))).filter(Boolean).map((c) => [c!.id, c!]));
  // Keys only (the ticketId index): the changes' args are never read here.
  const waiting = new Map<string, number>();
  for (const key of await db.outbox.orderBy("ticketId").keys()) {
    if (typeof key === "string") waiting.set(key, (waiting.get(key) ?? 0) + 1);
  }
  return tickets.map((ticket) => ({
    ticket,
    machine: machines.get(ticket.machineId) ?? null,
    customer: customers.get(ticket.customerId) ?? null,
    mine: me !== null && ticket.assignedTechId === me,
    waiting: waiting.get(ticket.id) ?? 0,
  }));
}

/**
 * Today's work: the open tickets on this phone, the signed-in tech's first, then unassigned ones, then
 * the rest; each group by promised date (none last), then ticket number.
 */
export async function ticketsForToday(db?: DeviceDb): Promise<TicketCard[]> {
  const d = pick(db);
  const me = (await readDeviceUser(d))?.id ?? null;
  const all = await d.tickets.toArray();
  const group = (t: TicketRow) => (me && t.assignedTechId === me ? 0 : t.assignedTechId === null ? 1 : 2);
  all.sort(
    (a, b) =>
      group(a) - group(b) ||
      (a.promisedDate ?? "9999").localeCompare(b.promisedDate ?? "9999") ||
      a.number - b.number,
  );
  return cards(d, all, me);
}

export async function ticketById(id: string, db?: DeviceDb): Promise<TicketCard | null> {
  const d = pick(db);
  const t = await d.tickets.get(id);
  if (!t) return null;
  const me = (await readDeviceUser(d))?.id ?? null;
  return (await cards(d, [t], me))[0] ?? null;
}

/** The open ticket with this repair-tag code (any spacing or case), or null. */
export async function ticketByTag(code: string, db?: DeviceDb): Promise<TicketCard | null> {
  const d = pick(db);
  const t = await d.tickets.where("tagCode").equals(normalizeTagCode(code)).first();
  return t ? ticketById(t.id, d) : null;
}

/** The machine with this permanent sticker code, and its open ticket on this phone if any. */
export async function machineBySticker(code: string, db?: DeviceDb): Promise<{ machine: MachineRow; openTicket: TicketRow | null } | null> {
  const d = pick(db);
  const machine = await d.machines.where("stickerCode").equals(normalizeTagCode(code)).first();
  if (!machine) return null;
  return { machine, openTicket: (await d.tickets.where("machineId").equals(machine.id).first()) ?? null };
}

export interface BenchSheetEntries {
  /** The newest entry per step that is not voided (what the sheet shows). */
  latest: Record<string, BenchEntryRow>;
  /** Every entry, voided ones included, oldest first (the history stays). */
  history: BenchEntryRow[];
}

/** A ticket's bench entries: latest per step plus the full history. */
export async function benchEntriesFor(ticketId: string, db?: DeviceDb): Promise<BenchSheetEntries> {
  const history = (await pick(db).benchEntries.where("ticketId").equals(ticketId).toArray()).sort(byTime);
  const latest: Record<string, BenchEntryRow> = {};
  for (const e of history) if (!e.voidedAt) latest[e.stepId] = e;
  return { latest, history };
}

/** A ticket's findings, oldest first (withdrawn ones included, marked). */
export async function findingsFor(ticketId: string, db?: DeviceDb): Promise<FindingRow[]> {
  return (await pick(db).findings.where("ticketId").equals(ticketId).toArray()).sort(byTime);
}

/** A ticket's tune log in time order (feed it to lib/trade/tune for net positions). */
export async function tuneEntriesFor(ticketId: string, db?: DeviceDb): Promise<TuneEntryRow[]> {
  return (await pick(db).tuneEntries.where("ticketId").equals(ticketId).toArray()).sort(byTime);
}

export type PhotoWithBlob = PhotoRow & { blob: Blob | null };

/** A ticket's photos; `blob` is set while the bytes are still on the phone (not yet uploaded). */
export async function photosFor(ticketId: string, db?: DeviceDb): Promise<PhotoWithBlob[]> {
  const d = pick(db);
  const rows = (await d.photos.where("ticketId").equals(ticketId).toArray()).sort(byTime);
  const blobs = await d.photoBlobs.bulkGet(rows.map((r) => r.sha256));
  return rows.map((r, i) => ({ ...r, blob: blobs[i]?.blob ?? null }));
}

/** A ticket's labor entries, oldest first; a running timer has `endedAt: null`. */
export async function laborFor(ticketId: string, db?: DeviceDb): Promise<LaborEntryRow[]> {
  return (await pick(db).laborEntries.where("ticketId").equals(ticketId).toArray()).sort((a, b) => (a.startedAt < b.startedAt ? -1 : 1));
}

export async function notesFor(ticketId: string, db?: DeviceDb): Promise<TicketNoteRow[]> {
  return (await pick(db).ticketNotes.where("ticketId").equals(ticketId).toArray()).sort(byTime);
}

export async function partsFor(ticketId: string, db?: DeviceDb): Promise<PartUsedRow[]> {
  return (await pick(db).partsUsed.where("ticketId").equals(ticketId).toArray()).sort(byTime);
}

/** Ids of the rows with a change still waiting to go out (row ids are UUIDs, unique across tables). Keys only. */
export async function waitingRowIds(db?: DeviceDb): Promise<Set<string>> {
  return new Set((await pick(db).outbox.orderBy("entityId").uniqueKeys()).map(String));
}

/** The outbox, oldest first. */
export async function outboxEntries(db?: DeviceDb): Promise<OutboxEntry[]> {
  return pick(db).outbox.orderBy("seq").toArray();
}

/** Changes the server refused, oldest first, each with the server's reason. */
export async function attentionEntries(db?: DeviceDb): Promise<AttentionEntry[]> {
  return pick(db).attention.orderBy("seq").toArray();
}

export interface SyncStatus extends SyncState {
  waiting: number;
  needsAttention: number;
  user: DeviceUser | null;
  tickets: number;
}

/** Everything the sync badge and page show (except online and progress, which live in memory). */
export async function syncStatus(db?: DeviceDb): Promise<SyncStatus> {
  const d = pick(db);
  const [state, waiting, needsAttention, user, tickets] = await Promise.all([
    readSyncState(d),
    d.outbox.count(),
    d.attention.count(),
    readDeviceUser(d),
    d.tickets.count(),
  ]);
  return { ...state, waiting, needsAttention, user, tickets };
}
