import "server-only";
import { and, asc, desc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { auditLog, customers, machines, ticketHandbacks, ticketTags, tickets, users } from "@/db/schema";
import type { AuditEntry } from "./history-words";

/** Everything the counter's ticket page shows that lives in the core and counter tables. */
export function ticketDetail(db: Db, id: string) {
  const t = db.select().from(tickets).where(eq(tickets.id, id)).get();
  if (!t) return null;
  const customer = db.select().from(customers).where(eq(customers.id, t.customerId)).get()!;
  const machine = db.select().from(machines).where(eq(machines.id, t.machineId)).get()!;
  const name = (uid: string | null) => (uid ? (db.select({ name: users.name }).from(users).where(eq(users.id, uid)).get()?.name ?? null) : null);
  const comebackOf = t.comebackOfTicketId
    ? (db.select({ id: tickets.id, number: tickets.number, closedAt: tickets.closedAt }).from(tickets).where(eq(tickets.id, t.comebackOfTicketId)).get() ?? null)
    : null;
  const cameBackAs = db
    .select({ id: tickets.id, number: tickets.number, createdAt: tickets.createdAt })
    .from(tickets)
    .where(eq(tickets.comebackOfTicketId, t.id))
    .orderBy(asc(tickets.createdAt))
    .all();
  const history: AuditEntry[] = db
    .select({ at: auditLog.at, action: auditLog.action, details: auditLog.details, actorName: users.name })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(and(eq(auditLog.entity, "ticket"), eq(auditLog.entityId, t.id)))
    .orderBy(asc(auditLog.at), asc(auditLog.id))
    .all();
  return {
    ticket: t,
    customer,
    machine,
    techName: name(t.assignedTechId),
    createdByName: name(t.createdById),
    comebackOf,
    cameBackAs,
    retiredTags: db.select().from(ticketTags).where(eq(ticketTags.ticketId, t.id)).orderBy(desc(ticketTags.retiredAt)).all(),
    handBack: db.select().from(ticketHandbacks).where(eq(ticketHandbacks.ticketId, t.id)).get() ?? null,
    history,
  };
}
export type TicketDetail = NonNullable<ReturnType<typeof ticketDetail>>;
