import fs from "node:fs";
import path from "node:path";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { CLOSED_STATUSES } from "@/lib/tickets/status";
import { tempDb } from "./helpers/db";
import { T, seedShop } from "./helpers/sync-fixtures";
import { saveProcedure } from "@/db/procedures";

let ctx: ReturnType<typeof tempDb>;
let db: Db;
beforeEach(async () => {
  ctx = tempDb();
  db = ctx.db;
  await seedShop(db);
});
afterEach(() => ctx.cleanup());

const SYNCED = ["tickets", "machines", "customers", "procedures", "bench_entries", "findings", "tune_entries", "photos", "labor_entries", "ticket_notes", "parts_used"];
const log = () => db.$client.prepare("SELECT version, entity, entity_id AS id, op FROM change_log ORDER BY version").all() as Array<{ version: number; entity: string; id: string; op: string }>;
const top = () => (db.$client.prepare("SELECT max(version) AS v FROM change_log").get() as { v: number }).v;

describe("change capture triggers", () => {
  it("the custom migration and db/sql/sync-triggers.sql are the same SQL", () => {
    const dir = path.resolve("db/migrations");
    const file = fs.readdirSync(dir).find((f) => f.endsWith("_sync_triggers.sql"));
    expect(file).toBeDefined();
    expect(fs.readFileSync(path.join(dir, file!), "utf8")).toBe(fs.readFileSync(path.resolve("db/sql/sync-triggers.sql"), "utf8"));
  });

  it("name the same closed statuses as lib/tickets/status.ts", () => {
    const sqlText = fs.readFileSync(path.resolve("db/sql/sync-triggers.sql"), "utf8");
    const lists = [...sqlText.matchAll(/IN \(([^)]*)\)/g)].map((m) => m[1]!).filter((l) => l.includes("'"));
    expect(lists.length).toBeGreaterThan(0);
    for (const l of lists) expect(l.split(",").map((s) => s.trim().replace(/'/g, "")).sort()).toEqual([...CLOSED_STATUSES].sort());
  });

  it("exist for insert, update and delete on every synced table", () => {
    const names = new Set((db.$client.prepare("SELECT name, tbl_name FROM sqlite_master WHERE type = 'trigger'").all() as Array<{ name: string }>).map((t) => t.name));
    for (const t of SYNCED) {
      const want = t === "tickets" ? ["insert", "update", "delete", "bump_version"] : ["insert", "update", "delete"];
      for (const w of want) expect(names, `${t} ${w}`).toContain(`sync_${t}_${w}`);
    }
  });

  it("bump the ticket header version by exactly one per update, whoever writes it", () => {
    db.$client.prepare("UPDATE tickets SET promised_date = '2026-06-01' WHERE id = ?").run(T(1));
    db.$client.prepare("UPDATE tickets SET status = 'in_repair' WHERE id = ?").run(T(1));
    // A writer that sets the version itself is not bumped a second time.
    db.$client.prepare("UPDATE tickets SET status = 'ready', version = version + 1 WHERE id = ?").run(T(1));
    expect(db.$client.prepare("SELECT version FROM tickets WHERE id = ?").get(T(1))).toEqual({ version: 4 });
  });

  it("keep one line per row at its newest version, every version higher than the last", () => {
    const before = top();
    db.$client.prepare("UPDATE customers SET phone = '555-0199' WHERE id = ?").run("00000000-0000-4000-8100-000000000003");
    db.$client.prepare("UPDATE customers SET phone = '555-0198' WHERE id = ?").run("00000000-0000-4000-8100-000000000003");
    const lines = log().filter((l) => l.id === "00000000-0000-4000-8100-000000000003");
    expect(lines).toHaveLength(1);
    expect(lines[0]!.version).toBe(before + 2);
    const keys = log().map((l) => `${l.entity}:${l.id}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it("log a saved procedure, and a newer version of it, but not an older one", () => {
    const before = top();
    const p = { id: "blower-2s", machineKind: "blower", name: "Two-stroke blower", definition: { steps: [] } };
    expect(saveProcedure(db, { ...p, version: 2 })).toBe(true);
    expect(saveProcedure(db, { ...p, version: 1 })).toBe(false);
    expect(saveProcedure(db, { ...p, version: 3, name: "Backpack blower" })).toBe(true);
    expect(log().filter((l) => l.version > before)).toEqual([expect.objectContaining({ entity: "procedure", id: "blower-2s", op: "update" })]);
    expect(db.$client.prepare("SELECT name, version FROM procedures WHERE id = 'blower-2s'").get()).toEqual({ name: "Backpack blower", version: 3 });
  });

  it("log a deletion as a tombstone line", () => {
    db.$client.prepare("INSERT INTO procedures (id, machine_kind, name, definition) VALUES ('p2', 'blower', 'Blower', '{}')").run();
    db.$client.prepare("DELETE FROM procedures WHERE id = 'p2'").run();
    expect(log().at(-1)).toMatchObject({ entity: "procedure", id: "p2", op: "delete" });
  });

  it("re-log a ticket's machine, customer and bench facts when it is reopened", () => {
    db.$client.prepare("INSERT INTO ticket_notes (id, ticket_id, text, at, author_id) VALUES ('n1', ?, 'x', 0, ?)").run(T(8), "00000000-0000-4000-8000-000000000003");
    const before = top();
    db.$client.prepare("UPDATE tickets SET status = 'in_repair' WHERE id = ?").run(T(8));
    const after = log().filter((l) => l.version > before).map((l) => `${l.entity}:${l.op}`).sort();
    expect(after).toEqual(["customer:touch", "machine:touch", "ticket:update", "ticket_note:touch"]);
  });
});
