import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { tickets, users } from "./core";

const stamp = (name: string) => integer(name, { mode: "timestamp_ms" });
const now = sql`(cast(unixepoch('subsecond') * 1000 as integer))`;

/** A bench device (one browser profile's store), bound to the person who first synced it. */
export const devices = sqliteTable(
  "devices",
  {
    /** Made by the device (a UUID). */
    id: text("id").primaryKey(),
    userId: text("user_id").notNull().references(() => users.id),
    /** Highest sequence number recorded from this device; the next push must start at lastSeq + 1. */
    lastSeq: integer("last_seq").notNull().default(0),
    /** What the device said it still holds at its last contact. */
    pendingCount: integer("pending_count").notNull().default(0),
    pendingTickets: text("pending_tickets", { mode: "json" })
      .$type<Array<{ ticketId: string; changes: number }>>()
      .notNull()
      .default(sql`'[]'`),
    reportedAt: stamp("reported_at"),
    userAgent: text("user_agent").notNull().default(""),
    createdAt: stamp("created_at").notNull().default(now),
    lastSeenAt: stamp("last_seen_at").notNull().default(now),
  },
  (t) => [index("devices_user_idx").on(t.userId)],
);

/** Every mutation the server has answered, applied or rejected: a retry gets the same answer. */
export const appliedMutations = sqliteTable(
  "applied_mutations",
  {
    mutationId: text("mutation_id").primaryKey(),
    deviceId: text("device_id").notNull().references(() => devices.id),
    seq: integer("seq").notNull(),
    name: text("name").notNull(),
    userId: text("user_id").notNull().references(() => users.id),
    outcome: text("outcome", { enum: ["applied", "rejected"] }).notNull(),
    reason: text("reason", { mode: "json" }).$type<{ code: string; message: string; fields?: Record<string, string> }>(),
    /** Kept for refused changes only (a retry's answer hands back the server's row they aimed at). */
    args: text("args", { mode: "json" }).$type<unknown>(),
    /** When the change was made on the device. */
    at: stamp("at").notNull(),
    appliedAt: stamp("applied_at").notNull().default(now),
  },
  (t) => [uniqueIndex("applied_mutations_device_seq_unique").on(t.deviceId, t.seq)],
);

/**
 * The server-wide version of every synced row: one line per row, moved to a new, higher version
 * (AUTOINCREMENT, never reused) each time the row changes. Written by SQLite triggers
 * (db/sql/sync-triggers.sql), so every writer is captured without knowing about sync.
 */
export const changeLog = sqliteTable(
  "change_log",
  {
    version: integer("version").primaryKey({ autoIncrement: true }),
    entity: text("entity").notNull(),
    entityId: text("entity_id").notNull(),
    /** insert | update | delete | touch (re-sent because the row entered the working set). */
    op: text("op").notNull(),
    at: integer("at").notNull(),
  },
  (t) => [uniqueIndex("change_log_entity_unique").on(t.entity, t.entityId)],
);

/** A header edit from a device that lost to a newer server value; the counter sees it and decides. */
export const syncConflicts = sqliteTable(
  "sync_conflicts",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    field: text("field").notNull(),
    deviceValue: text("device_value", { mode: "json" }).$type<unknown>().notNull(),
    serverValue: text("server_value", { mode: "json" }).$type<unknown>().notNull(),
    baseVersion: integer("base_version").notNull(),
    serverVersion: integer("server_version").notNull(),
    mutationId: text("mutation_id").notNull(),
    deviceId: text("device_id").notNull(),
    userId: text("user_id").notNull().references(() => users.id),
    createdAt: stamp("created_at").notNull().default(now),
    resolvedAt: stamp("resolved_at"),
    resolvedBy: text("resolved_by").references(() => users.id),
    resolution: text("resolution", { enum: ["kept_server", "used_device"] }),
  },
  (t) => [index("sync_conflicts_ticket_idx").on(t.ticketId), index("sync_conflicts_open_idx").on(t.resolvedAt)],
);
