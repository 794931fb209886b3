import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { eq } from "drizzle-orm";

const session = vi.hoisted(() => ({ current: null as unknown }));
vi.mock("@/lib/auth/auth", () => ({ auth: vi.fn(async () => session.current) }));

import { closeDb } from "@/db/client";
import { auditLog, ticketHandbacks } from "@/db/schema";
import { assignTech, handBack, handBackFormSchema, moveStatus } from "@/lib/counter/ticket-actions";
import { findComebackOf } from "@/lib/counter/intake";
import { DAY_MS } from "@/lib/counter/dates";
import { POST as statusRoute } from "@/app/api/counter/tickets/[id]/status/route";
import { POST as techRoute } from "@/app/api/counter/tickets/[id]/tech/route";
import { tempDb } from "./helpers/db";
import { addCustomer, addMachine, addTicket, makeShop, PEOPLE, sessionFor, ticketRow } from "./helpers/shop";

let ctx: ReturnType<typeof tempDb>;
beforeEach(() => {
  ctx = tempDb();
  closeDb();
  makeShop(ctx.db);
  session.current = sessionFor(PEOPLE.counter);
});
afterEach(() => {
  closeDb();
  ctx.cleanup();
});

/** 2026-12-01 15:00 in Chicago (CST, UTC−6). */
const NOW = Date.UTC(2026, 11, 1, 21, 0);

function ticket(daysAgo = 2) {
  const cust = addCustomer(ctx.db);
  const machine = addMachine(ctx.db, cust);
  return { machine, ...addTicket(ctx.db, { machineId: machine, customerId: cust, createdAt: new Date(NOW - daysAgo * DAY_MS) }) };
}

const post = (handler: typeof statusRoute, id: string, body: unknown) =>
  handler(new Request(`http://test/api/counter/tickets/${id}/x`, { method: "POST", body: JSON.stringify(body) }), { params: Promise.resolve({ id }) });

describe("moving a ticket's status", () => {
  it("updates the row and writes the move with its reason to the history", () => {
    const t = ticket();
    moveStatus(ctx.db, { ticketId: t.id, from: "taken_in", to: "awaiting_parts", reason: "Carb kit on order", actorId: PEOPLE.counter.id });
    expect(ticketRow(ctx.db, t.id).status).toBe("awaiting_parts");
    const log = ctx.db.select().from(auditLog).where(eq(auditLog.action, "ticket.status")).get();
    expect(log).toMatchObject({ actorId: PEOPLE.counter.id, entityId: t.id, details: { from: "taken_in", to: "awaiting_parts", reason: "Carb kit on order" } });
  });

  it("refuses a move made from a stale screen with 409, leaving the newer status", async () => {
    const t = ticket();
    moveStatus(ctx.db, { ticketId: t.id, from: "taken_in", to: "on_bench", reason: "", actorId: null });
    const res = await post(statusRoute, t.id, { from: "taken_in", to: "ready" });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/is now "On the bench"/);
    expect(ticketRow(ctx.db, t.id).status).toBe("on_bench");
  });

  it("sends closing through hand-back and refuses a no-op move", async () => {
    const t = ticket();
    const close = await post(statusRoute, t.id, { from: "taken_in", to: "handed_back" });
    expect(close.status).toBe(400);
    expect((await close.json()).error.fields.to).toMatch(/Hand back/);
    expect((await post(statusRoute, t.id, { from: "taken_in", to: "taken_in" })).status).toBe(400);
    expect((await post(statusRoute, t.id, { from: "taken_in", to: "bogus" })).status).toBe(400);
    expect((await post(statusRoute, "nope", { from: "taken_in", to: "ready" })).status).toBe(404);
  });

  it("is for the counter and the owner only", async () => {
    const t = ticket();
    session.current = sessionFor(PEOPLE.tech);
    expect((await post(statusRoute, t.id, { from: "taken_in", to: "on_bench" })).status).toBe(403);
    session.current = sessionFor(PEOPLE.owner);
    const res = await post(statusRoute, t.id, { from: "taken_in", to: "on_bench", reason: "Starting today" });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ status: "on_bench" });
  });
});

describe("assigning a technician", () => {
  it("assigns, reassigns and unassigns, logging each change", async () => {
    const t = ticket();
    expect((await post(techRoute, t.id, { techId: PEOPLE.tech.id })).status).toBe(200);
    expect(ticketRow(ctx.db, t.id).assignedTechId).toBe(PEOPLE.tech.id);
    assignTech(ctx.db, { ticketId: t.id, techId: PEOPLE.tech2.id, actorId: null });
    assignTech(ctx.db, { ticketId: t.id, techId: null, actorId: null });
    expect(ticketRow(ctx.db, t.id).assignedTechId).toBeNull();
    const log = ctx.db.select().from(auditLog).where(eq(auditLog.action, "ticket.assigned")).all().map((l) => l.details);
    expect(log).toEqual([
      { from: null, to: PEOPLE.tech.id, toName: PEOPLE.tech.name },
      { from: PEOPLE.tech.id, to: PEOPLE.tech2.id, toName: PEOPLE.tech2.name },
      { from: PEOPLE.tech2.id, to: null, toName: null },
    ]);
  });

  it("refuses a switched-off technician or someone who is not a technician", async () => {
    const t = ticket();
    expect((await post(techRoute, t.id, { techId: PEOPLE.retiredTech.id })).status).toBe(400);
    expect((await post(techRoute, t.id, { techId: PEOPLE.owner.id })).status).toBe(400);
    expect((await post(techRoute, t.id, { techId: "x" })).status).toBe(400);
  });
});

