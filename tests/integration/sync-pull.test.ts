import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("@/lib/auth/auth", () => import("./helpers/auth-session"));

import { closeDb, getDb, type Db } from "@/db/client";
import { CLOSED_STATUSES } from "@/lib/tickets/status";
import { serverView } from "@/lib/sync/server/pull";
import { tempDb } from "./helpers/db";
import { AT, T, TECH, TECH2, batch, mutation, pull, push, seedShop, uid } from "./helpers/sync-server";

let ctx: ReturnType<typeof tempDb>;
let db: Db;
beforeEach(async () => {
  ctx = tempDb();
  closeDb();
  db = getDb();
  await seedShop(db);
});
afterEach(() => {
  closeDb();
  ctx.cleanup();
});

type Change = { entity: string; op: "upsert" | "delete"; id: string; row?: Record<string, unknown> };

/** Pulls until `more` is false, checking the cursor never goes back. */
async function pullAll(user = TECH, deviceId = uid(), cursor = 0, limit = 500) {
  const pages: Array<{ changes: Change[]; cursor: number; snapshot: string | null; more: boolean }> = [];
  let snapshot: string | null = null;
  for (let i = 0; i < 200; i++) {
    const res = await pull(user, { deviceId, cursor, limit, ...(snapshot ? { snapshot } : {}) });
    expect(res.status).toBe(200);
    expect(res.body.cursor).toBeGreaterThanOrEqual(snapshot ? 0 : cursor);
    pages.push(res.body);
    if (res.body.cursor) cursor = Math.max(cursor, res.body.cursor);
    snapshot = res.body.snapshot;
    if (!res.body.more) break;
  }
  const changes = pages.flatMap((p) => p.changes);
  return { pages, changes, cursor, deviceId };
}

/** Applies changes to a map the way a device store does (a ticket's tombstone drops its facts). */
function apply(store: Map<string, Record<string, unknown>>, changes: Change[]) {
  for (const c of changes) {
    const key = `${c.entity}:${c.id}`;
    if (c.op === "upsert") store.set(key, c.row!);
    else {
      store.delete(key);
      if (c.entity === "ticket") for (const [k, v] of store) if (v.ticketId === c.id) store.delete(k);
    }
  }
  return store;
}

const openTicketCount = (db: Db) =>
  (db.$client.prepare(`SELECT count(*) AS n FROM tickets WHERE status NOT IN (${CLOSED_STATUSES.map((s) => `'${s}'`).join(",")})`).get() as { n: number }).n;

