import "server-only";
import { aliasedTable, and, asc, count, desc, eq, gte, inArray, isNotNull, isNull, lt, or, sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "@/db/client";
import { customers, machines, tickets, users } from "@/db/schema";
import { getShopSettings } from "@/lib/shop/settings";
import { MACHINE_KIND_LABELS, type MachineKind } from "@/lib/tickets/machine";
import { OPEN_STATUSES, STATUS_LABELS, TICKET_STATUSES, isOpenStatus, type TicketStatus } from "@/lib/tickets/status";
import { complaintSummary } from "@/lib/tickets/intake";
import { unsyncedBenchWork, type UnsyncedWork } from "@/lib/sync/server";
import { normalizeTagCode } from "@/lib/trade/tag-code";
import { phoneDigits } from "./contact";
import { dateIn, daysBetween, zonedTimeToInstant } from "./dates";
import { listTechs } from "./people";
import { likeContains } from "./search";

export const QUEUE_SORTS = ["promised", "number", "customer", "machine", "status", "tech", "days", "activity"] as const;
export type QueueSort = (typeof QUEUE_SORTS)[number];

/** The board's query string. Unknown values are refused (400), never guessed at. */
export const queueQuerySchema = z.object({
  status: z
    .enum(TICKET_STATUSES, { message: "Choose a status from the list." })
    .refine(isOpenStatus, "The board shows open tickets only; look closed ones up in History.")
    .optional(),
  tech: z.union([z.literal("none"), z.uuid("Choose a technician from the list.")]).optional(),
  overdue: z.enum(["1", "0"]).transform((v) => v === "1").optional(),
  q: z.string().trim().max(100, "Search with fewer than 100 characters.").optional(),
  sort: z.enum(QUEUE_SORTS).default("promised"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(5).max(100).default(25),
});
export type QueueQuery = z.output<typeof queueQuerySchema>;

export interface QueueRow {
  id: string;
  number: number;
  tagCode: string;
  status: TicketStatus;
  statusLabel: string;
  complaint: string;
  customer: { id: string; firstName: string; lastName: string; phone: string };
  machine: { id: string; kind: MachineKind; kindLabel: string; make: string; model: string };
  tech: { id: string; name: string } | null;
  takenInAt: string;
  daysInShop: number;
  promisedDate: string | null;
  overdue: boolean;
  lastActivityAt: string;
  comebackOfTicketId: string | null;
  unsynced: UnsyncedWork | null;
}

export interface QueuePage {
  rows: QueueRow[];
  total: number;
  page: number;
  pageSize: number;
  pageCount: number;
  /** Open tickets per status, with every filter applied except the status filter. */
  counts: Record<TicketStatus, number>;
  today: string;
  techs: Array<{ id: string; name: string }>;
}

const tech = aliasedTable(users, "tech");

const statusOrder = sql`case ${tickets.status} ${sql.join(
  TICKET_STATUSES.map((s, i) => sql`when ${s} then ${i}`),
  sql` `,
)} end`;

function orderFor(sort: QueueSort, dir: "asc" | "desc"): SQL[] {
  const d = dir === "asc" ? asc : desc;
  switch (sort) {
    case "promised":
      return [sql`${tickets.promisedDate} is null`, d(tickets.promisedDate), asc(tickets.createdAt)];
    case "number":
      return [d(tickets.number)];
    case "customer":
      return [d(customers.lastName), d(customers.firstName)];
    case "machine":
      return [d(machines.make), d(machines.model)];
    case "status":
      return [dir === "asc" ? asc(statusOrder) : desc(statusOrder)];
    case "tech":
      return [sql`${tech.name} is null`, d(tech.name)];
    case "days": // most days in the shop = oldest intake
      return [dir === "asc" ? desc(tickets.createdAt) : asc(tickets.createdAt)];
    case "activity":
      return [d(tickets.updatedAt)];
  }
}

/** What the search box matches: ticket number, tag code, customer name or phone, machine make, model or serial. */
function searchCondition(q: string): SQL | undefined {
  const text = q.trim();
  if (!text) return undefined;
  const parts: Array<SQL | undefined> = [
    likeContains(customers.lastName, text),
    likeContains(customers.firstName, text),
    likeContains(sql`${customers.firstName} || ' ' || ${customers.lastName}`, text),
    likeContains(machines.make, text),
    likeContains(machines.model, text),
    likeContains(sql`${machines.make} || ' ' || ${machines.model}`, text),
    likeContains(machines.serial, text),
  ];
  const code = normalizeTagCode(text);
  if (/^[0-9A-Z]{3,7}$/.test(code)) parts.push(likeContains(tickets.tagCode, code));
  const num = /^#?\s*(\d{1,9})$/.exec(text);
  if (num) parts.push(eq(tickets.number, Number(num[1])));
  const digits = phoneDigits(text);
  if (digits.length >= 4 && !/[a-z]/i.test(text)) {
    parts.push(
      likeContains(sql`replace(replace(replace(replace(replace(${customers.phone}, '-', ''), ' ', ''), '(', ''), ')', ''), '.', '')`, digits),
    );
  }
  return or(...parts);
}

/** One page of the queue board, filtered, sorted and counted in SQL. */
export function queuePage(db: Db, query: QueueQuery, now: number = Date.now()): QueuePage {
  const tz = getShopSettings(db).timezone;
  const today = dateIn(tz, now);

  const filters: Array<SQL | undefined> = [inArray(tickets.status, [...OPEN_STATUSES])];
  if (query.tech === "none") filters.push(isNull(tickets.assignedTechId));
  else if (query.tech) filters.push(eq(tickets.assignedTechId, query.tech));
  if (query.overdue) filters.push(and(isNotNull(tickets.promisedDate), lt(tickets.promisedDate, today)));
  if (query.q) filters.push(searchCondition(query.q));
  const where = and(...filters);

  // Counting needs the customer and machine rows only when the search box looks into them.
  let counting = db.select({ status: tickets.status, n: count() }).from(tickets).$dynamic();
  if (query.q) {
    counting = counting.innerJoin(customers, eq(customers.id, tickets.customerId)).innerJoin(machines, eq(machines.id, tickets.machineId));
  }
  const countRows = counting.where(where).groupBy(tickets.status).all();
  const counts = Object.fromEntries(TICKET_STATUSES.map((s) => [s, 0])) as Record<TicketStatus, number>;
  for (const r of countRows) counts[r.status] = r.n;
  const total = query.status ? counts[query.status] : countRows.reduce((a, r) => a + r.n, 0);
  const pageCount = Math.max(1, Math.ceil(total / query.pageSize));
  const page = Math.min(query.page, pageCount);

  const rows = db
    .select({
      id: tickets.id,
      number: tickets.number,
      tagCode: tickets.tagCode,
      status: tickets.status,
      complaint: tickets.complaint,
      complaintTags: tickets.complaintTags,
      promisedDate: tickets.promisedDate,
      createdAt: tickets.createdAt,
      updatedAt: tickets.updatedAt,
      comebackOfTicketId: tickets.comebackOfTicketId,
      customerId: customers.id,
      firstName: customers.firstName,
      lastName: customers.lastName,
      phone: customers.phone,
      machineId: machines.id,
      kind: machines.kind,
      make: machines.make,
      model: machines.model,
      techId: tech.id,
      techName: tech.name,
    })
    .from(tickets)
    .innerJoin(customers, eq(customers.id, tickets.customerId))
    .innerJoin(machines, eq(machines.id, tickets.machineId))
    .leftJoin(tech, eq(tech.id, tickets.assignedTechId))
    .where(query.status ? and(where, eq(tickets.status, query.status)) : where)
    .orderBy(...orderFor(query.sort, query.dir), asc(tickets.number))
    .limit(query.pageSize)
    .offset((page - 1) * query.pageSize)
    .all();

  const unsynced = unsyncedBenchWork(db);
  return {
    rows: rows.map((r) => ({
      id: r.id,
      number: r.number,
      tagCode: r.tagCode,
      status: r.status,
      statusLabel: STATUS_LABELS[r.status],
      complaint: complaintSummary(r.complaintTags, r.complaint),
      customer: { id: r.customerId, firstName: r.firstName, lastName: r.lastName, phone: r.phone },
      machine: { id: r.machineId, kind: r.kind, kindLabel: MACHINE_KIND_LABELS[r.kind], make: r.make, model: r.model },
      tech: r.techId && r.techName ? { id: r.techId, name: r.techName } : null,
      takenInAt: r.createdAt.toISOString(),
      daysInShop: Math.max(0, daysBetween(dateIn(tz, r.createdAt), today)),
      promisedDate: r.promisedDate,
      overdue: r.promisedDate !== null && r.promisedDate < today,
      lastActivityAt: r.updatedAt.toISOString(),
      comebackOfTicketId: r.comebackOfTicketId,
      unsynced: unsynced.get(r.id) ?? null,
    })),
    total,
    page,
    pageSize: query.pageSize,
    pageCount,
    counts,
    today,
    techs: listTechs(db),
  };
}

/** Open tickets taken in since midnight in the shop's zone, oldest first (to print their tags on one sheet). */
export function openTicketsTakenInToday(db: Db, now: number = Date.now()): Array<{ id: string; number: number }> {
  const tz = getShopSettings(db).timezone;
  const midnight = zonedTimeToInstant(dateIn(tz, now), "00:00", tz);
  const from = midnight.ok ? midnight.value : now - 86_400_000;
  return db
    .select({ id: tickets.id, number: tickets.number })
    .from(tickets)
    .where(and(gte(tickets.createdAt, new Date(from)), inArray(tickets.status, [...OPEN_STATUSES])))
    .orderBy(asc(tickets.number))
    .all();
}
