import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { count, eq } from "drizzle-orm";

const session = vi.hoisted(() => ({ current: null as unknown }));
vi.mock("@/lib/auth/auth", () => ({ auth: vi.fn(async () => session.current) }));
vi.mock("next/cache", () => ({ revalidatePath: vi.fn() }));

import { closeDb } from "@/db/client";
import { auditLog, customers, machines, photoFiles, photos, tickets } from "@/db/schema";
import { createIntake, findComebackOf, takeIn } from "@/lib/counter/intake";
import { EMPTY_INTAKE, type IntakeValues } from "@/lib/counter/intake-schema";
import { DAY_MS } from "@/lib/counter/dates";
import { takeInAction } from "@/app/counter/intake/actions";
import { GET as machinesRoute } from "@/app/api/counter/machines/route";
import { GET as customersRoute } from "@/app/api/counter/customers/route";
import { isValidTagCode } from "@/lib/trade/tag-code";
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

const values = (over: Partial<IntakeValues> = {}): IntakeValues => ({
  ...EMPTY_INTAKE,
  firstName: "Wendeline",
  lastName: "Aspinall",
  phone: "555-0131",
  email: "wendeline@example.org",
  contactPreference: "email",
  emailConsent: true,
  kind: "string_trimmer",
  engineType: "two_stroke",
  make: "Quillam",
  model: "QT-25",
  serial: "QT25-44810",
  complaintPicks: ["stalls_at_idle"],
  complaint: "Dies when the trigger is let go.",
  conditionFlags: ["fuel_in_tank"],
  conditionNote: "Guard cracked at the edge.",
  accessories: "Spare spool",
  promisedDate: "2026-12-03",
  approvalLimit: "$85",
  assignedTechId: PEOPLE.tech.id,
  ...over,
});

const rows = (table: typeof customers | typeof machines | typeof tickets) => ctx.db.select({ n: count() }).from(table).get()!.n;

