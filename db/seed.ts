import { eq } from "drizzle-orm";
import type { Db } from "./client";
import { benchEntries, customers, findings, laborEntries, machines, shopSettings, ticketNotes, tickets, tuneEntries, users } from "./schema";
import { CHAIN_SAW } from "../lib/procedures/built-in/chain-saw";
import { hashPassword } from "../lib/auth/password";
import type { Role } from "../lib/auth/roles";
import type { EngineType, MachineKind } from "../lib/tickets/machine";
import type { TicketStatus } from "../lib/tickets/status";
import { insertTicket } from "../lib/tickets/tickets";

/**
 * The demo shop: an invented business with invented people and invented machine makes.
 * Every id is fixed, so seeding twice never duplicates anything.
 */
export const DEMO_PASSWORD = "benchwright-demo";

export const DEMO_USERS: Array<{ id: string; email: string; name: string; role: Role }> = [
  { id: "00000000-0000-4000-8000-000000000001", email: "owner@demo.benchwright.test", name: "Rowan Hale", role: "owner" },
  { id: "00000000-0000-4000-8000-000000000002", email: "counter@demo.benchwright.test", name: "Priya Castellan", role: "counter" },
  { id: "00000000-0000-4000-8000-000000000003", email: "tech@demo.benchwright.test", name: "Tomas Brevik", role: "tech" },
  { id: "00000000-0000-4000-8000-000000000004", email: "tech2@demo.benchwright.test", name: "June Okafor-Lind", role: "tech" },
];

const C = (n: number) => `00000000-0000-4000-8100-${String(n).padStart(12, "0")}`;
const M = (n: number) => `00000000-0000-4000-8200-${String(n).padStart(12, "0")}`;
const T = (n: number) => `00000000-0000-4000-8300-${String(n).padStart(12, "0")}`;

const DEMO_CUSTOMERS = [
  { id: C(1), firstName: "Marguerite", lastName: "Ashdown", phone: "555-0142", email: "m.ashdown@example.com", contactPreference: "email", emailConsent: true },
  { id: C(2), firstName: "Felix", lastName: "Odaro", phone: "555-0178", email: "felix.odaro@example.net", contactPreference: "text", emailConsent: true },
  { id: C(3), firstName: "Hollis", lastName: "Brandvold", phone: "555-0115", email: "", contactPreference: "phone", emailConsent: false },
  { id: C(4), firstName: "Inez", lastName: "Carrow", phone: "555-0193", email: "inez@carrow-orchard.example", contactPreference: "email", emailConsent: true },
  { id: C(5), firstName: "Bram", lastName: "Teasdale", phone: "555-0127", email: "bram.t@example.org", contactPreference: "phone", emailConsent: false },
  { id: C(6), firstName: "Oona", lastName: "Petrakis", phone: "555-0166", email: "oona.petrakis@example.com", contactPreference: "email", emailConsent: true },
] as const;

const DEMO_MACHINES: Array<{
  id: string; customerId: string; kind: MachineKind; engineType: EngineType; make: string; model: string; serial: string; displacementCc: number | null;
}> = [
  { id: M(1), customerId: C(1), kind: "chain_saw", engineType: "two_stroke", make: "Varnholt", model: "VH-451", serial: "VH451-20931", displacementCc: 45 },
  { id: M(2), customerId: C(2), kind: "string_trimmer", engineType: "two_stroke", make: "Quarrow", model: "QT-27", serial: "QT27-88412", displacementCc: 27 },
  { id: M(3), customerId: C(3), kind: "walk_mower", engineType: "four_stroke", make: "Brennick", model: "BW-21 Mulch", serial: "BW21-55107", displacementCc: 163 },
  { id: M(4), customerId: C(4), kind: "generator", engineType: "four_stroke", make: "Ostwyn", model: "OG-3500", serial: "OG35-10446", displacementCc: 212 },
  { id: M(5), customerId: C(4), kind: "chain_saw", engineType: "two_stroke", make: "Varnholt", model: "VH-362", serial: "VH362-77120", displacementCc: 36 },
  { id: M(6), customerId: C(5), kind: "blower", engineType: "two_stroke", make: "Quarrow", model: "QB-44 Backpack", serial: "QB44-30018", displacementCc: 44 },
  { id: M(7), customerId: C(6), kind: "hedge_trimmer", engineType: "two_stroke", make: "Quarrow", model: "QH-22", serial: "QH22-61290", displacementCc: 22 },
  { id: M(8), customerId: C(1), kind: "walk_mower", engineType: "four_stroke", make: "Brennick", model: "BW-19", serial: "BW19-40877", displacementCc: 140 },
];

const DAY = 86_400_000;
const TECH = DEMO_USERS[2]!.id;
const TECH2 = DEMO_USERS[3]!.id;
const COUNTER = DEMO_USERS[1]!.id;