describe("hand-back", () => {
  const form = (ticketId: string, over: Record<string, string> = {}) =>
    handBackFormSchema.parse({ ticketId, outcome: "handed_back", collectedBy: "Wendeline Aspinall (owner)", collectedDate: "2026-12-01", collectedTime: "14:30", note: "", ...over });

  it("records who collected it and when (shop time), closes the ticket and keeps it in the history", () => {
    const t = ticket();
    const { closedAt } = handBack(ctx.db, form(t.id), PEOPLE.counter.id, NOW);
    // [IANA tz] 14:30 CST (UTC−6) on 1 Dec 2026 = 20:30 UTC
    expect(closedAt.toISOString()).toBe("2026-12-01T20:30:00.000Z");
    expect(ticketRow(ctx.db, t.id)).toMatchObject({ status: "handed_back", closedAt });
    expect(ctx.db.select().from(ticketHandbacks).where(eq(ticketHandbacks.ticketId, t.id)).get()).toMatchObject({
      outcome: "handed_back",
      collectedBy: "Wendeline Aspinall (owner)",
      collectedAt: closedAt,
      recordedById: PEOPLE.counter.id,
    });
    expect(ctx.db.select().from(auditLog).where(eq(auditLog.action, "ticket.handed_back")).get()?.details).toMatchObject({ from: "taken_in", outcome: "handed_back" });
    expect(findComebackOf(ctx.db, t.machine, NOW + 3 * DAY_MS, 30)).toBe(t.id);
  });

  it("can return a machine unrepaired, which is not a comeback when it returns", () => {
    const t = ticket();
    handBack(ctx.db, form(t.id, { outcome: "returned_unrepaired", note: "Customer declined the estimate" }), null, NOW);
    expect(ticketRow(ctx.db, t.id).status).toBe("returned_unrepaired");
    expect(findComebackOf(ctx.db, t.machine, NOW + DAY_MS, 30)).toBeNull();
  });

  it("refuses a time still to come, a time before intake, a day that does not exist, and a second hand-back", () => {
    const t = ticket(1);
    expect(() => handBack(ctx.db, form(t.id, { collectedTime: "16:30" }), null, NOW)).toThrow(expect.objectContaining({ fields: { collectedTime: expect.stringMatching(/not come yet/) } }));
    expect(() => handBack(ctx.db, form(t.id, { collectedDate: "2026-11-20" }), null, NOW)).toThrow(expect.objectContaining({ fields: { collectedDate: expect.stringMatching(/before the machine was taken in/) } }));
    expect(() => handBack(ctx.db, form(t.id, { collectedDate: "2026-11-31" }), null, NOW)).toThrow(expect.objectContaining({ fields: { collectedDate: expect.stringMatching(/real date/) } }));
    expect(() => handBack(ctx.db, form(t.id, { collectedTime: "2:30 pm" }), null, NOW)).toThrow(expect.objectContaining({ fields: { collectedTime: expect.any(String) } }));
    expect(ticketRow(ctx.db, t.id).status).toBe("taken_in");
    handBack(ctx.db, form(t.id), null, NOW);
    expect(() => handBack(ctx.db, form(t.id), null, NOW)).toThrow(expect.objectContaining({ code: "conflict" }));
    expect(() => moveStatus(ctx.db, { ticketId: t.id, from: "handed_back", to: "ready", reason: "", actorId: null })).toThrow(expect.objectContaining({ code: "conflict" }));
  });

  it("needs the name of who collected it", () => {
    expect(handBackFormSchema.safeParse({ ticketId: "x", outcome: "handed_back", collectedBy: "  ", collectedDate: "2026-12-01", collectedTime: "10:00" }).success).toBe(false);
    expect(handBackFormSchema.safeParse({ ticketId: "x", outcome: "lost", collectedBy: "A", collectedDate: "2026-12-01", collectedTime: "10:00" }).success).toBe(false);
  });
});

describe("last activity", () => {
  it("a status move changes updated_at (the board's last activity)", () => {
    const t = ticket();
    const before = ticketRow(ctx.db, t.id).updatedAt.getTime();
    moveStatus(ctx.db, { ticketId: t.id, from: "taken_in", to: "on_bench", reason: "", actorId: null, now: new Date(NOW) });
    expect(ticketRow(ctx.db, t.id).updatedAt.getTime()).toBeGreaterThan(before);
  });
});
