import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { DeviceDb, DEVICE_SCHEMA_VERSIONS, pendingChangeCount, readIdentity, readSyncState } from "@/lib/sync/device-db";
import { record, RecordError, retryAttention, dismissAttention } from "@/lib/sync/record";
import { adoptSignedInUser, markSignedOut } from "@/lib/sync/session";
import { applyServerChanges } from "@/lib/sync/effects";
import { benchEntriesFor, ticketsForToday, ticketByTag, photosFor, syncStatus, waitingRowIds } from "@/lib/sync/read";
import type { TicketRow } from "@/lib/sync/protocol";

/**
 * The device store in fake-indexeddb (an implementation of the W3C Indexed Database API used as the
 * outside reference for transaction semantics: a transaction commits all of its writes or none).
 */
const TECH = { id: "00000000-0000-4000-8000-000000000003", name: "Tomas Brevik", email: "tech@demo.benchwright.test", role: "tech" };
const TECH2 = { id: "00000000-0000-4000-8000-000000000004", name: "June Okafor-Lind", email: "tech2@demo.benchwright.test", role: "tech" };
const T1 = "00000000-0000-4000-8300-000000000001";
const T2 = "00000000-0000-4000-8300-000000000002";

function ticket(id: string, extra: Partial<TicketRow> = {}): TicketRow {
  return {
    id, number: 1001, tagCode: "HKRTNAD", machineId: `m-${id}`, customerId: `c-${id}`, status: "on_bench", complaint: "Won't start",
    complaintTags: [], intakeCondition: { flags: [], note: "" }, accessories: "", promisedDate: null, approvalLimitCents: null,
    assignedTechId: TECH.id, version: 1, createdAt: "2026-05-01T08:00:00.000Z", updatedAt: "2026-05-01T08:00:00.000Z", ...extra,
  };
}

let db: DeviceDb;
let n = 0;
const fresh = (upTo?: number, name = `device-${++n}`, factory = new IDBFactory()) => new DeviceDb(name, { indexedDB: factory, IDBKeyRange, upTo });

beforeEach(async () => {
  db = fresh();
  await adoptSignedInUser(TECH, { db });
  await applyServerChanges(db, [
    { entity: "ticket", op: "upsert", id: T1, row: ticket(T1) },
    { entity: "ticket", op: "upsert", id: T2, row: ticket(T2, { number: 1002, tagCode: "XW7MPRC", assignedTechId: null }) },
  ]);
});
afterEach(() => db.close());

const entry = (stepId = "compression", value: unknown = { pressurePsi: 120 }) => ({
  ticketId: T1, procedureId: "two-stroke-saw", procedureVersion: 1, stepId, value: value as never,
});

