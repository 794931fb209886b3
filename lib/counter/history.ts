import "server-only";
import { asc, desc, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { customers, machines, ticketHandbacks, ticketTags, tickets, users } from "@/db/schema";
import { complaintSummary } from "@/lib/tickets/intake";
import { getMachine, searchCustomers, searchMachines, type CustomerHit, type MachineHit } from "./search";

export interface HistoryTicket {
  id: string;
  number: number;
  tagCode: string;
  status: (typeof tickets.$inferSelect)["status"];
  complaint: string;
  createdAt: Date;
  closedAt: Date | null;
  techName: string | null;
  comebackOf: { id: string; number: number } | null;
  handBack: { outcome: string; collectedBy: string; collectedAt: Date } | null;
  retiredCodes: string[];
}

/** Every ticket of these machines, newest first, grouped by machine id. */
function ticketsOfMachines(db: Pick<Db, "select">, machineIds: string[]): Map<string, HistoryTicket[]> {
  const out = new Map<string, HistoryTicket[]>(machineIds.map((id) => [id, []]));
  if (!machineIds.length) return out;
  const rows = db
    .select({ t: tickets, techName: users.name, hb: ticketHandbacks })
    .from(tickets)
    .leftJoin(users, eq(users.id, tickets.assignedTechId))
    .leftJoin(ticketHandbacks, eq(ticketHandbacks.ticketId, tickets.id))
    .where(inArray(tickets.machineId, machineIds))
    .orderBy(desc(tickets.createdAt))
    .all();
  const ids = rows.map((r) => r.t.id);
  const retired = ids.length ? db.select().from(ticketTags).where(inArray(ticketTags.ticketId, ids)).orderBy(asc(ticketTags.retiredAt)).all() : [];
  const numbers = new Map(rows.map((r) => [r.t.id, r.t.number]));
  const missing = rows.map((r) => r.t.comebackOfTicketId).filter((x): x is string => Boolean(x) && !numbers.has(x!));
  if (missing.length) {
    for (const r of db.select({ id: tickets.id, number: tickets.number }).from(tickets).where(inArray(tickets.id, missing)).all()) numbers.set(r.id, r.number);
  }
  for (const { t, techName, hb } of rows) {
    out.get(t.machineId)!.push({
      id: t.id,
      number: t.number,
      tagCode: t.tagCode,
      status: t.status,
      complaint: complaintSummary(t.complaintTags, t.complaint),
      createdAt: t.createdAt,
      closedAt: t.closedAt,
      techName,
      comebackOf: t.comebackOfTicketId ? { id: t.comebackOfTicketId, number: numbers.get(t.comebackOfTicketId) ?? 0 } : null,
      handBack: hb ? { outcome: hb.outcome, collectedBy: hb.collectedBy, collectedAt: hb.collectedAt } : null,
      retiredCodes: retired.filter((r) => r.ticketId === t.id).map((r) => r.code),
    });
  }
  return out;
}

export function machineHistory(db: Db, machineId: string) {
  const machine = getMachine(db, machineId);
  if (!machine) return null;
  const owner = machine.customerId ? db.select().from(customers).where(eq(customers.id, machine.customerId)).get() ?? null : null;
  const full = db.select().from(machines).where(eq(machines.id, machineId)).get()!;
  return { machine, engineType: full.engineType, owner, tickets: ticketsOfMachines(db, [machineId]).get(machineId) ?? [] };
}

export function customerHistory(db: Db, customerId: string) {
  const customer = db.select().from(customers).where(eq(customers.id, customerId)).get();
  if (!customer) return null;
  const owned = db.select({ id: machines.id }).from(machines).where(eq(machines.customerId, customerId)).all().map((m) => m.id);
  // Machines that came in on this customer's tickets but are on file under someone else count too.
  const viaTickets = db.select({ id: tickets.machineId }).from(tickets).where(eq(tickets.customerId, customerId)).all().map((t) => t.id);
  const ids = [...new Set([...owned, ...viaTickets])];
  const byMachine = ticketsOfMachines(db, ids);
  const list = ids
    .map((id) => ({ machine: getMachine(db, id)!, tickets: byMachine.get(id) ?? [] }))
    .sort((a, b) => (b.tickets[0]?.createdAt.getTime() ?? 0) - (a.tickets[0]?.createdAt.getTime() ?? 0));
  return { customer, machines: list };
}

/** History search: machines by serial, make and model or any tag/sticker code; customers by name, phone or e-mail. */
export function historySearch(db: Db, q: string): { machines: MachineHit[]; customers: CustomerHit[] } {
  return { machines: searchMachines(db, q, 20, { byName: true }), customers: searchCustomers(db, q, 20) };
}
