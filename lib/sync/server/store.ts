import "server-only";
import type Database from "better-sqlite3";
import type { Db } from "@/db/client";
import { CLOSED_STATUSES } from "@/lib/tickets/status";
import type { Entity, WireChange, WireRows } from "../protocol";

/**
 * Wire rows ⇄ SQLite rows for the synced tables, with cached prepared statements (the push and pull
 * paths run thousands of these per request). Times are ms integers in SQLite and ISO text on the wire.
 */
type Kind = "text" | "int" | "real" | "json" | "time" | "bool";
type Column = readonly [wire: string, column: string, kind: Kind];

interface TableMap {
  table: string;
  columns: readonly Column[];
}

const FACT_COLUMNS = {
  bench_entry: [
    ["id", "id", "text"],
    ["ticketId", "ticket_id", "text"],
    ["procedureId", "procedure_id", "text"],
    ["procedureVersion", "procedure_version", "int"],
    ["stepId", "step_id", "text"],
    ["value", "value", "json"],
    ["note", "note", "text"],
    ["at", "at", "time"],
    ["recordedBy", "recorded_by", "text"],
    ["voidedAt", "voided_at", "time"],
    ["voidedBy", "voided_by", "text"],
    ["voidReason", "void_reason", "text"],
  ],
  finding: [
    ["id", "id", "text"],
    ["ticketId", "ticket_id", "text"],
    ["stepId", "step_id", "text"],
    ["grade", "grade", "text"],
    ["title", "title", "text"],
    ["note", "note", "text"],
    ["photoIds", "photo_ids", "json"],
    ["suggestedParts", "suggested_parts", "json"],
    ["suggestedLaborMinutes", "suggested_labor_minutes", "int"],
    ["alternatives", "alternatives", "json"],
    ["withdrawn", "withdrawn", "bool"],
    ["createdBy", "created_by", "text"],
    ["at", "at", "time"],
    ["changedAt", "changed_at", "time"],
    ["changedBy", "changed_by", "text"],
    ["revision", "revision", "int"],
  ],
  tune_entry: [
    ["id", "id", "text"],
    ["ticketId", "ticket_id", "text"],
    ["screw", "screw", "text"],
    ["kind", "kind", "text"],
    ["direction", "direction", "text"],
    ["eighths", "eighths", "int"],
    ["baselineKind", "baseline_kind", "text"],
    ["at", "at", "time"],
    ["recordedBy", "recorded_by", "text"],
  ],
  photo: [
    ["id", "id", "text"],
    ["ticketId", "ticket_id", "text"],
    ["sha256", "sha256", "text"],
    ["mime", "mime", "text"],
    ["bytes", "bytes", "int"],
    ["width", "width", "int"],
    ["height", "height", "int"],
    ["stepId", "step_id", "text"],
    ["findingId", "finding_id", "text"],
    ["caption", "caption", "text"],
    ["at", "at", "time"],
    ["takenBy", "taken_by", "text"],
  ],
  labor_entry: [
    ["id", "id", "text"],
    ["ticketId", "ticket_id", "text"],
    ["userId", "user_id", "text"],
    ["startedAt", "started_at", "time"],
    ["endedAt", "ended_at", "time"],
  ],
  ticket_note: [
    ["id", "id", "text"],
    ["ticketId", "ticket_id", "text"],
    ["text", "text", "text"],
    ["at", "at", "time"],
    ["authorId", "author_id", "text"],
  ],
  part_used: [
    ["id", "id", "text"],
    ["ticketId", "ticket_id", "text"],
    ["description", "description", "text"],
    ["partNumber", "part_number", "text"],
    ["qty", "qty", "real"],
    ["unitPriceCents", "unit_price_cents", "int"],
    ["at", "at", "time"],
    ["recordedBy", "recorded_by", "text"],
  ],
} as const satisfies Record<string, readonly Column[]>;