describe("record()", () => {
  it("writes the row and its outbox entry together, with gap-free sequence numbers that survive a reopen", async () => {
    const a = await record("bench.entry.recorded", entry(), { db });
    const b = await record("ticket.note_added", { ticketId: T1, text: "Sat since June" }, { db });
    expect([a.seq, b.seq]).toEqual([1, 2]);
    expect(await db.benchEntries.get(a.id)).toMatchObject({ id: a.id, ticketId: T1, stepId: "compression", recordedBy: TECH.id, voidedAt: null });
    const outbox = await db.outbox.orderBy("seq").toArray();
    expect(outbox.map((e) => [e.seq, e.name, e.entityId, e.ticketId])).toEqual([
      [1, "bench.entry.recorded", a.id, T1],
      [2, "ticket.note_added", b.id, T1],
    ]);
    expect(new Set(outbox.map((e) => e.deviceId)).size).toBe(1);
    // Reopen (the browser closed the connection): the next change continues the sequence.
    db.close();
    await db.open();
    expect((await record("ticket.note_added", { ticketId: T1, text: "again" }, { db })).seq).toBe(3);
    expect(await pendingChangeCount(db)).toBe(3);
  });

  it("writes nothing when the transaction fails part-way (the outbox write throws)", async () => {
    db.outbox.hook("creating", () => {
      throw new Error("QuotaExceededError");
    });
    await expect(record("bench.entry.recorded", entry(), { db })).rejects.toThrow("QuotaExceededError");
    expect(await db.benchEntries.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
    expect((await readIdentity(db))?.nextSeq).toBe(1);
  });

  it("refuses bad input with the field named, and writes nothing", async () => {
    const err = await record("tune.recorded", { ticketId: T1, screw: "low", kind: "turn", eighths: 2 }, { db }).catch((e) => e);
    expect(err).toBeInstanceOf(RecordError);
    expect(err).toMatchObject({ code: "invalid", fields: { direction: "Choose a direction: in or out." } });
    const empty = await record("ticket.note_added", { ticketId: T1, text: "   " }, { db }).catch((e) => e);
    expect(empty.fields).toEqual({ text: "Enter the note." });
    expect(await db.outbox.count()).toBe(0);
  });

  it("checks the bench's own rules at once: seated screws, prices, double timers, double voids, counter statuses", async () => {
    // lib/trade/tune: a seated screw cannot go further in (common practice, no single source).
    await record("tune.recorded", { ticketId: T1, screw: "low", kind: "baseline", eighths: 0, baselineKind: "seated-then-out", at: "2026-05-04T10:00:00.000Z" }, { db });
    await expect(record("tune.recorded", { ticketId: T1, screw: "low", kind: "turn", direction: "cw", eighths: 1, at: "2026-05-04T10:01:00.000Z" }, { db })).rejects.toMatchObject({ code: "refused", message: expect.stringContaining("already seated") });
    await expect(record("parts.used", { ticketId: T1, description: "Plug", qty: 1, unitPriceCents: 500 }, { db })).rejects.toMatchObject({ code: "refused" });
    const timer = await record("labor.started", { ticketId: T1 }, { db });
    await expect(record("labor.started", { ticketId: T1 }, { db })).rejects.toMatchObject({ code: "refused" });
    await record("labor.stopped", { id: timer.id }, { db });
    const e = await record("bench.entry.recorded", entry(), { db });
    await record("bench.entry.voided", { id: e.id, reason: "wrong gauge" }, { db });
    await expect(record("bench.entry.voided", { id: e.id }, { db })).rejects.toMatchObject({ code: "refused" });
    await expect(record("ticket.status_changed", { ticketId: T1, status: "handed_back" }, { db })).rejects.toMatchObject({ code: "refused" });
    await expect(record("ticket.note_added", { ticketId: "00000000-0000-4000-8300-000000000099", text: "x" }, { db })).rejects.toMatchObject({ code: "not_found" });
  });

  it("fills a status change's base version from the phone and shows the new status at once", async () => {
    await record("ticket.status_changed", { ticketId: T1, status: "awaiting_ok" }, { db });
    const [e] = await db.outbox.toArray();
    expect(e!.args).toMatchObject({ baseVersion: 1, status: "awaiting_ok" });
    expect(await db.tickets.get(T1)).toMatchObject({ status: "awaiting_ok", version: 2 });
    await record("ticket.status_changed", { ticketId: T1, status: "in_repair" }, { db });
    expect((await db.outbox.toArray())[1]!.args.baseVersion).toBe(2);
  });

  it("keeps a photo's bytes on the phone with the attachment", async () => {
    const blob = new Blob([new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3])], { type: "image/jpeg" });
    await record("photo.attached", { ticketId: T1, sha256: "a".repeat(64), mime: "image/jpeg", bytes: 7, width: 1600, height: 1200 }, { db, blob });
    const [p] = await photosFor(T1, db);
    expect(p).toMatchObject({ sha256: "a".repeat(64), width: 1600 });
    expect(p!.blob).not.toBeNull();
    expect((await db.photoBlobs.get("a".repeat(64)))?.uploadedAt).toBeNull();
  });

  it("refuses to record for nobody, or after signing out", async () => {
    const other = fresh();
    await expect(record("ticket.note_added", { ticketId: T1, text: "x" }, { db: other })).rejects.toMatchObject({ code: "not_signed_in" });
    await markSignedOut(db);
    await expect(record("ticket.note_added", { ticketId: T1, text: "x" }, { db })).rejects.toMatchObject({ code: "not_signed_in" });
    other.close();
  });
});

