import "server-only";
import { and, desc, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { machines, ticketTags, tickets } from "@/db/schema";
import { audit } from "@/lib/audit/log";
import { AppError } from "@/lib/http/errors";
import { OPEN_STATUSES, type TicketStatus } from "@/lib/tickets/status";
import { uniqueTagCode } from "@/lib/tickets/tickets";
import { checkTagCode, formatTagCode } from "@/lib/trade/tag-code";

/** What a scanned or typed code stands for (the answer of GET /api/tags/<code>). */
export type TagResolution =
  | { kind: "ticket"; ticketId: string; number: number; status: TicketStatus }
  | { kind: "replaced"; ticketId: string; number: number; status: TicketStatus; currentCode: string }
  | { kind: "sticker"; machineId: string; openTicketId?: string };

/** The open ticket of a machine, newest first, if any. */
export function openTicketOf(db: Pick<Db, "select">, machineId: string): string | undefined {
  return db
    .select({ id: tickets.id })
    .from(tickets)
    .where(and(eq(tickets.machineId, machineId), inArray(tickets.status, [...OPEN_STATUSES])))
    .orderBy(desc(tickets.createdAt))
    .get()?.id;
}

/**
 * Resolves a code: 400 (validation) when it is not a well-formed tag code or its check character is wrong,
 * 404 (not_found) when no ticket, retired tag or sticker carries it.
 */
export function resolveTag(db: Db, input: string): TagResolution {
  const checked = checkTagCode(input);
  if (!checked.ok) throw new AppError("validation", checked.message, { fields: { code: checked.message } });
  const code = checked.value;
  const ticket = db.select({ id: tickets.id, number: tickets.number, status: tickets.status }).from(tickets).where(eq(tickets.tagCode, code)).get();
  if (ticket) return { kind: "ticket", ticketId: ticket.id, number: ticket.number, status: ticket.status };
  const retired = db
    .select({ ticketId: ticketTags.ticketId, number: tickets.number, status: tickets.status, currentCode: tickets.tagCode })
    .from(ticketTags)
    .innerJoin(tickets, eq(tickets.id, ticketTags.ticketId))
    .where(eq(ticketTags.code, code))
    .get();
  if (retired) return { kind: "replaced", ticketId: retired.ticketId, number: retired.number, status: retired.status, currentCode: retired.currentCode };
  const machine = db.select({ id: machines.id }).from(machines).where(eq(machines.stickerCode, code)).get();
  if (machine) {
    const open = openTicketOf(db, machine.id);
    return open ? { kind: "sticker", machineId: machine.id, openTicketId: open } : { kind: "sticker", machineId: machine.id };
  }
  throw new AppError("not_found", `No ticket or machine carries the tag ${formatTagCode(code)}.`);
}

/**
 * A tag came off or is unreadable: the ticket gets a fresh code and the old one is retired for good
 * (it then answers "replaced"). Plain update of the tickets row plus the audit log.
 */
export function replaceTag(
  db: Db,
  input: { ticketId: string; reason: string; actorId: string | null; now?: Date },
  random?: () => number,
): { oldCode: string; newCode: string } {
  return db.transaction((tx) => {
    const t = tx.select({ tagCode: tickets.tagCode }).from(tickets).where(eq(tickets.id, input.ticketId)).get();
    if (!t) throw new AppError("not_found", "That ticket does not exist.");
    const at = input.now ?? new Date();
    const newCode = uniqueTagCode(tx, random);
    tx.insert(ticketTags).values({ code: t.tagCode, ticketId: input.ticketId, retiredAt: at, retiredById: input.actorId, reason: input.reason }).run();
    tx.update(tickets).set({ tagCode: newCode, updatedAt: at }).where(eq(tickets.id, input.ticketId)).run();
    audit(tx, {
      actorId: input.actorId,
      action: "ticket.tag_replaced",
      entity: "ticket",
      entityId: input.ticketId,
      details: { oldCode: t.tagCode, newCode, reason: input.reason },
    });
    return { oldCode: t.tagCode, newCode };
  });
}

/** Gives a machine its permanent sticker code (once; asking again returns the same code). */
export function issueSticker(db: Db, input: { machineId: string; actorId: string | null }, random?: () => number): string {
  return db.transaction((tx) => {
    const m = tx.select({ stickerCode: machines.stickerCode }).from(machines).where(eq(machines.id, input.machineId)).get();
    if (!m) throw new AppError("not_found", "That machine does not exist.");
    if (m.stickerCode) return m.stickerCode;
    const code = uniqueTagCode(tx, random);
    tx.update(machines).set({ stickerCode: code, updatedAt: new Date() }).where(eq(machines.id, input.machineId)).run();
    audit(tx, { actorId: input.actorId, action: "machine.sticker_issued", entity: "machine", entityId: input.machineId, details: { code } });
    return code;
  });
}

/** Retired codes of a ticket, newest first. */
export function retiredTagsOf(db: Db, ticketId: string) {
  return db.select().from(ticketTags).where(eq(ticketTags.ticketId, ticketId)).orderBy(desc(ticketTags.retiredAt)).all();
}
