import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { mod37_2 } from "cdigit";
import { eq } from "drizzle-orm";

const session = vi.hoisted(() => ({ current: null as unknown }));
vi.mock("@/lib/auth/auth", () => ({ auth: vi.fn(async () => session.current) }));

import { closeDb, getDb } from "@/db/client";
import { auditLog, tickets } from "@/db/schema";
import { issueSticker, replaceTag, resolveTag } from "@/lib/counter/tags";
import { GET as tagRoute } from "@/app/api/tags/[code]/route";
import { formatTagCode, generateTagCode, isValidTagCode, TAG_ALPHABET } from "@/lib/trade/tag-code";
import { tempDb } from "./helpers/db";
import { addCustomer, addMachine, addTicket, makeShop, PEOPLE, replaying, sessionFor, ticketRow } from "./helpers/shop";

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

async function ask(code: string) {
  const res = await tagRoute(new Request(`http://test/api/tags/${encodeURIComponent(code)}`), { params: Promise.resolve({ code }) });
  return { status: res.status, body: await res.json() };
}

/** A valid code with one character changed: MOD 37-2 catches every single substitution. */
function misread(code: string): string {
  const last = code.at(-1)!;
  const other = [...TAG_ALPHABET].find((c) => c !== last)!;
  return code.slice(0, -1) + other;
}

describe("tag codes for tickets", () => {
  it("every new ticket gets a code whose check character verifies with an independent MOD 37-2 implementation", () => {
    const cust = addCustomer(ctx.db);
    const codes = Array.from({ length: 40 }, () => addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust }).tagCode);
    for (const code of codes) {
      expect(isValidTagCode(code)).toBe(true);
      expect(mod37_2.validate(code)).toBe(true); // [ISO/IEC 7064 MOD 37-2 via cdigit]
    }
    expect(new Set(codes).size).toBe(codes.length);
  });

  it("a sticker never takes a code a ticket already carries", () => {
    const cust = addCustomer(ctx.db);
    const machine = addMachine(ctx.db, cust);
    const t = addTicket(ctx.db, { machineId: machine, customerId: cust });
    // The random source first replays the ticket's own code, so a free code has to be drawn again.
    const sticker = issueSticker(ctx.db, { machineId: machine, actorId: PEOPLE.counter.id }, replaying(TAG_ALPHABET, [t.tagCode]));
    expect(sticker).not.toBe(t.tagCode);
    expect(isValidTagCode(sticker)).toBe(true);
  });

  it("a ticket never takes a sticker's code or a retired tag's code", () => {
    const cust = addCustomer(ctx.db);
    const machine = addMachine(ctx.db, cust);
    const sticker = issueSticker(ctx.db, { machineId: machine, actorId: null });
    const first = addTicket(ctx.db, { machineId: machine, customerId: cust });
    const { oldCode } = replaceTag(ctx.db, { ticketId: first.id, reason: "torn", actorId: null });
    const next = addTicket(ctx.db, { machineId: machine, customerId: cust }, replaying(TAG_ALPHABET, [sticker, oldCode]));
    expect([sticker, oldCode]).not.toContain(next.tagCode);
  });

  it("issuing a sticker twice returns the same code", () => {
    const machine = addMachine(ctx.db, addCustomer(ctx.db));
    const a = issueSticker(ctx.db, { machineId: machine, actorId: null });
    expect(issueSticker(ctx.db, { machineId: machine, actorId: null })).toBe(a);
    expect(ctx.db.select().from(auditLog).where(eq(auditLog.action, "machine.sticker_issued")).all()).toHaveLength(1);
  });
});

