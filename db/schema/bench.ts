import { sql } from "drizzle-orm";
import { index, integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { tickets, users } from "./core";

/**
 * What the bench records against a ticket. These rows are append-only facts: a correction is a new
 * row (or a void / withdrawal mark on the old one), never an overwrite, so two devices never clobber
 * each other. Every id is made on the device that recorded the row. Times are ms since the epoch.
 */
const stamp = (name: string) => integer(name, { mode: "timestamp_ms" });
const now = sql`(cast(unixepoch('subsecond') * 1000 as integer))`;

type PartLine = { description: string; partNumber: string | null; qty: number };

/** Bench-sheet templates per machine kind; steps keep their ids across versions. */
export const procedures = sqliteTable("procedures", {
  id: text("id").primaryKey(),
  machineKind: text("machine_kind").notNull(),
  name: text("name").notNull(),
  version: integer("version").notNull().default(1),
  definition: text("definition", { mode: "json" }).$type<unknown>().notNull(),
  updatedAt: stamp("updated_at").notNull().default(now),
});

export const benchEntries = sqliteTable(
  "bench_entries",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    procedureId: text("procedure_id").notNull(),
    procedureVersion: integer("procedure_version").notNull(),
    stepId: text("step_id").notNull(),
    /** JSON, shaped by the step's kind (choice, pass/fail, reading with unit, …). */
    value: text("value", { mode: "json" }).$type<unknown>().notNull(),
    note: text("note"),
    at: stamp("at").notNull(),
    recordedBy: text("recorded_by").notNull().references(() => users.id),
    voidedAt: stamp("voided_at"),
    voidedBy: text("voided_by").references(() => users.id),
    voidReason: text("void_reason"),
  },
  (t) => [index("bench_entries_ticket_step_idx").on(t.ticketId, t.stepId)],
);

export const findings = sqliteTable(
  "findings",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    stepId: text("step_id"),
    grade: text("grade", { enum: ["cause", "due_soon", "advisory"] }).notNull(),
    title: text("title").notNull(),
    note: text("note").notNull().default(""),
    photoIds: text("photo_ids", { mode: "json" }).$type<string[]>().notNull().default(sql`'[]'`),
    suggestedParts: text("suggested_parts", { mode: "json" }).$type<PartLine[]>().notNull().default(sql`'[]'`),
    suggestedLaborMinutes: integer("suggested_labor_minutes"),
    alternatives: text("alternatives", { mode: "json" }).$type<Array<{ label: string; parts: PartLine[]; laborMinutes: number }>>(),
    /** A finding that turned out wrong is withdrawn (kept, struck through), never deleted. */
    withdrawn: integer("withdrawn", { mode: "boolean" }).notNull().default(false),
    createdBy: text("created_by").notNull().references(() => users.id),
    at: stamp("at").notNull(),
    changedAt: stamp("changed_at"),
    changedBy: text("changed_by").references(() => users.id),
    revision: integer("revision").notNull().default(1),
  },
  (t) => [index("findings_ticket_idx").on(t.ticketId)],
);

export const tuneEntries = sqliteTable(
  "tune_entries",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    screw: text("screw", { enum: ["low", "high", "idle"] }).notNull(),
    kind: text("kind", { enum: ["baseline", "turn"] }).notNull(),
    direction: text("direction", { enum: ["cw", "ccw"] }),
    eighths: integer("eighths").notNull(),
    baselineKind: text("baseline_kind", { enum: ["seated-then-out", "as-found"] }),
    at: stamp("at").notNull(),
    recordedBy: text("recorded_by").notNull().references(() => users.id),
  },
  (t) => [index("tune_entries_ticket_idx").on(t.ticketId)],
);

/** The bytes of every uploaded photo, named by their SHA-256 (files under DATA_DIR/photos). */
export const photoFiles = sqliteTable("photo_files", {
  sha256: text("sha256").primaryKey(),
  mime: text("mime").notNull(),
  bytes: integer("bytes").notNull(),
  /** File name under DATA_DIR/photos, made by the server. */
  fileName: text("file_name").notNull(),
  uploadedBy: text("uploaded_by").references(() => users.id),
  storedAt: stamp("stored_at").notNull().default(now),
});

export const photos = sqliteTable(
  "photos",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    sha256: text("sha256").notNull().references(() => photoFiles.sha256),
    mime: text("mime").notNull(),
    bytes: integer("bytes").notNull(),
    width: integer("width"),
    height: integer("height"),
    stepId: text("step_id"),
    findingId: text("finding_id"),
    caption: text("caption"),
    at: stamp("at").notNull(),
    takenBy: text("taken_by").notNull().references(() => users.id),
  },
  (t) => [index("photos_ticket_idx").on(t.ticketId)],
);

/** Labor time: started, then stopped; minutes are derived from the two times. */
export const laborEntries = sqliteTable(
  "labor_entries",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    userId: text("user_id").notNull().references(() => users.id),
    startedAt: stamp("started_at").notNull(),
    endedAt: stamp("ended_at"),
  },
  (t) => [index("labor_entries_ticket_idx").on(t.ticketId)],
);

export const ticketNotes = sqliteTable(
  "ticket_notes",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    text: text("text").notNull(),
    at: stamp("at").notNull(),
    authorId: text("author_id").notNull().references(() => users.id),
  },
  (t) => [index("ticket_notes_ticket_idx").on(t.ticketId)],
);

export const partsUsed = sqliteTable(
  "parts_used",
  {
    id: text("id").primaryKey(),
    ticketId: text("ticket_id").notNull().references(() => tickets.id),
    description: text("description").notNull(),
    partNumber: text("part_number"),
    qty: real("qty").notNull(),
    /** Set by the counter or the owner only; a bench technician never prices a part. */
    unitPriceCents: integer("unit_price_cents"),
    at: stamp("at").notNull(),
    recordedBy: text("recorded_by").notNull().references(() => users.id),
  },
  (t) => [index("parts_used_ticket_idx").on(t.ticketId)],
);
