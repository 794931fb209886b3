import "server-only";
import { and, asc, eq, inArray, like, or, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { customers, machines, ticketTags, tickets } from "@/db/schema";
import { OPEN_STATUSES, STATUS_LABELS, type TicketStatus } from "@/lib/tickets/status";
import { MACHINE_KIND_LABELS, type EngineType, type MachineKind } from "@/lib/tickets/machine";
import { checkTagCode } from "@/lib/trade/tag-code";
import { normalizeSerial, phoneDigits } from "./contact";

/** Escapes LIKE wildcards so what the counter types is matched literally. */
export function likeEscape(s: string): string {
  return s.replace(/[\\%_]/g, (c) => `\\${c}`);
}
const contains = (s: string) => `%${likeEscape(s)}%`;
const ESC = sql.raw("'\\'");

export interface CustomerHit {
  id: string;
  firstName: string;
  lastName: string;
  phone: string;
  email: string;
  contactPreference: "phone" | "text" | "email";
  emailConsent: boolean;
}

/** Customers by name ("ashdown", "marguerite ash"), phone digits ("5550142") or e-mail, surname first. */
export function searchCustomers(db: Pick<Db, "select">, q: string, limit = 8): CustomerHit[] {
  const text = q.trim();
  if (text.length < 2) return [];
  const words = text.split(/\s+/).slice(0, 4);
  const nameMatch = and(
    ...words.map((w) =>
      sql`(${customers.firstName} like ${contains(w)} escape ${ESC} or ${customers.lastName} like ${contains(w)} escape ${ESC})`,
    ),
  );
  const digits = phoneDigits(text);
  const conditions = [nameMatch, sql`${customers.email} like ${contains(text)} escape ${ESC}`];
  if (digits.length >= 3 && digits.length >= text.replace(/[\s().+-]/g, "").length) {
    conditions.push(
      sql`replace(replace(replace(replace(replace(replace(${customers.phone}, '-', ''), ' ', ''), '(', ''), ')', ''), '.', ''), '+', '') like ${contains(digits)}`,
    );
  }
  return db
    .select({
      id: customers.id,
      firstName: customers.firstName,
      lastName: customers.lastName,
      phone: customers.phone,
      email: customers.email,
      contactPreference: customers.contactPreference,
      emailConsent: customers.emailConsent,
    })
    .from(customers)
    .where(or(...conditions))
    .orderBy(asc(customers.lastName), asc(customers.firstName))
    .limit(limit)
    .all();
}

/** One customer's contact details, as intake shows them. */
export function getCustomer(db: Pick<Db, "select">, id: string): CustomerHit | undefined {
  return db
    .select({
      id: customers.id,
      firstName: customers.firstName,
      lastName: customers.lastName,
      phone: customers.phone,
      email: customers.email,
      contactPreference: customers.contactPreference,
      emailConsent: customers.emailConsent,
    })
    .from(customers)
    .where(eq(customers.id, id))
    .get();
}

export interface MachineHit {
  id: string;
  kind: MachineKind;
  kindLabel: string;
  engineType: EngineType;
  make: string;
  model: string;
  serial: string;
  stickerCode: string | null;
  customerId: string | null;
  customerName: string;
  openTickets: Array<{ id: string; number: number; status: TicketStatus; statusLabel: string }>;
}

function machineHits(db: Pick<Db, "select">, where: ReturnType<typeof and>, limit: number): MachineHit[] {
  const rows = db
    .select({
      id: machines.id,
      kind: machines.kind,
      engineType: machines.engineType,
      make: machines.make,
      model: machines.model,
      serial: machines.serial,
      stickerCode: machines.stickerCode,
      customerId: machines.customerId,
      firstName: customers.firstName,
      lastName: customers.lastName,
    })
    .from(machines)
    .leftJoin(customers, eq(customers.id, machines.customerId))
    .where(where)
    .orderBy(asc(machines.make), asc(machines.model))
    .limit(limit)
    .all();
  if (rows.length === 0) return [];
  const open = db
    .select({ id: tickets.id, number: tickets.number, status: tickets.status, machineId: tickets.machineId })
    .from(tickets)
    .where(and(inArray(tickets.machineId, rows.map((r) => r.id)), inArray(tickets.status, [...OPEN_STATUSES])))
    .all();
  return rows.map(({ firstName, lastName, ...r }) => ({
    ...r,
    kindLabel: MACHINE_KIND_LABELS[r.kind],
    customerName: lastName ? `${firstName ?? ""} ${lastName}`.trim() : "",
    openTickets: open
      .filter((t) => t.machineId === r.id)
      .map(({ machineId: _m, ...t }) => ({ ...t, statusLabel: STATUS_LABELS[t.status] })),
  }));
}

/** The machine a tag code points at: a ticket's tag (current or retired) or a permanent sticker. */
export function machineIdForCode(db: Pick<Db, "select">, code: string): string | undefined {
  return (
    db.select({ id: tickets.machineId }).from(tickets).where(eq(tickets.tagCode, code)).get()?.id ??
    db
      .select({ id: tickets.machineId })
      .from(ticketTags)
      .innerJoin(tickets, eq(tickets.id, ticketTags.ticketId))
      .where(eq(ticketTags.code, code))
      .get()?.id ??
    db.select({ id: machines.id }).from(machines).where(eq(machines.stickerCode, code)).get()?.id
  );
}

/** SQL for a machine's serial compared the way normalizeSerial does it. */
export const serialKey = sql`upper(replace(replace(replace(replace(${machines.serial}, ' ', ''), '-', ''), '.', ''), '/', ''))`;

/** Machines by tag or sticker code (exact), or by serial (any part of it); with `byName`, also by make and model. */
export function searchMachines(db: Pick<Db, "select">, q: string, limit = 8, opts: { byName?: boolean } = {}): MachineHit[] {
  const text = q.trim();
  if (text.length < 2) return [];
  const code = checkTagCode(text);
  if (code.ok) {
    const id = machineIdForCode(db, code.value);
    if (id) return machineHits(db, and(eq(machines.id, id)), 1);
  }
  const key = normalizeSerial(text);
  if (!key) return [];
  const bySerial = sql`${serialKey} like ${contains(key)} escape ${ESC}`;
  if (!opts.byName) return machineHits(db, and(bySerial), limit);
  const byName = sql`(${machines.make} || ' ' || ${machines.model}) like ${contains(text)} escape ${ESC}`;
  return machineHits(db, and(or(bySerial, byName)), limit);
}

/** One machine with its owner's name and open tickets. */
export function getMachine(db: Pick<Db, "select">, id: string): MachineHit | undefined {
  return machineHits(db, and(eq(machines.id, id)), 1)[0];
}

/** A customer's machines (for intake: pick one of theirs). */
export function machinesOfCustomer(db: Pick<Db, "select">, customerId: string): MachineHit[] {
  return machineHits(db, and(eq(machines.customerId, customerId)), 50);
}

/** `column LIKE %s%` with the wildcards in `s` escaped (one place for LIKE escaping). */
export const likeContains = (column: Parameters<typeof like>[0], s: string) => sql`${column} like ${contains(s)} escape ${ESC}`;
