import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) fs.rmSync(d, { recursive: true, force: true });
});

function freshFile() {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "benchwright-mig-"));
  dirs.push(dir);
  return path.join(dir, "db.sqlite");
}

describe("migrations", () => {
  it("create every core table on an empty database, with the connection pragmas set", () => {
    const db = openDatabase(freshFile());
    const tables = db.$client
      .prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like '__drizzle%' order by name")
      .all()
      .map((r) => (r as { name: string }).name);
    expect(tables).toEqual(expect.arrayContaining(["audit_log", "customers", "machines", "shop_settings", "sign_in_attempts", "tickets", "users"]));
    expect(db.$client.pragma("journal_mode", { simple: true })).toBe("wal");
    expect(db.$client.pragma("foreign_keys", { simple: true })).toBe(1);
    expect(db.$client.pragma("busy_timeout", { simple: true })).toBe(5000);
    db.$client.close();
  });

  it("are applied once: reopening the same file changes nothing", () => {
    const file = freshFile();
    const first = openDatabase(file);
    const applied = first.$client.prepare("select count(*) n from __drizzle_migrations").get() as { n: number };
    first.$client.close();
    const second = openDatabase(file);
    const again = second.$client.prepare("select count(*) n from __drizzle_migrations").get() as { n: number };
    expect(again.n).toBe(applied.n);
    expect(applied.n).toBeGreaterThan(0);
    second.$client.close();
  });

  it("enforce foreign keys (a ticket cannot point at a missing machine)", () => {
    const db = openDatabase(freshFile());
    expect(() =>
      db.$client
        .prepare("insert into tickets (id, number, tag_code, machine_id, customer_id, complaint) values ('t', 1, 'X', 'nope', 'nope', 'x')")
        .run(),
    ).toThrow(/FOREIGN KEY/);
    db.$client.close();
  });
});
