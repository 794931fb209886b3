import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { DEMO_USERS, seedDemo, seedDemoBenchWork, ensureShop } from "@/db/seed";
import { tickets } from "@/db/schema";
import { isValidTagCode } from "@/lib/trade/tag-code";
import { verifyPassword } from "@/lib/auth/password";
import { tempDb } from "./helpers/db";

let ctx: ReturnType<typeof tempDb>;
beforeEach(() => {
  process.env.BCRYPT_COST = "4";
  ctx = tempDb();
});
afterEach(() => ctx.cleanup());

const counts = (db: typeof ctx.db) =>
  Object.fromEntries(
    ["users", "customers", "machines", "tickets", "shop_settings", "audit_log", "bench_entries", "findings", "tune_entries", "labor_entries", "ticket_notes", "change_log"].map((t) => [
      t,
      (db.get(sql.raw(`select count(*) as n from ${t}`)) as { n: number }).n,
    ]),
  );

describe("demo seed", () => {
  it("creates the invented shop with the three demo roles and tickets in several statuses", async () => {
    const { created } = await seedDemo(ctx.db);
    expect(created).toBe(true);
    const roles = ctx.db.$client.prepare("select email, role from users order by email").all();
    expect(roles).toEqual(expect.arrayContaining(DEMO_USERS.map(({ email, role }) => ({ email, role }))));
    const statuses = new Set(ctx.db.select({ s: tickets.status }).from(tickets).all().map((r) => r.s));
    expect(statuses.size).toBeGreaterThanOrEqual(5);
    for (const t of ctx.db.select().from(tickets).all()) expect(isValidTagCode(t.tagCode)).toBe(true);
  });

  it("is idempotent: seeding twice duplicates nothing", async () => {
    await seedDemo(ctx.db);
    seedDemoBenchWork(ctx.db);
    const before = counts(ctx.db);
    expect(before).toMatchObject({ bench_entries: 8, findings: 4, tune_entries: 2, labor_entries: 1, ticket_notes: 1 });
    seedDemoBenchWork(ctx.db);
    const second = await seedDemo(ctx.db);
    expect(second.created).toBe(false);
    expect(counts(ctx.db)).toEqual(before);
  });

  it("gives every demo account the documented password", async () => {
    await seedDemo(ctx.db);
    const row = ctx.db.$client.prepare("select password_hash h from users where email = ?").get("tech@demo.benchwright.test") as { h: string };
    expect(await verifyPassword("benchwright-demo", row.h)).toBe(true);
    expect(await verifyPassword("benchwright-demo ", row.h)).toBe(false);
  });

  it("an empty shop (DEMO=0) has its settings row and no people", () => {
    ensureShop(ctx.db);
    ensureShop(ctx.db);
    expect(counts(ctx.db)).toMatchObject({ shop_settings: 1, users: 0, tickets: 0 });
  });
});
