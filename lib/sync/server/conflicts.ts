import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import type { Db } from "@/db/client";
import { syncConflicts, tickets, users } from "@/db/schema";
import { audit } from "@/lib/audit/log";
import { AppError } from "@/lib/http/errors";
import { CLOSED_STATUSES, TICKET_STATUSES, type TicketStatus } from "@/lib/tickets/status";

/**
 * Header edits from a device that lost to a newer server value. The server's value stood; the device's
 * is kept here for the counter to see and decide.
 */
export function listConflicts(db: Db, options: { ticketId?: string; includeResolved?: boolean } = {}) {
  const where = [];
  if (options.ticketId) where.push(eq(syncConflicts.ticketId, options.ticketId));
  if (!options.includeResolved) where.push(isNull(syncConflicts.resolvedAt));
  return db
    .select({
      id: syncConflicts.id,
      ticketId: syncConflicts.ticketId,
      ticketNumber: tickets.number,
      field: syncConflicts.field,
      deviceValue: syncConflicts.deviceValue,
      serverValue: syncConflicts.serverValue,
      baseVersion: syncConflicts.baseVersion,
      serverVersion: syncConflicts.serverVersion,
      userName: users.name,
      createdAt: syncConflicts.createdAt,
      resolvedAt: syncConflicts.resolvedAt,
      resolution: syncConflicts.resolution,
    })
    .from(syncConflicts)
    .innerJoin(tickets, eq(tickets.id, syncConflicts.ticketId))
    .innerJoin(users, eq(users.id, syncConflicts.userId))
    .where(where.length ? and(...where) : undefined)
    .orderBy(asc(syncConflicts.createdAt))
    .all();
}

/** The counter decides: keep the server's value, or use the one the device sent (a normal ticket update). */
export function resolveConflict(db: Db, input: { conflictId: string; userId: string; resolution: "kept_server" | "used_device" }): void {
  db.transaction((tx) => {
    const c = tx.select().from(syncConflicts).where(eq(syncConflicts.id, input.conflictId)).get();
    if (!c) throw new AppError("not_found", "That conflict is not on record.");
    if (c.resolvedAt) throw new AppError("conflict", "That conflict was already resolved.");
    if (input.resolution === "used_device") {
      if (c.field !== "status") throw new AppError("validation", `Unknown field "${c.field}".`);
      const status = c.deviceValue as TicketStatus;
      if (!TICKET_STATUSES.includes(status)) throw new AppError("validation", "The device's value is not a status.");
      const t = tx.select({ status: tickets.status }).from(tickets).where(eq(tickets.id, c.ticketId)).get();
      if (!t) throw new AppError("not_found", "The ticket is gone.");
      if (CLOSED_STATUSES.includes(t.status)) throw new AppError("conflict", "The ticket is closed; reopen it first.");
      tx.update(tickets).set({ status, updatedAt: new Date() }).where(eq(tickets.id, c.ticketId)).run();
      audit(tx, { actorId: input.userId, action: "ticket.status_changed", entity: "ticket", entityId: c.ticketId, details: { from: t.status, to: status, via: "sync conflict" } });
    }
    tx.update(syncConflicts)
      .set({ resolvedAt: new Date(), resolvedBy: input.userId, resolution: input.resolution })
      .where(eq(syncConflicts.id, input.conflictId))
      .run();
  });
}
