import "server-only";
import { z } from "zod";
import type { Db } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/guard";
import { AppError } from "@/lib/http/errors";
import { FACT_ENTITIES, PROTOCOL_VERSION, decodePendingTickets, type Entity, type PullQuery, type PullResponse, type WireChange } from "../protocol";
import { bindDevice, storeReport } from "./devices";
import { CLOSED_SQL, TABLES, currentChange, factsOfTicket, maxVersion, readRow, stmt, toWire } from "./store";

/**
 * Pull: the changes a device needs, in pages.
 *
 * - A fresh device (cursor 0) gets a snapshot of the working set: procedures, then the tickets assigned
 *   to the person, then every other open ticket, each with its machine, customer and bench facts. The
 *   snapshot is taken "as of" the highest version when it started; its pages carry an opaque token and
 *   cursor 0, and the last page moves the cursor to that version. Anything that changes meanwhile has a
 *   higher version, so the incremental pulls after it deliver it.
 * - Later pulls read change_log rows with version > cursor (one row per synced row, at its latest
 *   version) and send each row as it is now, or a tombstone when it was deleted or left the working set.
 */
const snapshotToken = z.object({
  v: z.number().int().min(0),
  /** 0 = procedures, 1 = the person's tickets, 2 = other open tickets. */
  p: z.union([z.literal(0), z.literal(1), z.literal(2)]),
  a: z.union([z.string(), z.number()]).nullable(),
});
type SnapshotToken = z.infer<typeof snapshotToken>;

const encode = (t: SnapshotToken) => Buffer.from(JSON.stringify(t)).toString("base64url");
function decode(s: string): SnapshotToken {
  try {
    return snapshotToken.parse(JSON.parse(Buffer.from(s, "base64url").toString("utf8")));
  } catch {
    throw new AppError("validation", "The pull's continuation token is not valid. Start the pull again from the beginning.", {
      fields: { snapshot: "Not a token this server made." },
    });
  }
}

