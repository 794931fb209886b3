import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { tickets, users } from "./core";

/** Milliseconds since the epoch, stored as an integer. */
const stamp = (name: string) => integer(name, { mode: "timestamp_ms" });
const now = sql`(cast(unixepoch('subsecond') * 1000 as integer))`;

/**
 * Tag codes a ticket no longer carries: the tag came off and a new one was printed.
 * A retired code is never handed out again; scanning it answers "replaced" with the ticket's current code.
 */
export const ticketTags = sqliteTable(
  "ticket_tags",
  {
    code: text("code").primaryKey(),
    ticketId: text("ticket_id")
      .notNull()
      .references(() => tickets.id),
    retiredAt: stamp("retired_at").notNull().default(now),
    retiredById: text("retired_by_id").references(() => users.id),
    reason: text("reason").notNull().default(""),
  },
  (t) => [index("ticket_tags_ticket_idx").on(t.ticketId)],
);

export const HANDBACK_OUTCOMES = ["handed_back", "returned_unrepaired"] as const;

/** Who collected the machine and when; written once, when the ticket closes. */
export const ticketHandbacks = sqliteTable("ticket_handbacks", {
  ticketId: text("ticket_id")
    .primaryKey()
    .references(() => tickets.id),
  outcome: text("outcome", { enum: HANDBACK_OUTCOMES }).notNull(),
  collectedBy: text("collected_by").notNull(),
  collectedAt: stamp("collected_at").notNull(),
  note: text("note").notNull().default(""),
  recordedById: text("recorded_by_id").references(() => users.id),
  recordedAt: stamp("recorded_at").notNull().default(now),
});