describe("taking a machine in", () => {
  it("creates the customer, the machine and the ticket with its number, tag code and intake details", () => {
    const r = takeIn(ctx.db, values(), PEOPLE.counter.id, NOW);
    if (!r.ok) throw new Error(JSON.stringify(r));
    expect(isValidTagCode(r.tagCode)).toBe(true);
    expect(r.number).toBe(1001);
    const t = ticketRow(ctx.db, r.ticketId);
    expect(t).toMatchObject({
      status: "taken_in",
      complaint: "Dies when the trigger is let go.",
      complaintTags: ["stalls_at_idle"],
      intakeCondition: { flags: ["fuel_in_tank"], note: "Guard cracked at the edge." },
      accessories: "Spare spool",
      promisedDate: "2026-12-03",
      approvalLimitCents: 8_500,
      assignedTechId: PEOPLE.tech.id,
      createdById: PEOPLE.counter.id,
      comebackOfTicketId: null,
    });
    expect(ctx.db.select().from(customers).where(eq(customers.id, t.customerId)).get()).toMatchObject({
      lastName: "Aspinall",
      contactPreference: "email",
      emailConsent: true,
    });
    expect(ctx.db.select().from(machines).where(eq(machines.id, t.machineId)).get()).toMatchObject({
      customerId: t.customerId,
      kind: "string_trimmer",
      serial: "QT25-44810",
    });
    const actions = ctx.db.select({ a: auditLog.action }).from(auditLog).all().map((x) => x.a);
    expect(actions).toEqual(["customer.created", "machine.created", "ticket.created"]);
  });

  it("returns every field error at once and writes nothing", () => {
    const r = takeIn(ctx.db, values({ phone: "12ab", email: "nope@", promisedDate: "2026-11-30", approvalLimit: "1.234" }), PEOPLE.counter.id, NOW);
    expect(r).toMatchObject({ ok: false, fields: { phone: expect.any(String), email: expect.any(String), promisedDate: expect.stringMatching(/passed/), approvalLimit: expect.any(String) } });
    expect([rows(customers), rows(machines), rows(tickets)]).toEqual([0, 0, 0]);
  });

  it("uses the shop's date for 'in the past': 22:00 on 30 Nov in Chicago is still 30 Nov", () => {
    const lateEvening = Date.UTC(2026, 11, 1, 4, 0); // [IANA tz] 04:00 UTC = 22:00 CST the day before
    expect(takeIn(ctx.db, values({ promisedDate: "2026-11-30" }), PEOPLE.counter.id, lateEvening).ok).toBe(true);
  });

  it("flags a serial already on file (case and dashes ignored) and saves nothing until confirmed", () => {
    const owner = addCustomer(ctx.db, { firstName: "Hartley", lastName: "Quenby" });
    const existing = addMachine(ctx.db, owner, { kind: "string_trimmer", make: "Quillam", model: "QT-25", serial: "QT25-44810" });
    const r = takeIn(ctx.db, values({ serial: "qt25 44810" }), PEOPLE.counter.id, NOW);
    expect(r).toMatchObject({
      ok: false,
      fields: { serial: expect.stringMatching(/already on file: Quillam QT-25 \(string trimmer\), Hartley Quenby/) },
      duplicates: [{ machineId: existing, customerId: owner }],
    });
    expect([rows(customers), rows(machines), rows(tickets)]).toEqual([1, 1, 0]);

    const confirmed = takeIn(ctx.db, values({ serial: "qt25 44810", serialIsDifferent: true }), PEOPLE.counter.id, NOW);
    expect(confirmed.ok).toBe(true);
    expect(rows(machines)).toBe(2);
    const log = ctx.db.select().from(auditLog).where(eq(auditLog.action, "machine.created")).get();
    expect(log?.details).toEqual({ duplicateSerialConfirmed: true });
  });

  it("takes an existing customer and machine, saving changed contact choices", () => {
    const cust = addCustomer(ctx.db, { lastName: "Aspinall", firstName: "Wendeline", phone: "555-0131", email: "", contactPreference: "phone" });
    const machine = addMachine(ctx.db, cust);
    const r = takeIn(ctx.db, values({ customerId: cust, machineId: machine, kind: "", engineType: "", make: "" }), PEOPLE.counter.id, NOW);
    expect(r.ok).toBe(true);
    expect(ctx.db.select().from(customers).where(eq(customers.id, cust)).get()).toMatchObject({ email: "wendeline@example.org", contactPreference: "email", emailConsent: true });
    expect([rows(customers), rows(machines), rows(tickets)]).toEqual([1, 1, 1]);
    const upd = ctx.db.select().from(auditLog).where(eq(auditLog.action, "customer.updated")).get();
    expect(upd?.details).toEqual({ fields: ["email", "contactPreference", "emailConsent"] });
  });

  it("refuses a switched-off technician and an unknown machine, beside their fields", () => {
    expect(takeIn(ctx.db, values({ assignedTechId: PEOPLE.retiredTech.id }), PEOPLE.counter.id, NOW)).toMatchObject({ ok: false, fields: { assignedTechId: expect.stringMatching(/not an active bench technician/) } });
    expect(takeIn(ctx.db, values({ assignedTechId: PEOPLE.counter.id }), PEOPLE.counter.id, NOW)).toMatchObject({ ok: false, fields: { assignedTechId: expect.any(String) } });
    const cust = addCustomer(ctx.db);
    expect(
      takeIn(ctx.db, values({ customerId: cust, machineId: "00000000-0000-4000-8200-00000000abcd" }), PEOPLE.counter.id, NOW),
    ).toMatchObject({ ok: false, fields: { machineId: expect.stringMatching(/no longer on file/) } });
    expect(rows(tickets)).toBe(0);
  });
});

