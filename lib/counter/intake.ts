import "server-only";
import crypto from "node:crypto";
import { and, desc, eq, inArray, ne, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { customers, machines, photoFiles, photos, tickets } from "@/db/schema";
import { audit } from "@/lib/audit/log";
import { getShopSettings } from "@/lib/shop/settings";
import { MACHINE_KIND_LABELS } from "@/lib/tickets/machine";
import { OPEN_STATUSES, STATUS_LABELS } from "@/lib/tickets/status";
import { insertTicket } from "@/lib/tickets/tickets";
import { normalizeSerial } from "./contact";
import { zodFields } from "@/lib/http/errors";
import { DAY_MS, dateIn } from "./dates";
import { intakeSchema, type IntakeInput } from "./intake-schema";
import { isActiveTech } from "./people";
import { serialKey } from "./search";
import { INTAKE_PHOTO_STEP } from "./bench-sheet-view";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export interface DuplicateMachine {
  machineId: string;
  label: string;
  serial: string;
  customerId: string | null;
  customerName: string;
}

export type IntakeResult =
  | { ok: true; ticketId: string; number: number; tagCode: string; comebackOfTicketId: string | null }
  | { ok: false; message: string; fields: Record<string, string>; duplicates?: DuplicateMachine[] };


/** Machines already on file with the same serial (case, spaces and dashes ignored). */
export function findMachinesBySerial(db: Pick<Db, "select">, serial: string, exceptMachineId?: string): DuplicateMachine[] {
  const key = normalizeSerial(serial);
  if (!key) return [];
  const rows = db
    .select({
      machineId: machines.id,
      kind: machines.kind,
      make: machines.make,
      model: machines.model,
      serial: machines.serial,
      customerId: machines.customerId,
      firstName: customers.firstName,
      lastName: customers.lastName,
    })
    .from(machines)
    .leftJoin(customers, eq(customers.id, machines.customerId))
    .where(exceptMachineId ? and(sql`${serialKey} = ${key}`, ne(machines.id, exceptMachineId)) : sql`${serialKey} = ${key}`)
    .limit(5)
    .all();
  return rows.map((r) => ({
    machineId: r.machineId,
    label: `${r.make} ${r.model}`.trim() + ` (${MACHINE_KIND_LABELS[r.kind].toLowerCase()})`,
    serial: r.serial,
    customerId: r.customerId,
    customerName: r.lastName ? `${r.firstName} ${r.lastName}`.trim() : "no customer on file",
  }));
}

/**
 * The earlier ticket this intake is a comeback of: the machine's latest hand-back (status handed_back)
 * no more than `windowDays` before `now`. A window of 0 days turns comeback marking off.
 */
export function findComebackOf(db: Pick<Db, "select">, machineId: string, now: number, windowDays: number): string | null {
  if (windowDays <= 0) return null;
  const last = db
    .select({ id: tickets.id, closedAt: tickets.closedAt })
    .from(tickets)
    .where(and(eq(tickets.machineId, machineId), eq(tickets.status, "handed_back")))
    .orderBy(desc(tickets.closedAt))
    .get();
  if (!last?.closedAt) return null;
  const since = now - last.closedAt.getTime();
  return since >= 0 && since <= windowDays * DAY_MS ? last.id : null;
}

/** Open tickets of a machine (a second intake of the same machine is allowed but flagged on screen). */
export function openTicketsOfMachine(db: Pick<Db, "select">, machineId: string) {
  return db
    .select({ id: tickets.id, number: tickets.number, status: tickets.status })
    .from(tickets)
    .where(and(eq(tickets.machineId, machineId), inArray(tickets.status, [...OPEN_STATUSES])))
    .all()
    .map((t) => ({ ...t, statusLabel: STATUS_LABELS[t.status] }));
}

/** Thrown inside the transaction so nothing written before the refusal is kept. */
class IntakeRefused extends Error {
  constructor(readonly result: Extract<IntakeResult, { ok: false }>) {
    super(result.message);
  }
}

function fail(fields: Record<string, string>, message = "Some fields need attention.", duplicates?: DuplicateMachine[]): never {
  throw new IntakeRefused(duplicates ? { ok: false, message, fields, duplicates } : { ok: false, message, fields });
}

/**
 * Takes a machine in: finds or creates the customer and the machine, then the ticket with its number and
 * tag code, all in one transaction. Input has been through intakeSchema; this adds the checks that need
 * the database (the customer and machine exist, the tech is active, a duplicate serial is confirmed).
 */
export function createIntake(db: Db, input: IntakeInput, actorId: string | null, now: number = Date.now()): IntakeResult {
  const settings = getShopSettings(db);
  try {
    return db.transaction((tx: Tx) => intakeIn(tx, input, actorId, now, settings.comebackWindowDays));
  } catch (err) {
    if (err instanceof IntakeRefused) return err.result;
    throw err;
  }
}

function intakeIn(tx: Tx, input: IntakeInput, actorId: string | null, now: number, comebackWindowDays: number): IntakeResult {
  const at = new Date(now);

  // Customer: an existing one gets the contact details as confirmed at the counter.
  let customerId = input.customer.id;
  const c = input.customer;
  if (customerId) {
    const existing = tx.select().from(customers).where(eq(customers.id, customerId)).get();
    if (!existing) fail({ customerId: "That customer is no longer on file. Search again." });
    const changes: Record<string, unknown> = {};
    for (const k of ["firstName", "lastName", "phone", "email", "contactPreference", "emailConsent"] as const) {
      if (existing[k] !== c[k]) changes[k] = c[k];
    }
    if (Object.keys(changes).length) {
      tx.update(customers).set({ ...changes, updatedAt: at }).where(eq(customers.id, customerId)).run();
      audit(tx, { actorId, action: "customer.updated", entity: "customer", entityId: customerId, details: { fields: Object.keys(changes) } });
    }
  } else {
    customerId = crypto.randomUUID();
    tx.insert(customers)
      .values({
        id: customerId,
        firstName: c.firstName,
        lastName: c.lastName,
        phone: c.phone,
        email: c.email,
        contactPreference: c.contactPreference,
        emailConsent: c.emailConsent,
        createdAt: at,
        updatedAt: at,
      })
      .run();
    audit(tx, { actorId, action: "customer.created", entity: "customer", entityId: customerId, details: { emailConsent: c.emailConsent } });
  }

  // Machine: an existing one (its owner is set when it had none), or a new one, refusing an unconfirmed duplicate serial.
  const mi = input.machine;
  let machineId: string;
  let comebackOfTicketId: string | null = null;
  if (mi.id !== null) {
    machineId = mi.id;
    const m = tx.select({ id: machines.id, customerId: machines.customerId }).from(machines).where(eq(machines.id, mi.id)).get();
    if (!m) fail({ machineId: "That machine is no longer on file. Search again." });
    if (!m.customerId) tx.update(machines).set({ customerId, updatedAt: at }).where(eq(machines.id, m.id)).run();
    comebackOfTicketId = findComebackOf(tx, m.id, now, comebackWindowDays);
  } else {
    const m = mi;
    if (m.serial && !m.serialIsDifferent) {
      const dups = findMachinesBySerial(tx, m.serial);
      if (dups.length) {
        const d = dups[0]!;
        fail(
          { serial: `Serial already on file: ${d.label}, ${d.customerName}. Use that machine, or confirm this is a different one.` },
          "This serial number is already on file.",
          dups,
        );
      }
    }
    machineId = crypto.randomUUID();
    tx.insert(machines)
      .values({ id: machineId, customerId, kind: m.kind, engineType: m.engineType, make: m.make, model: m.model, serial: m.serial, createdAt: at, updatedAt: at })
      .run();
    audit(tx, { actorId, action: "machine.created", entity: "machine", entityId: machineId, details: m.serial && m.serialIsDifferent ? { duplicateSerialConfirmed: true } : {} });
  }

  if (input.assignedTechId && !isActiveTech(tx, input.assignedTechId)) {
    fail({ assignedTechId: "That person is not an active bench technician. Choose another." });
  }

  const created = insertTicket(tx, {
    machineId,
    customerId,
    complaint: input.complaint,
    complaintTags: input.complaintPicks,
    intakeCondition: input.condition,
    accessories: input.accessories,
    promisedDate: input.promisedDate,
    approvalLimitCents: input.approvalLimitCents,
    assignedTechId: input.assignedTechId,
    createdById: actorId,
    comebackOfTicketId,
    createdAt: at,
  });
  attachIntakePhotos(tx, created.id, input.photos, actorId, at);
  return { ok: true, ticketId: created.id, number: created.number, tagCode: created.tagCode, comebackOfTicketId };
}


function attachIntakePhotos(tx: Tx, ticketId: string, list: IntakeInput["photos"], actorId: string | null, at: Date): void {
  const seen = new Set<string>();
  for (const p of list) {
    if (seen.has(p.sha256)) continue;
    seen.add(p.sha256);
    const stored = tx.select({ sha256: photoFiles.sha256 }).from(photoFiles).where(eq(photoFiles.sha256, p.sha256)).get();
    if (!stored) fail({ photos: "A photo did not finish uploading. Remove it and take it again." });
    if (!actorId) fail({ photos: "Sign in again to attach photos." });
    tx.insert(photos)
      .values({ id: crypto.randomUUID(), ticketId, sha256: p.sha256, mime: p.mime, bytes: p.bytes, width: p.width, height: p.height, stepId: INTAKE_PHOTO_STEP, caption: "At intake", at, takenBy: actorId })
      .run();
  }
}

/**
 * Parse and take in: the server action's whole job after the access guard. `values` is what the form
 * sent; the same schema as in the browser runs again here with the shop's own "today".
 */
export function takeIn(db: Db, values: unknown, actorId: string, now: number = Date.now()): IntakeResult {
  const settings = getShopSettings(db);
  const parsed = intakeSchema(dateIn(settings.timezone, now)).safeParse(values);
  if (!parsed.success) return { ok: false, message: "Some fields need attention.", fields: zodFields(parsed.error) };
  return createIntake(db, parsed.data, actorId, now);
}
