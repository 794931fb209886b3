import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("@/lib/auth/auth", () => import("./helpers/auth-session"));

import { closeDb, getDb, type Db } from "@/db/client";
import { listConflicts, resolveConflict } from "@/lib/sync/server/conflicts";
import { unsyncedBenchWork } from "@/lib/sync/server/devices";
import { tempDb } from "./helpers/db";
import { AT, COUNTER, T, TECH, TECH2, batch, counts, mutation, push, putPhoto, seedShop, uid } from "./helpers/sync-server";
import crypto from "node:crypto";

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

const entry = (ticketId = T(1), extra: Record<string, unknown> = {}) => ({
  id: uid(),
  ticketId,
  procedureId: "two-stroke-saw",
  procedureVersion: 1,
  stepId: "compression",
  value: { pressurePsi: 125 },
  at: AT,
  ...extra,
});
const ticketVersion = (id: string) => (db.$client.prepare("SELECT version, status FROM tickets WHERE id = ?").get(id) as { version: number; status: string });

describe("POST /api/sync/push", () => {
  it("applies a batch of every kind of bench change in one go, stamping each with a new server version", async () => {
    const device = uid();
    const labor = uid();
    const finding = uid();
    const mutations = [
      mutation(1, "bench.entry.recorded", entry()),
      mutation(2, "finding.added", {
        id: finding, ticketId: T(1), grade: "cause", title: "Varnished carburetor", note: "Old fuel gummed the jets.",
        photoIds: [], suggestedParts: [{ description: "Carburetor rebuild kit", qty: 1 }], suggestedLaborMinutes: 45, at: AT,
      }),
      mutation(3, "finding.changed", { id: finding, grade: "due_soon", at: AT }),
      mutation(4, "tune.recorded", { id: uid(), ticketId: T(1), screw: "low", kind: "baseline", eighths: 8, baselineKind: "seated-then-out", at: AT }),
      mutation(5, "tune.recorded", { id: uid(), ticketId: T(1), screw: "low", kind: "turn", direction: "cw", eighths: 2, at: "2026-05-04T14:31:00.000Z" }),
      mutation(6, "labor.started", { id: labor, ticketId: T(1), startedAt: AT }),
      mutation(7, "labor.stopped", { id: labor, endedAt: "2026-05-04T15:12:00.000Z" }),
      mutation(8, "ticket.note_added", { id: uid(), ticketId: T(1), text: "Customer says it sat since June.", at: AT }),
      mutation(9, "parts.used", { id: uid(), ticketId: T(1), description: "Fuel line 3/32 in", qty: 0.5, at: AT }),
      mutation(10, "ticket.status_changed", { ticketId: T(1), status: "awaiting_ok", baseVersion: 1, at: AT }),
    ];
    const before = db.$client.prepare("SELECT max(version) AS v FROM change_log").get() as { v: number };
    const res = await push(TECH, batch(device, mutations));
    expect(res.status).toBe(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(Array(10).fill("applied"));
    expect(res.body.lastSeq).toBe(10);
    expect(res.body.serverVersion).toBeGreaterThan(before.v);
    const c = counts(db);
    expect(c).toMatchObject({ bench_entries: 1, findings: 1, tune_entries: 2, labor_entries: 1, ticket_notes: 1, parts_used: 1, applied_mutations: 10, devices: 1 });
    expect(db.$client.prepare("SELECT grade, revision, changed_by FROM findings").get()).toEqual({ grade: "due_soon", revision: 2, changed_by: TECH.id });
    expect(db.$client.prepare("SELECT ended_at - started_at AS ms FROM labor_entries").get()).toEqual({ ms: 42 * 60_000 });
    expect(ticketVersion(T(1))).toEqual({ version: 2, status: "awaiting_ok" });
    // Versions: strictly increasing, one line per row.
    const log = db.$client.prepare("SELECT version FROM change_log ORDER BY version").all() as { version: number }[];
    expect(new Set(log.map((l) => l.version)).size).toBe(log.length);
    const dev = db.$client.prepare("SELECT user_id, last_seq FROM devices WHERE id = ?").get(device);
    expect(dev).toEqual({ user_id: TECH.id, last_seq: 10 });
  });

  it("answers an already-applied batch with `duplicate` and changes nothing", async () => {
    const device = uid();
    const body = batch(device, [mutation(1, "bench.entry.recorded", entry()), mutation(2, "ticket.status_changed", { ticketId: T(1), status: "in_repair", baseVersion: 1, at: AT })]);
    await push(TECH, body);
    const after = counts(db);
    const again = await push(TECH, body);
    expect(again.status).toBe(200);
    expect(again.body.results.map((r: { status: string }) => r.status)).toEqual(["duplicate", "duplicate"]);
    expect(counts(db)).toEqual(after);
    expect(ticketVersion(T(1)).version).toBe(2); // applied once: one bump, not two
  });

  it("refuses a gap in the device's sequence without recording it, then takes the missing change and the rest", async () => {
    const device = uid();
    await push(TECH, batch(device, [mutation(1, "bench.entry.recorded", entry())]));
    const three = mutation(3, "bench.entry.recorded", entry());
    const gap = await push(TECH, batch(device, [three]));
    expect(gap.body.results[0]).toMatchObject({ status: "rejected", reason: { code: "gap", retryable: true, expectedSeq: 2 } });
    expect(counts(db).bench_entries).toBe(1);
    const fill = await push(TECH, batch(device, [mutation(2, "bench.entry.recorded", entry()), three]));
    expect(fill.body.results.map((r: { status: string }) => r.status)).toEqual(["applied", "applied"]);
    expect(counts(db).bench_entries).toBe(3);
  });

  it("rejects a change whose args fail its schema, names the field, records the answer and moves on", async () => {
    const device = uid();
    const bad = mutation(1, "tune.recorded", { id: uid(), ticketId: T(1), screw: "low", kind: "turn", eighths: 2, at: AT }); // no direction
    const unknown = mutation(2, "chain.sharpened", { id: uid() });
    const good = mutation(3, "bench.entry.recorded", entry());
    const res = await push(TECH, batch(device, [bad, unknown, good]));
    expect(res.body.results[0]).toMatchObject({ status: "rejected", reason: { code: "invalid", fields: { direction: "Choose a direction: in or out." } } });
    expect(res.body.results[1]).toMatchObject({ status: "rejected", reason: { code: "invalid" } });
    expect(res.body.results[2]).toMatchObject({ status: "applied" });
    // The response was lost; the device sends the same batch again and gets the same answers.
    const again = await push(TECH, batch(device, [bad, unknown, good]));
    expect(again.body.results.map((r: { status: string }) => r.status)).toEqual(["rejected", "rejected", "duplicate"]);
    expect(again.body.results[0].reason).toEqual(res.body.results[0].reason);
  });

  describe("a malformed batch gets a 400 in the one error shape and changes nothing", () => {
    const cases: Array<[string, (device: string) => unknown, string?]> = [
      ["no device id", () => ({ protocolVersion: 1, mutations: [] })],
      ["a device id that is not a UUID", () => batch("phone-1", [])],
      ["sequence numbers out of order", (d) => batch(d, [mutation(2, "bench.entry.recorded", entry()), mutation(1, "bench.entry.recorded", entry())])],
      ["the same change twice", (d) => { const m = mutation(1, "bench.entry.recorded", entry()); return batch(d, [m, { ...m, seq: 2 }]); }],
      ["a change without a time", (d) => batch(d, [{ mutationId: uid(), seq: 1, name: "bench.entry.recorded", args: entry() }])],
      ["more than 500 changes", (d) => batch(d, Array.from({ length: 501 }, (_, i) => mutation(i + 1, "bench.entry.recorded", entry())))],
      ["not JSON", () => null, "{not json"],
    ];
    for (const [what, make, raw] of cases) {
      it(what, async () => {
        const before = counts(db);
        const res = await push(TECH, make(uid()), raw);
        expect(res.status).toBe(400);
        expect(res.body.error.code).toBe("validation");
        expect(typeof res.body.error.message).toBe("string");
        expect(counts(db)).toEqual(before);
      });
    }
  });

  it("answers 401 when signed out, 426 for an old protocol, 403 for a device bound to another person — nothing applied", async () => {
    const device = uid();
    const before = counts(db);
    expect((await push(null, batch(device, [mutation(1, "bench.entry.recorded", entry())]))).status).toBe(401);
    const old = await push(TECH, { ...batch(device, [mutation(1, "bench.entry.recorded", entry())]), protocolVersion: 0 });
    expect(old.status).toBe(426); // [RFC 9110 §15.5.22] 426 Upgrade Required
    expect(old.body.error.code).toBe("upgrade_required");
    expect(counts(db)).toEqual(before);
    await push(TECH, batch(device, [mutation(1, "bench.entry.recorded", entry())]));
    const other = await push(TECH2, batch(device, [mutation(2, "bench.entry.recorded", entry())]));
    expect(other.status).toBe(403);
    expect(other.body.error.code).toBe("forbidden");
    expect(counts(db).bench_entries).toBe(1);
  });

  it("checks the role: a tech cannot price a part or hand a machine back; the counter can price", async () => {
    const res = await push(TECH, batch(uid(), [
      mutation(1, "parts.used", { id: uid(), ticketId: T(1), description: "Spark plug", qty: 1, unitPriceCents: 499, at: AT }),
      mutation(2, "ticket.status_changed", { ticketId: T(1), status: "handed_back", baseVersion: 1, at: AT }),
      mutation(3, "parts.used", { id: uid(), ticketId: T(1), description: "Spark plug", qty: 1, at: AT }),
    ]));
    expect(res.body.results.map((r: { status: string; reason?: { code: string } }) => r.reason?.code ?? r.status)).toEqual(["forbidden", "forbidden", "applied"]);
    expect(ticketVersion(T(1)).status).toBe("on_bench");
    const counter = await push(COUNTER, batch(uid(), [mutation(1, "parts.used", { id: uid(), ticketId: T(1), description: "Spark plug", qty: 1, unitPriceCents: 499, at: AT })]));
    expect(counter.body.results[0].status).toBe("applied");
    expect(db.$client.prepare("SELECT unit_price_cents FROM parts_used WHERE unit_price_cents IS NOT NULL").all()).toEqual([{ unit_price_cents: 499 }]);
  });

  it("lets a tech void only their own entries", async () => {
    const mine = entry();
    await push(TECH, batch(uid(), [mutation(1, "bench.entry.recorded", mine)]));
    const res = await push(TECH2, batch(uid(), [mutation(1, "bench.entry.voided", { id: mine.id, reason: "wrong saw", at: AT })]));
    expect(res.body.results[0].reason.code).toBe("forbidden");
    const own = await push(TECH, batch(uid(), [mutation(1, "bench.entry.voided", { id: mine.id, reason: "misread the gauge", at: AT })]));
    expect(own.body.results[0].status).toBe("applied");
    expect(db.$client.prepare("SELECT void_reason, voided_by FROM bench_entries").get()).toEqual({ void_reason: "misread the gauge", voided_by: TECH.id });
  });

  it("keeps the server's header value on a version mismatch and records the device's value as a conflict", async () => {
    // The counter moves the ticket (a plain update; the trigger bumps the version to 2).
    db.$client.prepare("UPDATE tickets SET status = 'awaiting_parts' WHERE id = ?").run(T(1));
    const mutationId = uid();
    const res = await push(TECH, batch(uid(), [mutation(1, "ticket.status_changed", { ticketId: T(1), status: "ready", baseVersion: 1, at: AT }, mutationId)]));
    const r = res.body.results[0];
    expect(r).toMatchObject({ status: "rejected", reason: { code: "conflict" } });
    expect(r.reason.message).toContain("Waiting for parts");
    expect(r.current).toMatchObject({ entity: "ticket", op: "upsert", row: { status: "awaiting_parts", version: 2 } });
    expect(ticketVersion(T(1))).toEqual({ version: 2, status: "awaiting_parts" });
    const [conflict] = listConflicts(db);
    expect(conflict).toMatchObject({ ticketId: T(1), field: "status", deviceValue: "ready", serverValue: "awaiting_parts", baseVersion: 1, serverVersion: 2, userName: TECH.name });
    resolveConflict(db, { conflictId: conflict!.id, userId: COUNTER.id, resolution: "used_device" });
    expect(ticketVersion(T(1))).toEqual({ version: 3, status: "ready" });
    expect(listConflicts(db)).toEqual([]);
  });

  it("rejects facts for a closed ticket and hands back the tombstone so the device can drop its copy", async () => {
    const res = await push(TECH, batch(uid(), [mutation(1, "ticket.note_added", { id: uid(), ticketId: T(8), text: "Cord replaced", at: AT })]));
    expect(res.body.results[0]).toMatchObject({ status: "rejected", reason: { code: "closed" }, current: { entity: "ticket_note", op: "delete" } });
    expect(res.body.results[0].reason.message).toMatch(/Ticket #\d+ was closed \(Handed back/);
    const missing = await push(TECH, batch(uid(), [mutation(1, "ticket.note_added", { id: uid(), ticketId: uid(), text: "?", at: AT })]));
    expect(missing.body.results[0].reason.code).toBe("not_found");
  });

  it("attaches a photo only once its bytes are on the server", async () => {
    // [ITU-T T.81] a JPEG starts with the SOI marker FF D8, then a marker segment FF xx.
    const bytes = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), crypto.randomBytes(2000)]);
    const sha = crypto.createHash("sha256").update(bytes).digest("hex");
    const photo = { id: uid(), ticketId: T(1), sha256: sha, mime: "image/jpeg", bytes: bytes.length, width: 1600, height: 1200, at: AT };
    const device = uid();
    const early = await push(TECH, batch(device, [mutation(1, "photo.attached", photo)]));
    expect(early.body.results[0].reason.code).toBe("photo_missing");
    expect((await putPhoto(TECH, sha, bytes)).status).toBe(201);
    const later = await push(TECH, batch(device, [mutation(2, "photo.attached", { ...photo, id: uid() })]));
    expect(later.body.results[0].status).toBe("applied");
  });

  it("refuses a tune entry that drives a seated screw further in (lib/trade/tune's rule)", async () => {
    // Common practice, no single source: a gently seated mixture screw cannot turn further in.
    const res = await push(TECH, batch(uid(), [
      mutation(1, "tune.recorded", { id: uid(), ticketId: T(1), screw: "high", kind: "baseline", eighths: 2, baselineKind: "seated-then-out", at: "2026-05-04T14:00:00.000Z" }),
      mutation(2, "tune.recorded", { id: uid(), ticketId: T(1), screw: "high", kind: "turn", direction: "cw", eighths: 4, at: "2026-05-04T14:01:00.000Z" }),
      mutation(3, "tune.recorded", { id: uid(), ticketId: T(1), screw: "high", kind: "turn", direction: "cw", eighths: 2, at: "2026-05-04T14:02:00.000Z" }),
    ]));
    expect(res.body.results.map((r: { status: string; reason?: { code: string } }) => r.reason?.code ?? r.status)).toEqual(["applied", "tune_refused", "applied"]);
    expect(res.body.results[1].reason.message).toContain("cannot go ½ turn further in");
  });

  it("stores what the device still holds and reports it per ticket for the counter", async () => {
    const device = uid();
    await push(TECH, batch(device, [], { pending: { count: 5, tickets: [{ ticketId: T(1), changes: 3 }, { ticketId: T(2), changes: 2 }] } }));
    await push(TECH2, batch(uid(), [], { pending: { count: 1, tickets: [{ ticketId: T(1), changes: 1 }] } }));
    const work = unsyncedBenchWork(db);
    expect(work.get(T(1))).toMatchObject({ changes: 4, deviceUser: `${TECH.name}, ${TECH2.name}` });
    expect(work.get(T(2))).toMatchObject({ changes: 2, deviceUser: TECH.name });
    expect(work.get(T(2))!.reportedAt).toBeInstanceOf(Date);
    await push(TECH, batch(device, [], { pending: { count: 0, tickets: [] } }));
    expect(unsyncedBenchWork(db).has(T(2))).toBe(false);
  });
});