const DEMO_TICKETS: Array<{
  id: string; machineId: string; customerId: string; complaint: string; complaintTags: string[]; flags: string[]; note: string;
  accessories: string; status: TicketStatus; daysAgo: number; promisedInDays: number | null; approvalLimitCents: number | null; techId: string | null;
}> = [
  { id: T(1), machineId: M(1), customerId: C(1), complaint: "Won't start after sitting all summer. Smells of old fuel.", complaintTags: ["wont_start"], flags: ["fuel_in_tank"], note: "Tank half full, fuel looks dark.", accessories: "Bar cover", status: "on_bench", daysAgo: 2, promisedInDays: 2, approvalLimitCents: 15000, techId: TECH },
  { id: T(2), machineId: M(2), customerId: C(2), complaint: "Starts, then dies at idle.", complaintTags: ["stalls_at_idle"], flags: [], note: "", accessories: "", status: "taken_in", daysAgo: 0, promisedInDays: 4, approvalLimitCents: 8000, techId: TECH },
  { id: T(3), machineId: M(3), customerId: C(3), complaint: "Season service; blade hits hard and vibrates.", complaintTags: ["service", "chain_or_blade"], flags: ["housing_damage"], note: "Deck edge dented at the front right.", accessories: "Grass bag", status: "awaiting_ok", daysAgo: 5, promisedInDays: 0, approvalLimitCents: 20000, techId: TECH2 },
  { id: T(4), machineId: M(4), customerId: C(4), complaint: "Runs but the lights flicker; output seems low under load.", complaintTags: ["runs_rough"], flags: ["fuel_in_tank"], note: "", accessories: "Wheel kit, 30 A cord", status: "awaiting_parts", daysAgo: 9, promisedInDays: -1, approvalLimitCents: 30000, techId: TECH2 },
  { id: T(5), machineId: M(5), customerId: C(4), complaint: "Leaks fuel from under the rear handle; bogs in the cut.", complaintTags: ["leaks_fuel", "no_power"], flags: ["chain_loose", "missing_bar_cover"], note: "Chain hanging off the bar underneath.", accessories: "", status: "in_repair", daysAgo: 4, promisedInDays: 1, approvalLimitCents: 12000, techId: TECH },
  { id: T(6), machineId: M(6), customerId: C(5), complaint: "Hard to start when cold.", complaintTags: ["wont_start"], flags: [], note: "", accessories: "Shoulder straps", status: "ready", daysAgo: 6, promisedInDays: -2, approvalLimitCents: null, techId: TECH2 },
  { id: T(7), machineId: M(7), customerId: C(6), complaint: "Blades stop while the engine keeps running.", complaintTags: ["chain_or_blade"], flags: [], note: "", accessories: "Blade guard", status: "taken_in", daysAgo: 1, promisedInDays: 5, approvalLimitCents: 9000, techId: null },
  { id: T(8), machineId: M(8), customerId: C(1), complaint: "Pull cord snapped.", complaintTags: ["service"], flags: [], note: "", accessories: "", status: "handed_back", daysAgo: 40, promisedInDays: -36, approvalLimitCents: 6000, techId: TECH2 },
];

const B = (n: number) => `00000000-0000-4000-8400-${String(n).padStart(12, "0")}`;

/**
 * Bench work already synced from the tech's phone for the demo's "in repair" chain saw (ticket T(5)), so the
 * counter's ticket page has something to show. Kept apart from seedDemo (tests start from empty bench tables).
 */
export function seedDemoBenchWork(db: Db, now = Date.now()): void {
  db.transaction((tx) => seedBenchWork(tx, now));
}

