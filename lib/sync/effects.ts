/**
 * How the device store changes: a recorded change applied locally, a server row (from a pull or a
 * rejection) put in place, and the tech's waiting changes re-applied on top of newer server rows.
 * Every function here runs inside the caller's Dexie read-write transaction over the whole store.
 *
 * Invariant: each pulled table holds the server's rows as last received, with every waiting outbox
 * change applied on top in sequence order. So the bench always shows what the tech recorded, and once
 * the outbox is empty the store is exactly the server's view.
 */
import { CREATING_MUTATIONS, MUTATION_ENTITY, type MutationArgs, type MutationName, type WireChange } from "./protocol";
import { ENTITY_TABLE, FACT_TABLES, type DeviceDb, type OutboxEntry } from "./device-db";
import { changedFinding, createdRow, isRefusal, stoppedLabor, ticketWithStatus, voidedEntry } from "./rows";

type Change = Pick<OutboxEntry, "name" | "args" | "userId">;

/**
 * Applies one change to the local rows. `rebase` (re-applying a waiting change over server rows) skips
 * changes whose ticket is not on the device any more and changes the rows no longer allow.
 */
export async function applyLocalEffect(db: DeviceDb, change: Change, options: { rebase?: boolean } = {}): Promise<void> {
  const { name, args, userId } = change;
  if ((CREATING_MUTATIONS as readonly string[]).includes(name)) {
    if (options.rebase && !(await db.tickets.get(String(args.ticketId)))) return;
    const row = createdRow(name as never, args as never, userId);
    await db.table(ENTITY_TABLE[MUTATION_ENTITY[name]]).put(row);
    return;
  }
  switch (name) {
    case "bench.entry.voided": {
      const row = await db.benchEntries.get(String(args.id));
      if (!row) return;
      const next = voidedEntry(row, args as MutationArgs<"bench.entry.voided">, userId);
      if (!isRefusal(next)) await db.benchEntries.put(next);
      return;
    }
    case "finding.changed": {
      const row = await db.findings.get(String(args.id));
      if (row) await db.findings.put(changedFinding(row, args as MutationArgs<"finding.changed">, userId));
      return;
    }
    case "labor.stopped": {
      const row = await db.laborEntries.get(String(args.id));
      if (!row) return;
      const next = stoppedLabor(row, args as MutationArgs<"labor.stopped">);
      if (!isRefusal(next)) await db.laborEntries.put(next);
      return;
    }
    case "ticket.status_changed": {
      const row = await db.tickets.get(String(args.ticketId));
      if (row) await db.tickets.put(ticketWithStatus(row, args as MutationArgs<"ticket.status_changed">));
      return;
    }
    default:
      throw new Error(`no local effect for ${String(name)}`);
  }
}

/** Puts one server row (or tombstone) in place. A ticket's tombstone also drops its bench facts. */
export async function applyServerChange(db: DeviceDb, change: WireChange): Promise<void> {
  const table = db.table(ENTITY_TABLE[change.entity]);
  if (change.op === "upsert") {
    await table.put(change.row);
    return;
  }
  await table.delete(change.id);
  if (change.entity === "ticket") {
    for (const t of FACT_TABLES) await db.table(t).where("ticketId").equals(change.id).delete();
  }
}

/**
 * Re-applies waiting changes (in sequence order) that touch the given rows, or any row of the given
 * tickets, after server rows replaced them.
 */
export async function rebase(db: DeviceDb, touched: Set<string>, tickets: Set<string>): Promise<void> {
  if (touched.size === 0 && tickets.size === 0) return;
  const waiting = await db.outbox.orderBy("seq").toArray();
  for (const e of waiting) {
    const key = `${MUTATION_ENTITY[e.name as MutationName]}:${e.entityId}`;
    if (touched.has(key) || (e.ticketId !== null && tickets.has(e.ticketId))) {
      await applyLocalEffect(db, e, { rebase: true });
    }
  }
}

/**
 * Applies a page of server changes (tombstones first, then rows in bulk per table) and re-applies the
 * waiting changes on top. A page is consistent as of one moment on the server: it never holds a row
 * and its own tombstone, nor facts of a ticket it tombstones.
 */
export async function applyServerChanges(db: DeviceDb, changes: readonly WireChange[]): Promise<void> {
  const touched = new Set<string>();
  const tickets = new Set<string>();
  const puts = new Map<string, unknown[]>();
  for (const c of changes) {
    touched.add(`${c.entity}:${c.id}`);
    if (c.op === "delete") await applyServerChange(db, c);
    else {
      const t = ENTITY_TABLE[c.entity];
      let list = puts.get(t);
      if (!list) puts.set(t, (list = []));
      list.push(c.row);
      if (c.entity === "ticket") tickets.add(c.id);
    }
  }
  for (const [t, rows] of puts) await db.table(t).bulkPut(rows);
  await rebase(db, touched, tickets);
}
