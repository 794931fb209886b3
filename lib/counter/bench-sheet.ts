import "server-only";
import { inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { procedures, users } from "@/db/schema";
import { procedureSchema, type Procedure } from "@/lib/procedures/model";
import { benchSheetFor, listConflicts } from "@/lib/sync/server";
import { buildBenchSheetView, type BenchSheetView } from "./bench-sheet-view";

export type TicketConflict = ReturnType<typeof listConflicts>[number];

/** A ticket's synced bench sheet for the counter, with the sync conflicts still to decide. */
export function counterBenchSheet(db: Db, ticketId: string, now = new Date()): { view: BenchSheetView; conflicts: TicketConflict[] } {
  const rows = benchSheetFor(db, ticketId);
  const procedureIds = [...new Set(rows.bench_entry.map((e) => e.procedureId))];
  const defs = new Map<string, Procedure>();
  if (procedureIds.length) {
    for (const p of db.select({ id: procedures.id, definition: procedures.definition }).from(procedures).where(inArray(procedures.id, procedureIds)).all()) {
      const parsed = procedureSchema.safeParse(p.definition);
      if (parsed.success) defs.set(p.id, parsed.data);
    }
  }
  const people = new Map(db.select({ id: users.id, name: users.name }).from(users).all().map((u) => [u.id, u.name]));
  return { view: buildBenchSheetView(rows, defs, people, now), conflicts: listConflicts(db, { ticketId }) };
}
