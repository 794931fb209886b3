import crypto from "node:crypto";
import { eq, sql } from "drizzle-orm";
import type { Db } from "../../db/client";
import { machines, shopSettings, ticketTags, tickets } from "../../db/schema";
import { generateTagCode } from "../trade/tag-code";
import { audit } from "../audit/log";
import type { TicketStatus } from "./status";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export interface NewTicket {
  id?: string;
  machineId: string;
  customerId: string;
  complaint: string;
  complaintTags?: string[];
  intakeCondition?: { flags: string[]; note: string };
  accessories?: string;
  status?: TicketStatus;
  promisedDate?: string | null;
  approvalLimitCents?: number | null;
  assignedTechId?: string | null;
  createdById?: string | null;
  comebackOfTicketId?: string | null;
  createdAt?: Date;
}

/**
 * True when a code is already in use anywhere: a ticket's tag, a retired (replaced) tag, or a machine's
 * permanent sticker. Tags and stickers share one code system, so a scan always means one thing.
 */
export function isTagCodeTaken(tx: Pick<Db, "select">, code: string): boolean {
  return Boolean(
    tx.select({ id: tickets.id }).from(tickets).where(eq(tickets.tagCode, code)).get() ??
      tx.select({ code: ticketTags.code }).from(ticketTags).where(eq(ticketTags.code, code)).get() ??
      tx.select({ id: machines.id }).from(machines).where(eq(machines.stickerCode, code)).get(),
  );
}

/** A tag code no ticket, retired tag or machine sticker uses yet. */
export function uniqueTagCode(tx: Pick<Db, "select">, random?: () => number): string {
  for (let attempt = 0; attempt < 50; attempt++) {
    const code = generateTagCode(random);
    if (!isTagCodeTaken(tx, code)) return code;
  }
  throw new Error("Could not find a free tag code");
}

/** Creates a ticket with the next ticket number and a fresh tag code, inside the caller's transaction. */
export function insertTicket(tx: Tx, input: NewTicket, random?: () => number): { id: string; number: number; tagCode: string } {
  const settings = tx
    .update(shopSettings)
    .set({ nextTicketNumber: sql`${shopSettings.nextTicketNumber} + 1` })
    .where(eq(shopSettings.id, 1))
    .returning({ next: shopSettings.nextTicketNumber })
    .get();
  if (!settings) throw new Error("Shop settings are missing");
  const number = settings.next - 1;
  const id = input.id ?? crypto.randomUUID();
  const tagCode = uniqueTagCode(tx, random);
  const createdAt = input.createdAt ?? new Date();
  tx.insert(tickets)
    .values({
      id,
      number,
      tagCode,
      machineId: input.machineId,
      customerId: input.customerId,
      complaint: input.complaint,
      complaintTags: input.complaintTags ?? [],
      intakeCondition: input.intakeCondition ?? { flags: [], note: "" },
      accessories: input.accessories ?? "",
      status: input.status ?? "taken_in",
      promisedDate: input.promisedDate ?? null,
      approvalLimitCents: input.approvalLimitCents ?? null,
      assignedTechId: input.assignedTechId ?? null,
      createdById: input.createdById ?? null,
      comebackOfTicketId: input.comebackOfTicketId ?? null,
      createdAt,
      updatedAt: createdAt,
    })
    .run();
  audit(tx, { actorId: input.createdById ?? null, action: "ticket.created", entity: "ticket", entityId: id, details: { number, tagCode, comebackOfTicketId: input.comebackOfTicketId ?? null } });
  return { id, number, tagCode };
}
