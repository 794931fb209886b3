import path from "node:path";
import Database from "better-sqlite3";
import { drizzle } from "drizzle-orm/better-sqlite3";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

const session = vi.hoisted(() => ({ current: null as unknown }));
vi.mock("@/lib/auth/auth", () => ({ auth: vi.fn(async () => session.current) }));

import { closeDb, type Db } from "@/db/client";
import * as schema from "@/db/schema";
import { queuePage, queueQuerySchema, type QueueQuery } from "@/lib/counter/queue";
import { dateIn, DAY_MS } from "@/lib/counter/dates";
import { GET as queueRoute } from "@/app/api/counter/queue/route";
import { OPEN_STATUSES, TICKET_STATUSES } from "@/lib/tickets/status";
import { formatTagCode } from "@/lib/trade/tag-code";
import { seedQueue, type MadeTicket } from "../fixtures/queue-data";
import { tempDb } from "./helpers/db";
import { makeShop, PEOPLE, sessionFor } from "./helpers/shop";

/** 2026-12-01 15:00 in Chicago. */
const NOW = Date.UTC(2026, 11, 1, 21, 0);
const TODAY = dateIn("America/Chicago", NOW);
const N = 5000;

let ctx: ReturnType<typeof tempDb>;
let made: MadeTicket[] = [];

/** 5,000 invented tickets over 600 customers, in every status, some unassigned, some overdue, some with no promise. */
beforeAll(() => {
  ctx = tempDb();
  closeDb();
  makeShop(ctx.db);
  made = seedQueue(ctx.db, { tickets: N, customers: 600, techIds: [PEOPLE.tech.id, PEOPLE.tech2.id, null], now: NOW, timezone: "America/Chicago" }).filter((t) =>
    (OPEN_STATUSES as string[]).includes(t.status),
  );
});
afterAll(() => {
  closeDb();
  ctx.cleanup();
});

const q = (over: Record<string, string> = {}): QueueQuery => queueQuerySchema.parse(over);
const page = (over: Record<string, string> = {}) => queuePage(ctx.db, q(over), NOW);

/** Every page of a query, concatenated. */
function all(over: Record<string, string> = {}) {
  const first = page({ ...over, pageSize: "100" });
  const ids = first.rows.map((r) => r.id);
  for (let p = 2; p <= first.pageCount; p++) ids.push(...page({ ...over, pageSize: "100", page: String(p) }).rows.map((r) => r.id));
  return { first, ids };
}