describe("server rows and waiting changes", () => {
  it("re-applies a waiting change on top of a newer server row (the bench keeps showing what the tech did)", async () => {
    const e = await record("bench.entry.recorded", entry(), { db });
    await record("bench.entry.voided", { id: e.id, reason: "misread" }, { db });
    await record("ticket.status_changed", { ticketId: T1, status: "ready" }, { db });
    // A pull brings the entry as the server has it (not voided yet) and a header edit from the counter.
    const serverEntry = { ...(await db.benchEntries.get(e.id))!, voidedAt: null, voidedBy: null, voidReason: null };
    await applyServerChanges(db, [
      { entity: "bench_entry", op: "upsert", id: e.id, row: serverEntry },
      { entity: "ticket", op: "upsert", id: T1, row: ticket(T1, { promisedDate: "2026-06-01" }) },
    ]);
    expect(await db.benchEntries.get(e.id)).toMatchObject({ voidReason: "misread" });
    expect(await db.tickets.get(T1)).toMatchObject({ status: "ready", promisedDate: "2026-06-01", version: 2 });
  });

  it("drops a closed ticket's facts with its tombstone; waiting changes stay in the outbox", async () => {
    await record("ticket.note_added", { ticketId: T1, text: "x" }, { db });
    await applyServerChanges(db, [{ entity: "ticket", op: "delete", id: T1 }]);
    expect(await db.tickets.get(T1)).toBeUndefined();
    expect(await db.ticketNotes.count()).toBe(0);
    expect(await db.outbox.count()).toBe(1);
  });
});

describe("reads for the bench screens", () => {
  it("shows the latest entry per step and keeps the whole history", async () => {
    const first = await record("bench.entry.recorded", { ...entry("compression", { pressurePsi: 90 }), at: "2026-05-04T10:00:00.000Z" }, { db });
    const second = await record("bench.entry.recorded", { ...entry("compression", { pressurePsi: 125 }), at: "2026-05-04T10:05:00.000Z" }, { db });
    const plug = await record("bench.entry.recorded", { ...entry("plug-gap", { gapMm: 0.6 }), at: "2026-05-04T10:06:00.000Z" }, { db });
    await record("bench.entry.voided", { id: plug.id, reason: "wrong plug" }, { db });
    const sheet = await benchEntriesFor(T1, db);
    expect(Object.keys(sheet.latest)).toEqual(["compression"]);
    expect(sheet.latest.compression!.id).toBe(second.id);
    expect(sheet.history.map((h) => h.id)).toEqual([first.id, second.id, plug.id]);
    expect(await waitingRowIds(db)).toEqual(new Set([first.id, second.id, plug.id]));
  });

  it("lists today's work with the tech's own tickets first, and finds a ticket by its tag in any case", async () => {
    await record("ticket.note_added", { ticketId: T1, text: "x" }, { db });
    const list = await ticketsForToday(db);
    expect(list.map((c) => [c.ticket.id, c.mine, c.waiting])).toEqual([[T1, true, 1], [T2, false, 0]]);
    expect((await ticketByTag("xw7-mprc", db))?.ticket.id).toBe(T2);
    expect(await syncStatus(db)).toMatchObject({ waiting: 1, needsAttention: 0, tickets: 2, user: { id: TECH.id } });
  });
});