export const TABLES: Record<Entity, TableMap> = {
  ticket: {
    table: "tickets",
    columns: [
      ["id", "id", "text"],
      ["number", "number", "int"],
      ["tagCode", "tag_code", "text"],
      ["machineId", "machine_id", "text"],
      ["customerId", "customer_id", "text"],
      ["status", "status", "text"],
      ["complaint", "complaint", "text"],
      ["complaintTags", "complaint_tags", "json"],
      ["intakeCondition", "intake_condition", "json"],
      ["accessories", "accessories", "text"],
      ["promisedDate", "promised_date", "text"],
      ["approvalLimitCents", "approval_limit_cents", "int"],
      ["assignedTechId", "assigned_tech_id", "text"],
      ["version", "version", "int"],
      ["createdAt", "created_at", "time"],
      ["updatedAt", "updated_at", "time"],
    ],
  },
  machine: {
    table: "machines",
    columns: [
      ["id", "id", "text"],
      ["customerId", "customer_id", "text"],
      ["kind", "kind", "text"],
      ["engineType", "engine_type", "text"],
      ["make", "make", "text"],
      ["model", "model", "text"],
      ["serial", "serial", "text"],
      ["displacementCc", "displacement_cc", "real"],
      ["stickerCode", "sticker_code", "text"],
      ["notes", "notes", "text"],
    ],
  },
  // Name and phone only: e-mail and the shop's notes never leave the server for a bench device.
  customer: {
    table: "customers",
    columns: [
      ["id", "id", "text"],
      ["firstName", "first_name", "text"],
      ["lastName", "last_name", "text"],
      ["phone", "phone", "text"],
    ],
  },
  procedure: {
    table: "procedures",
    columns: [
      ["id", "id", "text"],
      ["machineKind", "machine_kind", "text"],
      ["name", "name", "text"],
      ["version", "version", "int"],
      ["definition", "definition", "json"],
    ],
  },
  bench_entry: { table: "bench_entries", columns: FACT_COLUMNS.bench_entry },
  finding: { table: "findings", columns: FACT_COLUMNS.finding },
  tune_entry: { table: "tune_entries", columns: FACT_COLUMNS.tune_entry },
  photo: { table: "photos", columns: FACT_COLUMNS.photo },
  labor_entry: { table: "labor_entries", columns: FACT_COLUMNS.labor_entry },
  ticket_note: { table: "ticket_notes", columns: FACT_COLUMNS.ticket_note },
  part_used: { table: "parts_used", columns: FACT_COLUMNS.part_used },
};

export const FACT_TABLES = Object.keys(FACT_COLUMNS) as Array<keyof typeof FACT_COLUMNS>;

/** SQL list of the closed statuses, e.g. ('handed_back','returned_unrepaired'). */
export const CLOSED_SQL = `(${CLOSED_STATUSES.map((s) => `'${s}'`).join(", ")})`;

// ---------------------------------------------------------------------------------------------

const statements = new WeakMap<Database.Database, Map<string, Database.Statement>>();

/** A prepared statement, cached per connection. */
export function stmt(db: Db, sql: string): Database.Statement {
  const client = db.$client;
  let cache = statements.get(client);
  if (!cache) statements.set(client, (cache = new Map()));
  let s = cache.get(sql);
  if (!s) cache.set(sql, (s = client.prepare(sql)));
  return s;
}

function fromSql(kind: Kind, v: unknown): unknown {
  if (v === null || v === undefined) return null;
  switch (kind) {
    case "json":
      return JSON.parse(String(v));
    case "time":
      return new Date(Number(v)).toISOString();
    case "bool":
      return Boolean(v);
    default:
      return v;
  }
}

function toSql(kind: Kind, v: unknown): unknown {
  if (v === null || v === undefined) return null;
  switch (kind) {
    case "json":
      return JSON.stringify(v);
    case "time":
      return Date.parse(String(v));
    case "bool":
      return v ? 1 : 0;
    default:
      return v;
  }
}

const selectList = (m: TableMap, alias = "") => m.columns.map(([, c]) => `${alias}${c}`).join(", ");

export function toWire<E extends Entity>(entity: E, raw: Record<string, unknown>): WireRows[E] {
  const out: Record<string, unknown> = {};
  for (const [w, c, k] of TABLES[entity].columns) out[w] = fromSql(k, raw[c]);
  return out as WireRows[E];
}