describe("GET /api/sync/pull", () => {
  it("gives a fresh device its working set: open tickets (the tech's first), machines, customers by name and phone, procedures", async () => {
    const { pages, changes, cursor } = await pullAll(TECH);
    const tickets = changes.filter((c) => c.entity === "ticket");
    expect(tickets).toHaveLength(openTicketCount(db));
    expect(tickets.map((t) => t.id)).not.toContain(T(8)); // handed back
    const firstMine = tickets.findIndex((t) => t.row!.assignedTechId !== TECH.id);
    expect(tickets.slice(0, firstMine).every((t) => t.row!.assignedTechId === TECH.id)).toBe(true);
    expect(tickets.slice(firstMine).some((t) => t.row!.assignedTechId === TECH.id)).toBe(false);
    for (const c of changes.filter((x) => x.entity === "customer")) {
      expect(Object.keys(c.row!).sort()).toEqual(["firstName", "id", "lastName", "phone"]);
    }
    expect(changes.some((c) => c.entity === "procedure" && c.id === "two-stroke-saw")).toBe(true);
    expect(changes.every((c) => c.op === "upsert")).toBe(true);
    expect(pages.at(-1)!.cursor).toBe(cursor);
    expect(cursor).toBe((db.$client.prepare("SELECT max(version) AS v FROM change_log").get() as { v: number }).v);
    expect(apply(new Map(), changes)).toEqual(serverView(db));
  });

  it("pages a snapshot with a token, holding cursor 0 until the last page", async () => {
    const { pages, changes } = await pullAll(TECH, uid(), 0, 4);
    expect(pages.length).toBeGreaterThan(3);
    for (const p of pages.slice(0, -1)) {
      expect(p.cursor).toBe(0);
      expect(p.snapshot).toEqual(expect.any(String));
      expect(p.more).toBe(true);
    }
    expect(pages.at(-1)!.snapshot).toBeNull();
    expect(pages.at(-1)!.cursor).toBeGreaterThan(0);
    expect(apply(new Map(), changes)).toEqual(serverView(db));
  });

  it("still delivers a ticket whole when it is reassigned to the tech in the middle of a first pull", async () => {
    // Found by the simulation (seed 130): a ticket reassigned to the tech after the "my tickets" phase
    // passed its number, before the "other tickets" phase reached it, arrived without its machine.
    const deviceId = uid();
    const numberOf = (id: string) => (db.$client.prepare("SELECT number FROM tickets WHERE id = ?").get(id) as { number: number }).number;
    const token = (s: string | null) => (s ? JSON.parse(Buffer.from(s, "base64url").toString()) : null);
    const changes: Change[] = [];
    let page = (await pull(TECH, { deviceId, cursor: 0, limit: 1 })).body;
    changes.push(...page.changes);
    let moved = false;
    while (page.more) {
      const t = token(page.snapshot);
      if (!moved && t?.p === 1 && t.a === numberOf(T(5))) {
        db.$client.prepare("UPDATE tickets SET assigned_tech_id = ? WHERE id = ?").run(TECH.id, T(4)); // was TECH2's
        moved = true;
      }
      page = (await pull(TECH, { deviceId, cursor: page.cursor, limit: 1, ...(page.snapshot ? { snapshot: page.snapshot } : {}) })).body;
      changes.push(...page.changes);
    }
    expect(moved).toBe(true);
    const store = apply(new Map(), changes);
    expect(store.has("machine:00000000-0000-4000-8200-000000000004")).toBe(true);
    expect(store).toEqual(serverView(db));
  });

  it("then sends only what changed since the cursor, in pages, with the cursor moving forward", async () => {
    const first = await pullAll(TECH);
    expect((await pull(TECH, { deviceId: first.deviceId, cursor: first.cursor })).body).toMatchObject({ changes: [], more: false, cursor: first.cursor });
    const mutations = Array.from({ length: 5 }, (_, i) =>
      mutation(i + 1, "ticket.note_added", { id: uid(), ticketId: T(2), text: `note ${i}`, at: AT }),
    );
    await push(TECH2, batch(uid(), mutations));
    const later = await pullAll(TECH, first.deviceId, first.cursor, 2);
    expect(later.pages).toHaveLength(3);
    expect(later.changes.map((c) => c.entity)).toEqual(Array(5).fill("ticket_note"));
    expect(later.pages.map((p) => p.cursor)).toEqual([...later.pages.map((p) => p.cursor)].sort((a, b) => a - b));
    expect(apply(apply(new Map(), first.changes), later.changes)).toEqual(serverView(db));
  });

  it("sends tombstones when a ticket closes (and its machine and customer leave), and the facts again when it reopens", async () => {
    const note = { id: uid(), ticketId: T(2), text: "idle drops out", at: AT };
    await push(TECH, batch(uid(), [mutation(1, "ticket.note_added", note)]));
    const first = await pullAll(TECH);
    const store = apply(new Map(), first.changes);
    expect(store.has(`ticket_note:${note.id}`)).toBe(true);

    db.$client.prepare("UPDATE tickets SET status = 'handed_back', closed_at = ? WHERE id = ?").run(Date.now(), T(2));
    const closed = await pullAll(TECH, first.deviceId, first.cursor);
    expect(closed.changes).toEqual(expect.arrayContaining([
      { entity: "ticket", op: "delete", id: T(2) },
      { entity: "machine", op: "delete", id: "00000000-0000-4000-8200-000000000002" },
      { entity: "customer", op: "delete", id: "00000000-0000-4000-8100-000000000002" },
    ]));
    apply(store, closed.changes);
    expect(store.has(`ticket_note:${note.id}`)).toBe(false);
    expect(store).toEqual(serverView(db));

    db.$client.prepare("UPDATE tickets SET status = 'in_repair', closed_at = NULL WHERE id = ?").run(T(2));
    const reopened = await pullAll(TECH, first.deviceId, closed.cursor);
    expect(reopened.changes).toEqual(expect.arrayContaining([expect.objectContaining({ entity: "ticket_note", op: "upsert", id: note.id })]));
    apply(store, reopened.changes);
    expect(store).toEqual(serverView(db));
  });

  it("keeps a machine while another open ticket still uses it", async () => {
    // Customer 4 has two machines on two open tickets (T4 generator, T5 saw): closing T5 keeps the customer.
    const first = await pullAll(TECH);
    db.$client.prepare("UPDATE tickets SET status = 'returned_unrepaired' WHERE id = ?").run(T(5));
    const next = await pullAll(TECH, first.deviceId, first.cursor);
    expect(next.changes).toEqual(expect.arrayContaining([
      { entity: "ticket", op: "delete", id: T(5) },
      expect.objectContaining({ entity: "customer", op: "upsert", id: "00000000-0000-4000-8100-000000000004" }),
    ]));
  });

  it("never sends a customer's e-mail or notes, even after they change", async () => {
    const first = await pullAll(TECH);
    db.$client.prepare("UPDATE customers SET email = 'new@example.com', notes = 'prefers mornings' WHERE id = ?").run("00000000-0000-4000-8100-000000000001");
    const next = await pullAll(TECH, first.deviceId, first.cursor);
    const c = next.changes.find((x) => x.entity === "customer");
    expect(c?.row).toEqual({ id: "00000000-0000-4000-8100-000000000001", firstName: "Marguerite", lastName: "Ashdown", phone: "555-0142" });
    expect(JSON.stringify(next.changes)).not.toContain("example.com");
  });

  it("refuses a forged token (400), a cursor from the future (409), another person's device (403), no session (401)", async () => {
    const device = uid();
    expect((await pull(TECH, { deviceId: device, cursor: 0 })).status).toBe(200); // binds the device to TECH
    expect((await pull(TECH, { deviceId: device, cursor: 0, snapshot: "bm90LWEtdG9rZW4" })).status).toBe(400);
    const future = await pull(TECH, { deviceId: device, cursor: 999_999 });
    expect(future.status).toBe(409);
    expect(future.body.error.code).toBe("conflict");
    expect((await pull(TECH2, { deviceId: device, cursor: 0 })).status).toBe(403);
    expect((await pull(null, { deviceId: device, cursor: 0 })).status).toBe(401);
    expect((await pull(TECH, { deviceId: "not-a-uuid", cursor: 0 })).status).toBe(400);
    expect((await pull(TECH, { deviceId: device, cursor: -1 })).status).toBe(400);
  });

  it("stores the pending report a pull carries", async () => {
    const device = uid();
    await pull(TECH, { deviceId: device, cursor: 0, pending: 3, pendingTickets: `${T(1)}:3` });
    expect(db.$client.prepare("SELECT pending_count, pending_tickets FROM devices WHERE id = ?").get(device)).toEqual({
      pending_count: 3,
      pending_tickets: JSON.stringify([{ ticketId: T(1), changes: 3 }]),
    });
  });
});