describe("the queue board with 5,000 tickets", () => {
  it("counts open tickets per status exactly, leaving closed ones out", () => {
    const { counts, total } = page();
    for (const s of TICKET_STATUSES) expect(counts[s]).toBe(made.filter((t) => t.status === s).length);
    expect(counts.handed_back + counts.returned_unrepaired).toBe(0);
    expect(total).toBe(made.length);
    expect(made.length).toBeGreaterThan(4000);
  });

  it("pages through every open ticket once, in ticket-number order", () => {
    const { first, ids } = all({ sort: "number" });
    expect(first.pageCount).toBe(Math.ceil(made.length / 100));
    expect(ids).toEqual([...made].sort((a, b) => a.number - b.number).map((t) => t.id));
  });

  it("sorts by promised date with unpromised tickets last, oldest intake breaking ties", () => {
    const { ids } = all({ sort: "promised" });
    const expected = [...made].sort(
      (a, b) =>
        Number(a.promisedDate === null) - Number(b.promisedDate === null) ||
        (a.promisedDate ?? "").localeCompare(b.promisedDate ?? "") ||
        a.createdAt - b.createdAt ||
        a.number - b.number,
    );
    expect(ids).toEqual(expected.map((t) => t.id));
  });

  it("sorts by status in the order of a ticket's life, and by days in the shop", () => {
    const byStatus = page({ sort: "status", pageSize: "100" }).rows;
    expect(byStatus.every((r) => r.status === "taken_in")).toBe(true);
    const last = page({ sort: "status", dir: "desc", pageSize: "100" }).rows;
    expect(last.every((r) => r.status === "ready")).toBe(true);
    const oldest = page({ sort: "days", dir: "desc", pageSize: "10" }).rows.map((r) => r.id);
    expect(oldest).toEqual([...made].sort((a, b) => a.createdAt - b.createdAt || a.number - b.number).slice(0, 10).map((t) => t.id));
  });

  it("filters by status, technician and overdue together, and counts with the other filters applied", () => {
    const r = all({ status: "awaiting_parts", tech: PEOPLE.tech2.id, overdue: "1", sort: "number" });
    const expected = made.filter((t) => t.status === "awaiting_parts" && t.techId === PEOPLE.tech2.id && t.promisedDate !== null && t.promisedDate < TODAY);
    expect(r.ids).toEqual(expected.sort((a, b) => a.number - b.number).map((t) => t.id));
    expect(r.first.rows.every((row) => row.overdue && row.tech?.name === PEOPLE.tech2.name)).toBe(true);
    expect(r.first.counts.in_repair).toBe(made.filter((t) => t.status === "in_repair" && t.techId === PEOPLE.tech2.id && t.promisedDate !== null && t.promisedDate < TODAY).length);
    expect(page({ tech: "none" }).total).toBe(made.filter((t) => t.techId === null).length);
  });

  it("finds by surname, tag code (with or without the dash), ticket number and serial", () => {
    const target = made[1234]!;
    expect(all({ q: target.lastName.toLowerCase() }).ids.sort()).toEqual(made.filter((t) => t.lastName === target.lastName).map((t) => t.id).sort());
    expect(page({ q: formatTagCode(target.tagCode) }).rows.map((r) => r.id)).toEqual([target.id]);
    expect(page({ q: target.tagCode.toLowerCase() }).rows.map((r) => r.id)).toEqual([target.id]);
    expect(page({ q: `#${target.number}` }).rows.map((r) => r.id)).toEqual([target.id]);
    expect(page({ q: target.serial }).rows.map((r) => r.id)).toEqual([target.id]);
    expect(page({ q: "100%" }).total).toBe(0);
  });

  it("gives each row its days in the shop and overdue mark in the shop's calendar", () => {
    const rows = page({ sort: "number", pageSize: "100" }).rows;
    for (const r of rows) {
      const t = made.find((m) => m.id === r.id)!;
      const taken = dateIn("America/Chicago", t.createdAt);
      expect(r.daysInShop).toBe(Math.round((Date.parse(TODAY) - Date.parse(taken)) / DAY_MS));
      expect(r.overdue).toBe(t.promisedDate !== null && t.promisedDate < TODAY);
      expect(r.unsynced).toBeNull();
    }
  });

  it("keeps a page past the end on the last page", () => {
    const p = page({ page: "999", pageSize: "100" });
    expect(p.page).toBe(p.pageCount);
    expect(p.rows.length).toBeGreaterThan(0);
  });

  it("never reads the whole tickets table for the board's queries", () => {
    const statements: string[] = [];
    const spy = new Database(path.join(ctx.dir, "benchwright.sqlite"), { verbose: (s) => statements.push(String(s)) });
    const spyDb = drizzle(spy, { schema }) as unknown as Db;
    const cases: Array<Record<string, string>> = [{}, { status: "on_bench" }, { tech: PEOPLE.tech.id, overdue: "1" }, { sort: "customer" }];
    for (const over of cases) queuePage(spyDb, q(over), NOW);
    const plans = statements
      .filter((s) => /from "tickets"/.test(s))
      .map((s) => (spy.prepare(`explain query plan ${s}`).all() as Array<{ detail: string }>).map((p) => p.detail).join("\n"));
    spy.close();
    expect(plans.length).toBeGreaterThanOrEqual(8);
    for (const plan of plans) {
      expect(plan).toMatch(/SEARCH tickets USING (COVERING )?INDEX tickets_(status|tech)/);
      expect(plan).not.toMatch(/SCAN tickets(?! USING)/);
    }
  });
});

describe("GET /api/counter/queue", () => {
  it("answers the counter and the owner, refuses the bench and bad parameters", async () => {
    const get = (qs: string) => queueRoute(new Request(`http://test/api/counter/queue?${qs}`), undefined);
    session.current = sessionFor(PEOPLE.counter);
    const ok = await get("pageSize=5&sort=number");
    expect(ok.status).toBe(200);
    const body = await ok.json();
    expect(body.rows).toHaveLength(5);
    expect(body.techs.map((t: { name: string }) => t.name)).toEqual([PEOPLE.tech.name, PEOPLE.tech2.name]); // active techs only
    const bad = await get("status=handed_back");
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fields.status).toMatch(/open tickets only/);
    expect((await get("sort=colour")).status).toBe(400);
    expect((await get("pageSize=1000")).status).toBe(400);
    session.current = sessionFor(PEOPLE.owner);
    expect((await get("")).status).toBe(200);
    session.current = sessionFor(PEOPLE.tech);
    expect((await get("")).status).toBe(403);
  });
});