describe("who the phone works for", () => {
  it("keeps the same person's store, and refuses to switch to another while changes wait", async () => {
    expect((await adoptSignedInUser(TECH, { db })).status).toBe("same");
    await record("ticket.note_added", { ticketId: T1, text: "x" }, { db });
    const blocked = await adoptSignedInUser(TECH2, { db });
    expect(blocked).toMatchObject({ status: "blocked", previous: { id: TECH.id }, waiting: 1 });
    expect((await db.meta.get("user"))?.value).toMatchObject({ id: TECH.id });
    // Meanwhile nothing is recorded under either name.
    await expect(record("ticket.note_added", { ticketId: T1, text: "by June?" }, { db })).rejects.toMatchObject({ code: "not_signed_in" });
    await db.outbox.clear();
    const before = (await readIdentity(db))!.deviceId;
    expect((await adoptSignedInUser(TECH2, { db })).status).toBe("adopted");
    expect((await readIdentity(db))!.deviceId).not.toBe(before);
    expect(await db.tickets.count()).toBe(0);
    expect((await readSyncState(db)).cursor).toBe(0);
  });

  it("the first person signing in again lifts the block", async () => {
    await record("ticket.note_added", { ticketId: T1, text: "x" }, { db });
    expect((await adoptSignedInUser(TECH2, { db })).status).toBe("blocked");
    expect((await adoptSignedInUser(TECH, { db })).status).toBe("same");
    expect((await record("ticket.note_added", { ticketId: T1, text: "again" }, { db })).seq).toBe(2);
  });

  it("clears 'session expired' when the same person signs in again", async () => {
    await db.meta.put({ key: "sync", value: { ...(await readSyncState(db)), sessionExpired: true } });
    await adoptSignedInUser(TECH, { db });
    expect((await readSyncState(db)).sessionExpired).toBe(false);
  });
});

describe("needs attention", () => {
  it("retries a refused change as a new change, or dismisses it", async () => {
    const r = await record("ticket.note_added", { ticketId: T1, text: "x" }, { db });
    const e = (await db.outbox.get(r.seq))!;
    await db.outbox.delete(e.seq);
    await db.attention.put({ ...e, reason: { code: "closed", message: "closed" }, rejectedAt: e.at, uploadError: null });
    const again = await retryAttention(e.mutationId, { db });
    expect(again.seq).toBe(2);
    expect(again.mutationId).not.toBe(e.mutationId);
    expect(await db.attention.count()).toBe(0);
    expect((await db.outbox.get(2))!.args).toEqual(e.args);
    await db.attention.put({ ...e, reason: { code: "closed", message: "closed" }, rejectedAt: e.at, uploadError: null });
    expect(await dismissAttention(e.mutationId, { db })).toMatchObject({ mutationId: e.mutationId });
    expect(await db.attention.count()).toBe(0);
  });
});

describe("schema upgrades keep data", () => {
  it("opens a version-1 store as the current version with every row kept and the new indexes filled", async () => {
    expect(DEVICE_SCHEMA_VERSIONS.at(-1)!.version).toBeGreaterThan(1);
    const factory = new IDBFactory();
    const v1 = fresh(1, "upgrade-me", factory);
    await v1.open();
    expect(v1.verno).toBe(1);
    await v1.table("tickets").put(ticket(T1));
    await v1.table("benchEntries").put({ id: "e1", ticketId: T1, stepId: "compression", at: "2026-05-04T10:00:00.000Z" });
    await v1.table("outbox").add({ seq: 1, mutationId: "m1", deviceId: "d1", name: "ticket.note_added", args: { id: "n1", ticketId: T1, text: "x" }, at: "", userId: TECH.id, ticketId: T1 });
    await v1.table("outbox").add({ seq: 2, mutationId: "m2", deviceId: "d1", name: "ticket.status_changed", args: { ticketId: T1, status: "ready", baseVersion: 1 }, at: "", userId: TECH.id, ticketId: T1 });
    v1.close();

    const current = fresh(undefined, "upgrade-me", factory);
    await current.open();
    expect(current.verno).toBe(DEVICE_SCHEMA_VERSIONS.at(-1)!.version);
    expect(await current.tickets.get(T1)).toMatchObject({ id: T1 });
    expect(await current.benchEntries.where("[ticketId+stepId]").equals([T1, "compression"]).count()).toBe(1);
    expect((await current.outbox.where("entityId").equals("n1").first())?.seq).toBe(1);
    expect((await current.outbox.where("entityId").equals(T1).first())?.seq).toBe(2);
    current.close();
  });
});
