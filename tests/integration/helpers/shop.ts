import crypto from "node:crypto";
import type { Db } from "@/db/client";
import { customers, machines, shopSettings, tickets, users } from "@/db/schema";
import { eq } from "drizzle-orm";
import { insertTicket, type NewTicket } from "@/lib/tickets/tickets";
import type { Role } from "@/lib/auth/roles";

/** Invented people for counter tests (no real names); the password hash is a placeholder nobody signs in with. */
export const PEOPLE = {
  owner: { id: "00000000-0000-4000-9000-000000000001", name: "Odile Ferrand", role: "owner" },
  counter: { id: "00000000-0000-4000-9000-000000000002", name: "Casimir Wendt", role: "counter" },
  tech: { id: "00000000-0000-4000-9000-000000000003", name: "Anouk Brisbane", role: "tech" },
  tech2: { id: "00000000-0000-4000-9000-000000000004", name: "Leif Marchetti", role: "tech" },
  retiredTech: { id: "00000000-0000-4000-9000-000000000005", name: "Ysolde Penhallow", role: "tech" },
} as const satisfies Record<string, { id: string; name: string; role: Role }>;

/** A shop row (Chicago time, 30-day comeback window) and the people above. */
export function makeShop(db: Db, settings: Partial<typeof shopSettings.$inferInsert> = {}): void {
  db.insert(shopSettings).values({ id: 1, name: "Fernhollow Engine Bench", timezone: "America/Chicago", comebackWindowDays: 30, ...settings }).run();
  for (const [key, p] of Object.entries(PEOPLE)) {
    db.insert(users)
      .values({ id: p.id, email: `${key}@fernhollow.test`, name: p.name, role: p.role, passwordHash: "x", active: key !== "retiredTech" })
      .run();
  }
}

let n = 0;
export function addCustomer(db: Db, over: Partial<typeof customers.$inferInsert> = {}): string {
  const id = over.id ?? crypto.randomUUID();
  n++;
  db.insert(customers).values({ id, firstName: "Test", lastName: `Customer${n}`, phone: `555-01${String(n % 100).padStart(2, "0")}`, ...over }).run();
  return id;
}

export function addMachine(db: Db, customerId: string | null, over: Partial<typeof machines.$inferInsert> = {}): string {
  const id = over.id ?? crypto.randomUUID();
  db.insert(machines).values({ id, customerId, kind: "chain_saw", engineType: "two_stroke", make: "Tarnwick", model: "TW-40", serial: "", ...over }).run();
  return id;
}

export function addTicket(db: Db, input: Partial<NewTicket> & { machineId: string; customerId: string }, random?: () => number) {
  return db.transaction((tx) => insertTicket(tx, { complaint: "Won't start.", ...input }, random));
}

export function ticketRow(db: Db, id: string) {
  return db.select().from(tickets).where(eq(tickets.id, id)).get()!;
}

/** A random source that first replays `codes`' draws, then falls back to a seeded generator. */
export function replaying(alphabet: string, codes: string[], seed = 99): () => number {
  const queue: number[] = [];
  for (const code of codes) for (const ch of code.slice(0, 6)) queue.push((alphabet.indexOf(ch) + 0.5) / alphabet.length);
  let a = seed >>> 0;
  return () => {
    const next = queue.shift();
    if (next !== undefined) return next;
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Signs a role in for route handlers that call requireUser (mock @/lib/auth/auth with `session`). */
export function sessionFor(person: { id: string; name: string; role: Role } | null) {
  return person ? { user: { id: person.id, email: `${person.role}@fernhollow.test`, name: person.name, role: person.role } } : null;
}
