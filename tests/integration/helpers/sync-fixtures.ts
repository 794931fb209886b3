import { DEMO_USERS, seedDemo } from "@/db/seed";
import type { Db } from "@/db/client";
import { PROTOCOL_VERSION } from "@/lib/sync/protocol";
import type { TestUser } from "./auth-session";
/** The demo people as sessions (the demo shop's invented staff). */
export const OWNER = DEMO_USERS[0] as TestUser;
export const COUNTER = DEMO_USERS[1] as TestUser;
export const TECH = DEMO_USERS[2] as TestUser;
export const TECH2 = DEMO_USERS[3] as TestUser;

/** Demo ticket ids from db/seed.ts: T(1) on the bench for TECH … T(8) handed back. */
export const T = (n: number) => `00000000-0000-4000-8300-${String(n).padStart(12, "0")}`;

export async function seedShop(db: Db): Promise<void> {
  process.env.BCRYPT_COST = "4";
  await seedDemo(db);
  db.$client
    .prepare("INSERT INTO procedures (id, machine_kind, name, version, definition) VALUES (?, ?, ?, ?, ?)")
    .run("two-stroke-saw", "chain_saw", "Two-stroke chain saw", 1, JSON.stringify({ sections: [{ id: "start", steps: [{ id: "compression", kind: "reading" }] }] }));
}

let n = 0;
/** A UUID (v4 layout) that is easy to read in a failing test. */
export function uid(): string {
  n += 1;
  return `aaaaaaaa-0000-4000-8000-${String(n).padStart(12, "0")}`;
}

export const AT = "2026-05-04T14:30:00.000Z";

export function mutation(seq: number, name: string, args: Record<string, unknown>, mutationId = uid()) {
  return { mutationId, seq, name, args, at: AT };
}

export function batch(deviceId: string, mutations: unknown[], extra: Record<string, unknown> = {}) {
  return { protocolVersion: PROTOCOL_VERSION, deviceId, mutations, ...extra };
}

/** Row counts of every table the sync touches. */
export function counts(db: Db): Record<string, number> {
  const tables = [
    "bench_entries", "findings", "tune_entries", "photos", "labor_entries", "ticket_notes", "parts_used",
    "applied_mutations", "devices", "change_log", "sync_conflicts", "tickets",
  ];
  return Object.fromEntries(tables.map((t) => [t, (db.$client.prepare(`SELECT count(*) AS n FROM ${t}`).get() as { n: number }).n]));
}
