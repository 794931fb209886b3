import "server-only";
import { eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { customers, machines, tickets } from "@/db/schema";
import { AppError } from "@/lib/http/errors";
import { getShopSettings } from "@/lib/shop/settings";
import { MACHINE_KIND_LABELS } from "@/lib/tickets/machine";
import { dateIn, formatDate } from "./dates";
import type { TagLabel } from "./labels";

/** What goes on the repair tags of these tickets, in the order asked for. */
export function ticketLabels(db: Db, ids: string[]): TagLabel[] {
  const tz = getShopSettings(db).timezone;
  const rows = db
    .select({
      id: tickets.id,
      number: tickets.number,
      tagCode: tickets.tagCode,
      createdAt: tickets.createdAt,
      lastName: customers.lastName,
      make: machines.make,
      model: machines.model,
      kind: machines.kind,
    })
    .from(tickets)
    .innerJoin(customers, eq(customers.id, tickets.customerId))
    .innerJoin(machines, eq(machines.id, tickets.machineId))
    .where(inArray(tickets.id, ids))
    .all();
  return ids.map((id) => {
    const r = rows.find((x) => x.id === id);
    if (!r) throw new AppError("not_found", "One of those tickets does not exist.");
    return {
      code: r.tagCode,
      kind: "ticket",
      heading: `#${r.number}`,
      corner: formatDate(dateIn(tz, r.createdAt), { weekday: false }),
      who: r.lastName.toUpperCase(),
      what: `${r.make} ${r.model} ${MACHINE_KIND_LABELS[r.kind].toLowerCase()}`.replace(/\s+/g, " ").trim(),
    };
  });
}

/** What goes on a machine's permanent sticker; 404 until the machine has been given one. */
export function stickerLabel(db: Db, machineId: string): TagLabel {
  const m = db.select().from(machines).where(eq(machines.id, machineId)).get();
  if (!m) throw new AppError("not_found", "That machine does not exist.");
  if (!m.stickerCode) throw new AppError("not_found", "This machine has no sticker yet. Give it one on its history page first.");
  return {
    code: m.stickerCode,
    kind: "sticker",
    heading: "MACHINE",
    corner: getShopSettings(db).name,
    who: `${m.make} ${m.model}`.trim(),
    what: m.serial ? `s/n ${m.serial}` : MACHINE_KIND_LABELS[m.kind].toLowerCase(),
  };
}
