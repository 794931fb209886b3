import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "@/db/client";
import { ticketHandbacks, tickets, users } from "@/db/schema";
import { HANDBACK_OUTCOMES } from "@/db/schema/counter";
import { audit } from "@/lib/audit/log";
import { AppError } from "@/lib/http/errors";
import { getShopSettings } from "@/lib/shop/settings";
import { STATUS_LABELS, TICKET_STATUSES, isOpenStatus, type TicketStatus } from "@/lib/tickets/status";
import { formatDateTime, isCalendarDate, zonedTimeToInstant } from "./dates";
import { isActiveTech } from "./people";

const reason = z.string().trim().max(300, "Keep the reason under 300 characters.").default("");

/** POST /api/counter/tickets/<id>/status — `from` is the status the counter saw, so a stale board cannot overwrite a newer move. */
export const statusMoveSchema = z.object({
  from: z.enum(TICKET_STATUSES),
  to: z.enum(TICKET_STATUSES, { message: "Choose the new status." }),
  reason,
});

/** POST /api/counter/tickets/<id>/tech — null unassigns. */
export const assignSchema = z.object({ techId: z.uuid("Choose a technician from the list.").nullable() });

function openTicket(db: Pick<Db, "select">, id: string) {
  const t = db.select().from(tickets).where(eq(tickets.id, id)).get();
  if (!t) throw new AppError("not_found", "That ticket does not exist.");
  if (!isOpenStatus(t.status)) {
    throw new AppError("conflict", `Ticket #${t.number} is closed (${STATUS_LABELS[t.status].toLowerCase()}).`);
  }
  return t;
}

/**
 * Moves an open ticket to another open status, with an optional reason for the history. Closing goes
 * through hand-back (it records who collected the machine). A plain update of the tickets row plus the
 * audit log; the sync engine's triggers pick the change up.
 */
export function moveStatus(
  db: Db,
  input: { ticketId: string; from: TicketStatus; to: TicketStatus; reason: string; actorId: string | null; now?: Date },
): { status: TicketStatus; updatedAt: Date } {
  return db.transaction((tx) => {
    const t = openTicket(tx, input.ticketId);
    if (!isOpenStatus(input.to)) {
      throw new AppError("validation", "Record the hand-back to close a ticket.", { fields: { to: "Use Hand back to close a ticket." } });
    }
    if (t.status !== input.from) {
      throw new AppError(
        "conflict",
        `Ticket #${t.number} is now "${STATUS_LABELS[t.status]}" (it changed after your screen loaded). Check it and try again.`,
      );
    }
    if (input.to === input.from) throw new AppError("validation", "That is the status it already has.", { fields: { to: "Choose a different status." } });
    const at = input.now ?? new Date();
    tx.update(tickets).set({ status: input.to, updatedAt: at }).where(and(eq(tickets.id, t.id), eq(tickets.status, input.from))).run();
    audit(tx, { actorId: input.actorId, action: "ticket.status", entity: "ticket", entityId: t.id, details: { from: input.from, to: input.to, reason: input.reason } });
    return { status: input.to, updatedAt: at };
  });
}

/** Assigns (or unassigns, with null) the bench technician of an open ticket. */
export function assignTech(db: Db, input: { ticketId: string; techId: string | null; actorId: string | null; now?: Date }): { techId: string | null } {
  return db.transaction((tx) => {
    const t = openTicket(tx, input.ticketId);
    if (input.techId && !isActiveTech(tx, input.techId)) {
      throw new AppError("validation", "That person is not an active bench technician.", { fields: { techId: "Choose an active technician." } });
    }
    if (t.assignedTechId === input.techId) return { techId: input.techId };
    tx.update(tickets).set({ assignedTechId: input.techId, updatedAt: input.now ?? new Date() }).where(eq(tickets.id, t.id)).run();
    const name = input.techId ? tx.select({ name: users.name }).from(users).where(eq(users.id, input.techId)).get()?.name : null;
    audit(tx, { actorId: input.actorId, action: "ticket.assigned", entity: "ticket", entityId: t.id, details: { from: t.assignedTechId, to: input.techId, toName: name ?? null } });
    return { techId: input.techId };
  });
}

/** The hand-back form (strings from FormData). Date and time are the shop's wall clock. */
export const handBackFormSchema = z.object({
  ticketId: z.string().min(1),
  outcome: z.enum(HANDBACK_OUTCOMES, { message: "Choose how the machine left." }),
  collectedBy: z.string().trim().min(1, "Enter who collected it.").max(80, "Keep the name under 80 characters."),
  collectedDate: z.string().trim(),
  collectedTime: z.string().trim(),
  note: z.string().trim().max(500, "Keep the note under 500 characters.").default(""),
});
export type HandBackForm = z.output<typeof handBackFormSchema>;

/** A few minutes of slack for clocks that disagree. */
const FUTURE_SLACK_MS = 5 * 60_000;

/**
 * Records who collected the machine and when; closes the ticket (handed back, or returned unrepaired).
 * The machine's history keeps the ticket.
 */
export function handBack(db: Db, form: HandBackForm, actorId: string | null, now: number = Date.now()): { closedAt: Date } {
  const tz = getShopSettings(db).timezone;
  if (!isCalendarDate(form.collectedDate)) {
    throw new AppError("validation", "Some fields need attention.", { fields: { collectedDate: "Enter a real date, e.g. 2026-12-01." } });
  }
  const when = zonedTimeToInstant(form.collectedDate, form.collectedTime, tz);
  if (!when.ok) throw new AppError("validation", "Some fields need attention.", { fields: { collectedTime: when.message } });
  return db.transaction((tx) => {
    const t = openTicket(tx, form.ticketId);
    if (when.value > now + FUTURE_SLACK_MS) {
      throw new AppError("validation", "Some fields need attention.", { fields: { collectedTime: "That time has not come yet. Enter when it was collected." } });
    }
    if (when.value < t.createdAt.getTime()) {
      throw new AppError("validation", "Some fields need attention.", {
        fields: { collectedDate: `That is before the machine was taken in (${formatDateTime(tz, t.createdAt)}).` },
      });
    }
    const closedAt = new Date(when.value);
    tx.insert(ticketHandbacks)
      .values({ ticketId: t.id, outcome: form.outcome, collectedBy: form.collectedBy, collectedAt: closedAt, note: form.note, recordedById: actorId, recordedAt: new Date(now) })
      .run();
    tx.update(tickets).set({ status: form.outcome, closedAt, updatedAt: new Date(now) }).where(eq(tickets.id, t.id)).run();
    audit(tx, {
      actorId,
      action: "ticket.handed_back",
      entity: "ticket",
      entityId: t.id,
      details: { from: t.status, outcome: form.outcome, collectedBy: form.collectedBy, collectedAt: closedAt.toISOString(), note: form.note },
    });
    return { closedAt };
  });
}

/** The hand-back record of a closed ticket, if any. */
export function handBackOf(db: Pick<Db, "select">, ticketId: string) {
  return db.select().from(ticketHandbacks).where(eq(ticketHandbacks.ticketId, ticketId)).get();
}