/** The row as stored now, or null. */
export function readRow<E extends Entity>(db: Db, entity: E, id: string): WireRows[E] | null {
  const m = TABLES[entity];
  const raw = stmt(db, `SELECT ${selectList(m)} FROM ${m.table} WHERE id = ?`).get(id) as Record<string, unknown> | undefined;
  return raw ? toWire(entity, raw) : null;
}

/** Rows of one fact table for a ticket. */
export function factsOfTicket<E extends keyof typeof FACT_COLUMNS>(db: Db, entity: E, ticketId: string): WireRows[E][] {
  const m = TABLES[entity];
  return (stmt(db, `SELECT ${selectList(m)} FROM ${m.table} WHERE ticket_id = ? ORDER BY rowid`).all(ticketId) as Record<string, unknown>[]).map(
    (r) => toWire(entity, r),
  );
}

/** Inserts a fact row (from lib/sync/rows). */
export function insertRow(db: Db, entity: keyof typeof FACT_COLUMNS, row: Record<string, unknown>): void {
  const m = TABLES[entity];
  const sql = `INSERT INTO ${m.table} (${m.columns.map(([, c]) => c).join(", ")}) VALUES (${m.columns.map(() => "?").join(", ")})`;
  stmt(db, sql).run(...m.columns.map(([w, , k]) => toSql(k, row[w])));
}

/** Writes every column of an existing fact row. */
export function updateRow(db: Db, entity: keyof typeof FACT_COLUMNS, row: Record<string, unknown>): void {
  const m = TABLES[entity];
  const cols = m.columns.filter(([w]) => w !== "id");
  const sql = `UPDATE ${m.table} SET ${cols.map(([, c]) => `${c} = ?`).join(", ")} WHERE id = ?`;
  stmt(db, sql).run(...cols.map(([w, , k]) => toSql(k, row[w])), row.id);
}

export interface TicketHead {
  id: string;
  number: number;
  status: string;
  version: number;
  closedAt: number | null;
  open: boolean;
}

export function ticketHead(db: Db, id: string): TicketHead | null {
  const r = stmt(db, `SELECT id, number, status, version, closed_at, status NOT IN ${CLOSED_SQL} AS open FROM tickets WHERE id = ?`).get(id) as
    | { id: string; number: number; status: string; version: number; closed_at: number | null; open: number }
    | undefined;
  return r ? { id: r.id, number: r.number, status: r.status, version: r.version, closedAt: r.closed_at, open: r.open === 1 } : null;
}

const isFact = (e: Entity): e is keyof typeof FACT_COLUMNS => e in FACT_COLUMNS;

/**
 * The change a device needs for one row, judged against the working set as it is now: the row if it
 * belongs there, else a tombstone. Working set: open tickets, their machines and customers (name and
 * phone), every procedure, and the bench facts of open tickets.
 */
export function currentChange(db: Db, entity: Entity, id: string): WireChange {
  const gone: WireChange = { entity, op: "delete", id };
  if (entity === "ticket") {
    const head = ticketHead(db, id);
    if (!head?.open) return gone;
  } else if (entity === "machine" || entity === "customer") {
    const col = entity === "machine" ? "machine_id" : "customer_id";
    const used = stmt(db, `SELECT 1 FROM tickets WHERE ${col} = ? AND status NOT IN ${CLOSED_SQL} LIMIT 1`).get(id);
    if (!used) return gone;
  }
  const row = readRow(db, entity, id);
  if (!row) return gone;
  if (isFact(entity)) {
    const head = ticketHead(db, (row as { ticketId: string }).ticketId);
    if (!head?.open) return gone;
  }
  return { entity, op: "upsert", id, row } as WireChange;
}

/** The highest version in the change log (0 when empty). */
export function maxVersion(db: Db): number {
  const r = stmt(db, "SELECT max(version) AS v FROM change_log").get() as { v: number | null };
  return r.v ?? 0;
}