function seedBenchWork(tx: Parameters<Parameters<Db["transaction"]>[0]>[0], now: number): void {
  const ticketId = T(5);
  const at = (minutesAgo: number) => new Date(now - 3 * DAY + (240 - minutesAgo) * 60_000);
  const answers: Array<[string, unknown]> = [
    ["chain-direction", { kind: "pass-fail", pass: true }],
    ["chain-tension", { kind: "choice", selected: ["loose"] }],
    ["fuel-line", { kind: "choice", selected: ["hard"] }],
    ["pull-over-feel", { kind: "choice", selected: ["strong"] }],
    ["primed-start", { kind: "choice", selected: ["ran-briefly"] }],
    ["leak-where", { kind: "choice", selected: ["cracked-line"] }],
    ["inlet-screen", { kind: "choice", selected: ["film"] }],
    ["metering-diaphragm", { kind: "choice", selected: ["stiff"] }],
  ];
  answers.forEach(([stepId, value], i) =>
    tx.insert(benchEntries)
      .values({ id: B(i + 1), ticketId, procedureId: CHAIN_SAW.id, procedureVersion: CHAIN_SAW.version, stepId, value, at: at(i * 4), recordedBy: TECH })
      .onConflictDoNothing()
      .run(),
  );
  const part = (description: string, qty = 1) => ({ description, partNumber: null, qty });
  const rows = [
    { id: B(20), grade: "cause" as const, title: "Fuel line cracked at the tank outlet", note: "Leaks under the rear handle; sucks air, so it bogs in the cut.", suggestedParts: [part("Fuel line, 3/32 in ID"), part("Fuel filter")], suggestedLaborMinutes: 30, alternatives: null },
    { id: B(21), grade: "cause" as const, title: "Metering diaphragm stiff, inlet screen filmed", note: "Carburetor needs a kit.", suggestedParts: [part("Carburetor kit (diaphragms, gaskets, screen)")], suggestedLaborMinutes: 45, alternatives: [{ label: "Replace the carburetor assembly", parts: [part("Carburetor assembly")], laborMinutes: 20 }] },
    { id: B(22), grade: "due_soon" as const, title: "Chain worn, cutters filed short", note: "", suggestedParts: [part("Chain, 3/8 in low profile, 50 drive links")], suggestedLaborMinutes: 10, alternatives: null },
    { id: B(23), grade: "advisory" as const, title: "Bar rails a little uneven", note: "Dress the rails at the next sharpening.", suggestedParts: [], suggestedLaborMinutes: null, alternatives: null },
  ];
  for (const f of rows) tx.insert(findings).values({ ...f, ticketId, createdBy: TECH, at: at(40) }).onConflictDoNothing().run();
  tx.insert(tuneEntries).values([
    { id: B(30), ticketId, screw: "low", kind: "baseline", eighths: 8, baselineKind: "seated-then-out", at: at(60), recordedBy: TECH },
    { id: B(31), ticketId, screw: "high", kind: "baseline", eighths: 8, baselineKind: "seated-then-out", at: at(60), recordedBy: TECH },
  ]).onConflictDoNothing().run();
  tx.insert(laborEntries).values({ id: B(40), ticketId, userId: TECH, startedAt: at(0), endedAt: at(-35) }).onConflictDoNothing().run();
  tx.insert(ticketNotes).values({ id: B(50), ticketId, text: "Waiting on the carburetor kit before the tune.", at: at(70), authorId: TECH }).onConflictDoNothing().run();
}

/** A small seeded PRNG (mulberry32) so the demo's tag codes are the same on every machine. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function isoDate(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}

/** Makes sure the one settings row exists (an empty shop). */
export function ensureShop(db: Db, name = "My shop"): void {
  db.insert(shopSettings).values({ id: 1, name }).onConflictDoNothing().run();
}

export async function seedDemo(db: Db, now = Date.now()): Promise<{ created: boolean }> {
  const already = db.select({ id: users.id }).from(users).where(eq(users.id, DEMO_USERS[0]!.id)).get();
  const hash = already ? "" : await hashPassword(DEMO_PASSWORD);
  let created = false;
  db.transaction((tx) => {
    tx.insert(shopSettings)
      .values({
        id: 1,
        name: "Larchmere Saw & Mower",
        phone: "555-0100",
        email: "counter@larchmere-saw.example",
        address: "418 Quarry Road, Larchmere",
        timezone: "America/Chicago",
        laborRateCentsPerHour: 9200,
        laborIncrementMinutes: 6,
        taxRatePpm: 72_500,
        laborTaxable: false,
        taxRounding: "invoice",
        shopSuppliesBp: 500,
        shopSuppliesCapCents: 1500,
        comebackWindowDays: 30,
      })
      .onConflictDoNothing()
      .run();
    if (!already) {
      for (const u of DEMO_USERS) tx.insert(users).values({ ...u, passwordHash: hash }).onConflictDoNothing().run();
      created = true;
    }
    for (const c of DEMO_CUSTOMERS) tx.insert(customers).values(c).onConflictDoNothing().run();
    for (const m of DEMO_MACHINES) tx.insert(machines).values(m).onConflictDoNothing().run();
    const random = seeded(20261201);
    for (const t of DEMO_TICKETS) {
      if (tx.select({ id: tickets.id }).from(tickets).where(eq(tickets.id, t.id)).get()) continue;
      const createdAt = new Date(now - t.daysAgo * DAY);
      insertTicket(
        tx,
        {
          id: t.id,
          machineId: t.machineId,
          customerId: t.customerId,
          complaint: t.complaint,
          complaintTags: t.complaintTags,
          intakeCondition: { flags: t.flags, note: t.note },
          accessories: t.accessories,
          status: t.status,
          promisedDate: t.promisedInDays === null ? null : isoDate(now + t.promisedInDays * DAY),
          approvalLimitCents: t.approvalLimitCents,
          assignedTechId: t.techId,
          createdById: COUNTER,
          createdAt,
        },
        random,
      );
      if (t.status === "handed_back") {
        tx.update(tickets).set({ closedAt: new Date(now - (t.daysAgo - 3) * DAY) }).where(eq(tickets.id, t.id)).run();
      }
      created = true;
    }
  });
  return { created };
}