function ticketBundle(db: Db, ticketRaw: Record<string, unknown>, seen: Set<string>, out: WireChange[]): void {
  const ticket = toWire("ticket", ticketRaw);
  for (const [entity, id] of [
    ["machine", ticket.machineId],
    ["customer", ticket.customerId],
  ] as const) {
    const key = `${entity}:${id}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const row = readRow(db, entity, id);
    if (row) out.push({ entity, op: "upsert", id, row } as WireChange);
  }
  out.push({ entity: "ticket", op: "upsert", id: ticket.id, row: ticket });
  for (const entity of FACT_ENTITIES) {
    for (const row of factsOfTicket(db, entity, ticket.id)) out.push({ entity, op: "upsert", id: row.id, row } as WireChange);
  }
}

const TICKET_COLUMNS = TABLES.ticket.columns.map(([, c]) => c).join(", ");

function snapshotPage(db: Db, user: CurrentUser, token: SnapshotToken, limit: number): PullResponse {
  const changes: WireChange[] = [];
  const seen = new Set<string>();
  let t: SnapshotToken | null = token;
  while (t && changes.length < limit) {
    if (t.p === 0) {
      const room = limit - changes.length;
      const rows = stmt(db, `SELECT ${TABLES.procedure.columns.map(([, c]) => c).join(", ")} FROM procedures WHERE id > ? ORDER BY id LIMIT ?`).all(
        t.a ?? "",
        room,
      ) as Record<string, unknown>[];
      for (const r of rows) {
        const row = toWire("procedure", r);
        changes.push({ entity: "procedure", op: "upsert", id: row.id, row });
      }
      t = rows.length < room ? { v: t.v, p: 1, a: null } : { v: t.v, p: 0, a: String(rows.at(-1)!.id) };
      continue;
    }
    const mine: boolean = t.p === 1;
    // Phase 2 also takes the person's tickets that changed after the snapshot began: one reassigned to
    // them after phase 1 passed must still arrive whole (with its machine, customer and facts).
    const next = mine
      ? stmt(db, `SELECT ${TICKET_COLUMNS} FROM tickets WHERE assigned_tech_id = ? AND status NOT IN ${CLOSED_SQL} AND number > ? ORDER BY number LIMIT 1`)
      : stmt(
          db,
          `SELECT ${TABLES.ticket.columns.map(([, c]) => `t.${c}`).join(", ")} FROM tickets t
             LEFT JOIN change_log cl ON cl.entity = 'ticket' AND cl.entity_id = t.id
            WHERE (t.assigned_tech_id IS NULL OR t.assigned_tech_id <> ? OR cl.version > ?)
              AND t.status NOT IN ${CLOSED_SQL} AND t.number > ? ORDER BY t.number LIMIT 1`,
        );
    let after: number = typeof t.a === "number" ? t.a : -1;
    let exhausted = false;
    while (changes.length < limit) {
      const raw = (mine ? next.get(user.id, after) : next.get(user.id, t.v, after)) as Record<string, unknown> | undefined;
      if (!raw) {
        exhausted = true;
        break;
      }
      ticketBundle(db, raw, seen, changes);
      after = Number(raw.number);
    }
    if (exhausted) t = mine ? { v: t.v, p: 2, a: null } : null;
    else t = { v: t.v, p: t.p, a: after };
  }
  if (t) {
    return { protocolVersion: PROTOCOL_VERSION, changes, cursor: 0, snapshot: encode(t), more: true, remaining: snapshotRemaining(db, user, t) };
  }
  const newer = stmt(db, "SELECT count(*) AS n FROM change_log WHERE version > ?").get(token.v) as { n: number };
  return { protocolVersion: PROTOCOL_VERSION, changes, cursor: token.v, snapshot: null, more: newer.n > 0, remaining: newer.n };
}

/** Roughly how many changes the snapshot still has to send (three per ticket: ticket, machine, customer). */
function snapshotRemaining(db: Db, user: CurrentUser, t: SnapshotToken): number {
  const after = typeof t.a === "number" ? t.a : -1;
  const open = `status NOT IN ${CLOSED_SQL}`;
  const count = (where: string, num: number) =>
    (stmt(db, `SELECT count(*) AS n FROM tickets WHERE ${where} AND ${open} AND number > ?`).get(user.id, num) as { n: number }).n;
  const mine = t.p === 0 ? count("assigned_tech_id = ?", -1) : t.p === 1 ? count("assigned_tech_id = ?", after) : 0;
  const others = count("(assigned_tech_id IS NULL OR assigned_tech_id <> ?)", t.p === 2 ? after : -1);
  return (mine + others) * 3;
}

function incrementalPage(db: Db, cursor: number, limit: number): PullResponse {
  const rows = stmt(db, "SELECT version, entity, entity_id FROM change_log WHERE version > ? ORDER BY version LIMIT ?").all(cursor, limit) as Array<{
    version: number;
    entity: Entity;
    entity_id: string;
  }>;
  const changes: WireChange[] = [];
  for (const r of rows) {
    if (!(r.entity in TABLES)) continue;
    changes.push(currentChange(db, r.entity, r.entity_id));
  }
  const next = rows.length ? rows.at(-1)!.version : cursor;
  const left = (stmt(db, "SELECT count(*) AS n FROM change_log WHERE version > ?").get(next) as { n: number }).n;
  return { protocolVersion: PROTOCOL_VERSION, changes, cursor: next, snapshot: null, more: left > 0, remaining: left };
}

/** One page of changes for the device. Binds the device to the user on first contact. */
export function pullChanges(db: Db, user: CurrentUser, q: PullQuery, meta: { userAgent?: string } = {}): PullResponse {
  if (q.v !== PROTOCOL_VERSION) {
    throw new AppError("upgrade_required", "This app is out of date for the server. Reload it to update, then sync again; nothing was lost.");
  }
  // Read everything in one transaction so the page is consistent; the device write is small.
  return db.$client.transaction((): PullResponse => {
    bindDevice(db, q.deviceId, user, meta.userAgent);
    if (q.pending !== undefined) storeReport(db, q.deviceId, { count: q.pending, tickets: decodePendingTickets(q.pendingTickets) });
    else stmt(db, "UPDATE devices SET last_seen_at = ? WHERE id = ?").run(Date.now(), q.deviceId);
    if (q.snapshot) return snapshotPage(db, user, decode(q.snapshot), q.limit);
    if (q.cursor === 0) return snapshotPage(db, user, { v: maxVersion(db), p: 0, a: null }, q.limit);
    const top = maxVersion(db);
    if (q.cursor > top) {
      throw new AppError("conflict", "This phone has seen changes the server does not have (the server was restored?). The phone will fetch everything again; your waiting changes are kept.", {
        fields: { cursor: `The server is at version ${top}.` },
      });
    }
    return incrementalPage(db, q.cursor, q.limit);
  })();
}

/** The whole working set as a fresh device would hold it (for tests and tools; not paged). */
export function serverView(db: Db): Map<string, unknown> {
  const view = new Map<string, unknown>();
  const changes: WireChange[] = [];
  for (const r of stmt(db, `SELECT ${TABLES.procedure.columns.map(([, c]) => c).join(", ")} FROM procedures`).all() as Record<string, unknown>[]) {
    const row = toWire("procedure", r);
    changes.push({ entity: "procedure", op: "upsert", id: row.id, row });
  }
  const seen = new Set<string>();
  for (const raw of stmt(db, `SELECT ${TICKET_COLUMNS} FROM tickets WHERE status NOT IN ${CLOSED_SQL}`).all() as Record<string, unknown>[]) {
    ticketBundle(db, raw, seen, changes);
  }
  for (const c of changes) if (c.op === "upsert") view.set(`${c.entity}:${c.id}`, c.row);
  return view;
}
