import "server-only";
import { asc, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { customers, machines, tickets, users } from "@/db/schema";
import { OPEN_STATUSES } from "./status";

/** Open tickets with their customer, machine and tech, oldest first. */
export function listOpenTickets(db: Db) {
  return db
    .select({
      id: tickets.id,
      number: tickets.number,
      tagCode: tickets.tagCode,
      status: tickets.status,
      complaint: tickets.complaint,
      promisedDate: tickets.promisedDate,
      createdAt: tickets.createdAt,
      customerLastName: customers.lastName,
      customerFirstName: customers.firstName,
      machineMake: machines.make,
      machineModel: machines.model,
      machineKind: machines.kind,
      techName: users.name,
    })
    .from(tickets)
    .innerJoin(customers, eq(customers.id, tickets.customerId))
    .innerJoin(machines, eq(machines.id, tickets.machineId))
    .leftJoin(users, eq(users.id, tickets.assignedTechId))
    .where(inArray(tickets.status, [...OPEN_STATUSES]))
    .orderBy(asc(tickets.createdAt))
    .all();
}
