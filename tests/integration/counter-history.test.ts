import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import { customerHistory, historySearch, machineHistory } from "@/lib/counter/history";
import { describeEntry } from "@/lib/counter/history-words";
import { takeIn } from "@/lib/counter/intake";
import { EMPTY_INTAKE } from "@/lib/counter/intake-schema";
import { replaceTag } from "@/lib/counter/tags";
import { handBack, handBackFormSchema, moveStatus } from "@/lib/counter/ticket-actions";
import { ticketDetail } from "@/lib/counter/ticket-detail";
import { DAY_MS } from "@/lib/counter/dates";
import { tempDb } from "./helpers/db";
import { addCustomer, addMachine, addTicket, makeShop, PEOPLE } from "./helpers/shop";

let ctx: ReturnType<typeof tempDb>;
beforeEach(() => {
  ctx = tempDb();
  closeDb();
  makeShop(ctx.db);
});
afterEach(() => {
  closeDb();
  ctx.cleanup();
});

/** 2026-12-01 15:00 in Chicago. */
const NOW = Date.UTC(2026, 11, 1, 21, 0);

function storyOfOneSaw() {
  const cust = addCustomer(ctx.db, { firstName: "Hartley", lastName: "Quenby", phone: "555-0178" });
  const machine = addMachine(ctx.db, cust, { make: "Tarnwick", model: "TW-40", serial: "TW40-77123" });
  const first = addTicket(ctx.db, { machineId: machine, customerId: cust, createdAt: new Date(NOW - 20 * DAY_MS), assignedTechId: PEOPLE.tech.id });
  replaceTag(ctx.db, { ticketId: first.id, reason: "soaked in bar oil", actorId: PEOPLE.counter.id, now: new Date(NOW - 19 * DAY_MS) });
  moveStatus(ctx.db, { ticketId: first.id, from: "taken_in", to: "ready", reason: "", actorId: PEOPLE.counter.id, now: new Date(NOW - 16 * DAY_MS) });
  handBack(
    ctx.db,
    handBackFormSchema.parse({ ticketId: first.id, outcome: "handed_back", collectedBy: "Hartley Quenby", collectedDate: "2026-11-16", collectedTime: "10:15", note: "" }),
    PEOPLE.counter.id,
    NOW - 15 * DAY_MS,
  );
  const again = takeIn(ctx.db, { ...EMPTY_INTAKE, customerId: cust, lastName: "Quenby", phone: "555-0178", machineId: machine, complaintPicks: ["runs_rough"] }, PEOPLE.counter.id, NOW);
  if (!again.ok) throw new Error(again.message);
  return { cust, machine, first: first.id, second: again.ticketId };
}

describe("machine and customer history", () => {
  it("lists every ticket of a machine, newest first, with the hand-back, earlier tags and the comeback mark", () => {
    const s = storyOfOneSaw();
    const h = machineHistory(ctx.db, s.machine)!;
    expect(h.tickets.map((t) => t.id)).toEqual([s.second, s.first]);
    const [second, first] = h.tickets;
    expect(second!.comebackOf).toEqual({ id: s.first, number: first!.number });
    expect(first!.handBack).toMatchObject({ outcome: "handed_back", collectedBy: "Hartley Quenby" });
    expect(first!.retiredCodes).toHaveLength(1);
    expect(first!.status).toBe("handed_back");
    expect(h.owner?.lastName).toBe("Quenby");
  });

  it("gathers a customer's machines, including one on file under someone else that came in on their ticket", () => {
    const s = storyOfOneSaw();
    const other = addCustomer(ctx.db, { lastName: "Vossberg" });
    const borrowed = addMachine(ctx.db, other, { make: "Orrin", model: "OB-2" });
    addTicket(ctx.db, { machineId: borrowed, customerId: s.cust, createdAt: new Date(NOW - DAY_MS) });
    const h = customerHistory(ctx.db, s.cust)!;
    expect(h.machines.map((m) => m.machine.id).sort()).toEqual([s.machine, borrowed].sort());
    expect(h.machines.find((m) => m.machine.id === s.machine)!.tickets).toHaveLength(2);
  });

  it("finds machines by serial, make and model, and customers by name or phone", () => {
    const s = storyOfOneSaw();
    expect(historySearch(ctx.db, "tarnwick tw").machines.map((m) => m.id)).toEqual([s.machine]);
    expect(historySearch(ctx.db, "77123").machines.map((m) => m.id)).toEqual([s.machine]);
    expect(historySearch(ctx.db, "5550178").customers.map((c) => c.id)).toEqual([s.cust]);
    expect(historySearch(ctx.db, "quenby").customers.map((c) => c.id)).toEqual([s.cust]);
  });

  it("tells the ticket's story in plain words, in order", () => {
    const s = storyOfOneSaw();
    const d = ticketDetail(ctx.db, s.first)!;
    const lines = d.history.map((e) => describeEntry(e));
    expect(lines.map((l) => l.what)).toEqual([
      expect.stringMatching(/^Taken in as #\d+ with tag [0-9A-Z]{3}-[0-9A-Z]{4}$/),
      expect.stringMatching(/^Tag replaced: [0-9A-Z]{3}-[0-9A-Z]{4} → [0-9A-Z]{3}-[0-9A-Z]{4}$/),
      "Taken in → Ready for pickup",
      "Handed back to Hartley Quenby",
    ]);
    expect(lines.find((l) => l.what.startsWith("Tag replaced"))?.why).toBe("soaked in bar oil");
    expect(ticketDetail(ctx.db, s.second)!.comebackOf?.id).toBe(s.first);
    expect(ticketDetail(ctx.db, s.first)!.cameBackAs.map((x) => x.id)).toEqual([s.second]);
  });
});