describe("comebacks", () => {
  function handedBack(daysAgo: number, status: "handed_back" | "returned_unrepaired" = "handed_back") {
    const cust = addCustomer(ctx.db);
    const machine = addMachine(ctx.db, cust);
    const earlier = addTicket(ctx.db, { machineId: machine, customerId: cust, createdAt: new Date(NOW - (daysAgo + 5) * DAY_MS) });
    ctx.db.update(tickets).set({ status, closedAt: new Date(NOW - daysAgo * DAY_MS) }).where(eq(tickets.id, earlier.id)).run();
    return { cust, machine, earlier: earlier.id };
  }
  const again = (h: ReturnType<typeof handedBack>) =>
    takeIn(ctx.db, values({ customerId: h.cust, machineId: h.machine, kind: "", engineType: "", make: "" }), PEOPLE.counter.id, NOW);

  it("marks a machine back 12 days after its hand-back as a comeback of that ticket", () => {
    const h = handedBack(12);
    const r = again(h);
    if (!r.ok) throw new Error(r.message);
    expect(r.comebackOfTicketId).toBe(h.earlier);
    expect(ticketRow(ctx.db, r.ticketId).comebackOfTicketId).toBe(h.earlier);
  });

  it("counts the window's last day in and the day after out (30-day default)", () => {
    const h = handedBack(30);
    expect(findComebackOf(ctx.db, h.machine, NOW, 30)).toBe(h.earlier);
    expect(findComebackOf(ctx.db, h.machine, NOW + 60_000, 30)).toBeNull();
    expect(findComebackOf(ctx.db, h.machine, NOW, 31)).toBe(h.earlier);
  });

  it("follows the owner's window and is off at 0 days", () => {
    const h = handedBack(10);
    expect(findComebackOf(ctx.db, h.machine, NOW, 7)).toBeNull();
    expect(findComebackOf(ctx.db, h.machine, NOW, 0)).toBeNull();
  });

  it("does not count a machine that went back unrepaired", () => {
    const h = handedBack(5, "returned_unrepaired");
    const r = again(h);
    expect(r.ok && r.comebackOfTicketId).toBeNull();
  });

  it("never marks a new machine (even one with a confirmed duplicate serial)", () => {
    const h = handedBack(3);
    ctx.db.update(machines).set({ serial: "QT25-44810" }).where(eq(machines.id, h.machine)).run();
    const r = createIntake(
      ctx.db,
      {
        customer: { id: h.cust, firstName: "A", lastName: "B", phone: "555-0100", email: "", contactPreference: "phone", emailConsent: false },
        machine: { id: null, kind: "chain_saw", engineType: "two_stroke", make: "Tarnwick", model: "", serial: "QT25-44810", serialIsDifferent: true },
        complaintPicks: ["service"], complaint: "", condition: { flags: [], note: "" }, accessories: "", promisedDate: null, approvalLimitCents: null, assignedTechId: null, photos: [],
      },
      null,
      NOW,
    );
    expect(r.ok && r.comebackOfTicketId).toBeNull();
  });
});