describe("replacing a tag", () => {
  it("gives the ticket a new code; the old code then answers 'replaced' with the current one", () => {
    const cust = addCustomer(ctx.db);
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust });
    const { oldCode, newCode } = replaceTag(ctx.db, { ticketId: t.id, reason: "Tag melted off the muffler", actorId: PEOPLE.counter.id });
    expect(oldCode).toBe(t.tagCode);
    expect(newCode).not.toBe(oldCode);
    expect(ticketRow(ctx.db, t.id).tagCode).toBe(newCode);
    const { number, status } = ticketRow(ctx.db, t.id);
    expect(resolveTag(ctx.db, oldCode)).toEqual({ kind: "replaced", ticketId: t.id, number, status, currentCode: newCode });
    expect(resolveTag(ctx.db, newCode)).toEqual({ kind: "ticket", ticketId: t.id, number, status });
    const log = ctx.db.select().from(auditLog).where(eq(auditLog.action, "ticket.tag_replaced")).get();
    expect(log?.details).toEqual({ oldCode, newCode, reason: "Tag melted off the muffler" });
  });

  it("a second replacement keeps both retired codes pointing at the newest code", () => {
    const cust = addCustomer(ctx.db);
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust });
    const a = replaceTag(ctx.db, { ticketId: t.id, reason: "", actorId: null });
    const b = replaceTag(ctx.db, { ticketId: t.id, reason: "", actorId: null });
    const { number, status } = ticketRow(ctx.db, t.id);
    expect(resolveTag(ctx.db, a.oldCode)).toEqual({ kind: "replaced", ticketId: t.id, number, status, currentCode: b.newCode });
    expect(resolveTag(ctx.db, b.oldCode)).toEqual({ kind: "replaced", ticketId: t.id, number, status, currentCode: b.newCode });
  });

  it("refuses an unknown ticket with not_found", () => {
    expect(() => replaceTag(ctx.db, { ticketId: "nope", reason: "", actorId: null })).toThrow(expect.objectContaining({ code: "not_found" }));
  });
});

describe("GET /api/tags/<code>", () => {
  it("answers a ticket's tag, forgiving case and the printed dash", async () => {
    const cust = addCustomer(ctx.db);
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust });
    const { number, status } = ticketRow(ctx.db, t.id);
    expect(await ask(formatTagCode(t.tagCode).toLowerCase())).toEqual({ status: 200, body: { kind: "ticket", ticketId: t.id, number, status } });
  });

  it("says when a ticket's tag belongs to a ticket that has left the shop (the bench tells the tech so)", async () => {
    const cust = addCustomer(ctx.db);
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust });
    ctx.db.update(tickets).set({ status: "handed_back", closedAt: new Date() }).where(eq(tickets.id, t.id)).run();
    expect((await ask(t.tagCode)).body).toMatchObject({ kind: "ticket", ticketId: t.id, status: "handed_back" });
  });

  it("answers a sticker with the machine's open ticket, and without one once none is open", async () => {
    const cust = addCustomer(ctx.db);
    const machine = addMachine(ctx.db, cust);
    const code = issueSticker(ctx.db, { machineId: machine, actorId: null });
    expect(await ask(code)).toEqual({ status: 200, body: { kind: "sticker", machineId: machine } });
    const t = addTicket(ctx.db, { machineId: machine, customerId: cust });
    expect(await ask(code)).toEqual({ status: 200, body: { kind: "sticker", machineId: machine, openTicketId: t.id } });
    ctx.db.update(tickets).set({ status: "handed_back", closedAt: new Date() }).where(eq(tickets.id, t.id)).run();
    expect(await ask(code)).toEqual({ status: 200, body: { kind: "sticker", machineId: machine } });
  });

  it("answers 400 in the error shape when the check character is wrong", async () => {
    const cust = addCustomer(ctx.db);
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust });
    const bad = misread(t.tagCode);
    expect(mod37_2.validate(bad)).toBe(false); // [ISO/IEC 7064 via cdigit] a single substitution is always detected
    const { status, body } = await ask(bad);
    expect(status).toBe(400);
    expect(body.error.code).toBe("validation");
    expect(body.error.message).toMatch(/does not check out/);
  });

  it("answers 404 in the error shape for a well-formed code nobody carries", async () => {
    const code = generateTagCode(); // nothing has been issued in this empty shop
    const { status, body } = await ask(code);
    expect(status).toBe(404);
    expect(body).toEqual({ error: { code: "not_found", message: `No ticket or machine carries the tag ${formatTagCode(code)}.` } });
  });

  it("is open to every signed-in role (the bench asks too) and closed to the signed-out", async () => {
    const cust = addCustomer(ctx.db);
    const t = addTicket(ctx.db, { machineId: addMachine(ctx.db, cust), customerId: cust });
    for (const p of [PEOPLE.tech, PEOPLE.owner, PEOPLE.counter]) {
      session.current = sessionFor(p);
      expect((await ask(t.tagCode)).status).toBe(200);
    }
    session.current = null;
    expect((await ask(t.tagCode)).status).toBe(401);
  });

  it("reads the same database as the server (getDb)", () => {
    expect(getDb().$client.name).toBe(ctx.db.$client.name);
  });
});