describe("the intake server action and search routes", () => {
  it("refuses a technician and the signed-out, and saves for the counter", async () => {
    session.current = sessionFor(PEOPLE.tech);
    expect(await takeInAction(values({ promisedDate: "" }))).toMatchObject({ ok: false, message: "Your role does not allow this." });
    session.current = null;
    expect(await takeInAction(values({ promisedDate: "" }))).toMatchObject({ ok: false, message: "Sign in to continue." });
    session.current = sessionFor(PEOPLE.owner);
    expect(await takeInAction(values({ promisedDate: "" }))).toMatchObject({ ok: true });
  });

  it("finds customers by surname, phone digits and e-mail", async () => {
    addCustomer(ctx.db, { firstName: "Hartley", lastName: "Quenby", phone: "(312) 555-0178", email: "hq@example.net" });
    addCustomer(ctx.db, { firstName: "Ilse", lastName: "Quenby-Moss", phone: "555-0190" });
    const find = async (q: string) =>
      ((await (await customersRoute(new Request(`http://test/api/counter/customers?q=${encodeURIComponent(q)}`), undefined)).json()) as { customers: Array<{ lastName: string }> }).customers.map((c) => c.lastName);
    expect(await find("quenby")).toEqual(["Quenby", "Quenby-Moss"]);
    expect(await find("hartley quen")).toEqual(["Quenby"]);
    expect(await find("3125550178")).toEqual(["Quenby"]);
    expect(await find("555 0190")).toEqual(["Quenby-Moss"]);
    expect(await find("hq@example")).toEqual(["Quenby"]);
    expect(await find("%")).toEqual([]); // a LIKE wildcard is matched literally
  });

  it("finds a machine by serial part, by a ticket's tag and by its sticker; flags duplicates by serial", async () => {
    const cust = addCustomer(ctx.db, { lastName: "Quenby", firstName: "Hartley" });
    const machine = addMachine(ctx.db, cust, { serial: "TW40-77123" });
    const t = addTicket(ctx.db, { machineId: machine, customerId: cust });
    const get = async (qs: string) => (await machinesRoute(new Request(`http://test/api/counter/machines?${qs}`), undefined)).json();
    expect((await get("q=77123")).machines).toMatchObject([{ id: machine, customerName: "Hartley Quenby", openTickets: [{ id: t.id, statusLabel: "Taken in" }] }]);
    expect((await get(`q=${t.tagCode.toLowerCase()}`)).machines).toMatchObject([{ id: machine }]);
    expect((await get("serial=tw40 77123")).duplicates).toMatchObject([{ machineId: machine }]);
    expect((await get(`customerId=${cust}`)).machines).toHaveLength(1);
    const bad = await machinesRoute(new Request("http://test/api/counter/machines?customerId=nope"), undefined);
    expect(bad.status).toBe(400);
    session.current = sessionFor(PEOPLE.tech);
    expect((await machinesRoute(new Request("http://test/api/counter/machines?q=77123"), undefined)).status).toBe(403);
  });
});

describe("intake photos", () => {
  const sha = (n: number) => String(n).repeat(64).slice(0, 64);
  const photo = (n: number) => ({ sha256: sha(n), mime: "image/jpeg" as const, bytes: 1234, width: 1600, height: 1200 });
  const stored = (n: number) =>
    ctx.db.insert(photoFiles).values({ sha256: sha(n), mime: "image/jpeg", bytes: 1234, fileName: `${sha(n)}.jpg`, uploadedBy: PEOPLE.counter.id }).run();

  it("attach uploaded photos to the new ticket, marked as taken at intake", () => {
    stored(1);
    stored(2);
    const r = takeIn(ctx.db, values({ photos: [photo(1), photo(2), photo(1)] }), PEOPLE.counter.id, NOW);
    if (!r.ok) throw new Error(JSON.stringify(r));
    const rows = ctx.db.select().from(photos).where(eq(photos.ticketId, r.ticketId)).all();
    expect(rows.map((p) => [p.sha256, p.stepId, p.takenBy])).toEqual([
      [sha(1), "intake", PEOPLE.counter.id],
      [sha(2), "intake", PEOPLE.counter.id],
    ]);
  });

  it("refuse a photo the store never received, name the field and save nothing", () => {
    const before = rows(tickets);
    const r = takeIn(ctx.db, values({ photos: [photo(3)] }), PEOPLE.counter.id, NOW);
    expect(r).toMatchObject({ ok: false, fields: { photos: "A photo did not finish uploading. Remove it and take it again." } });
    expect(rows(tickets)).toBe(before);
  });

  it("refuse more than six", () => {
    const r = takeIn(ctx.db, values({ photos: [1, 2, 3, 4, 5, 6, 7].map(photo) }), PEOPLE.counter.id, NOW);
    expect(r).toMatchObject({ ok: false, fields: { photos: "Keep it to 6 photos." } });
  });
});
