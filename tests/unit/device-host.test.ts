import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { DeviceDb, setDeviceDb } from "@/lib/sync/device-db";
import { startDeviceHost, type DeviceHost } from "@/lib/sync/device-host";
import type { DeviceCall, DeviceReply } from "@/lib/sync/device-messages";
import { applyServerChanges } from "@/lib/sync/effects";
import type { TicketRow } from "@/lib/sync/protocol";
import { record } from "@/lib/sync/record";
import type { WatchName, WatchValue } from "@/lib/sync/watched";

/**
 * The device host (what the device worker runs): watched reads sent first and again only when a write changes
 * their answer, and its calls. Over fake-indexeddb, an implementation of the W3C Indexed Database API.
 */
const TECH = { id: "00000000-0000-4000-8000-000000000003", name: "Tomas Brevik", email: "tech@demo.benchwright.test", role: "tech" };
const T1 = "00000000-0000-4000-8300-000000000001";

const ticket = (id: string): TicketRow => ({
  id, number: 1001, tagCode: "HKRTNAD", machineId: `m-${id}`, customerId: `c-${id}`, status: "on_bench", complaint: "Won't start",
  complaintTags: [], intakeCondition: { flags: [], note: "" }, accessories: "", promisedDate: null, approvalLimitCents: null,
  assignedTechId: TECH.id, version: 1, createdAt: "2026-05-01T08:00:00.000Z", updatedAt: "2026-05-01T08:00:00.000Z",
});

let db: DeviceDb;
let host: DeviceHost;
let replies: DeviceReply[];
let n = 0;
let nextId = 1;

beforeEach(() => {
  db = new DeviceDb(`host-${++n}`, { indexedDB: new IDBFactory(), IDBKeyRange });
  setDeviceDb(db);
  replies = [];
  host = startDeviceHost((r) => replies.push(r));
});
afterEach(() => {
  host.stop();
  setDeviceDb(undefined);
  db.close();
  vi.unstubAllGlobals();
});

async function until<T>(get: () => T | undefined, what: string): Promise<T> {
  for (let i = 0; i < 200; i++) {
    const v = get();
    if (v !== undefined) return v;
    await new Promise((r) => setTimeout(r, 10));
  }
  throw new Error(`no ${what} from the host`);
}

const valuesOf = <N extends WatchName>(name: N) =>
  replies.filter((r): r is Extract<DeviceReply, { type: "value"; name: N }> => r.type === "value" && r.name === name).map((r) => r.value as WatchValue<N>);

async function call(c: DeviceCall) {
  const id = nextId++;
  host.handle({ type: "call", id, call: c });
  return until(() => replies.find((r): r is Extract<DeviceReply, { id: number }> => "id" in r && r.id === id && (r.type === "done" || r.type === "failed")), "answer");
}

describe("the device host", () => {
  it("sends a watched read at once, again after a write that changes it, and not after one that does not", async () => {
    host.handle({ type: "watch", name: "deviceUser" });
    host.handle({ type: "watch", name: "today" });
    await until(() => (valuesOf("deviceUser").length ? true : undefined), "first deviceUser");
    expect(valuesOf("deviceUser")[0]).toBeNull();
    await until(() => valuesOf("today")[0], "first today");
    expect(valuesOf("today")[0]).toEqual({ synced: false, cards: [] });

    const adopted = await call({ type: "adopt", user: TECH });
    expect(adopted).toMatchObject({ type: "done", result: { status: "adopted", user: { id: TECH.id } } });
    await until(() => (valuesOf("deviceUser").at(-1)?.id === TECH.id ? true : undefined), "the adopted user");

    await applyServerChanges(db, [{ entity: "ticket", op: "upsert", id: T1, row: ticket(T1) }]);
    await until(() => (valuesOf("today").at(-1)?.cards.length === 1 ? true : undefined), "the pulled ticket");
    const usersBefore = valuesOf("deviceUser").length;

    // A note recorded in the page: today's card now counts one change waiting; who is signed in did not change.
    await record("ticket.note_added", { ticketId: T1, text: "Sat since June" }, { db });
    await until(() => (valuesOf("today").at(-1)?.cards[0]?.waiting === 1 ? true : undefined), "the waiting change");
    await new Promise((r) => setTimeout(r, 50));
    expect(valuesOf("deviceUser")).toHaveLength(usersBefore);
  });

  it("marks an ended session and answers a sync round with no network as offline, keeping the change", async () => {
    await call({ type: "adopt", user: TECH });
    host.handle({ type: "watch", name: "syncStatus" });
    await until(() => valuesOf("syncStatus")[0], "first syncStatus");

    expect(await call({ type: "session-ended" })).toEqual({ type: "done", id: expect.any(Number), result: null });
    await until(() => (valuesOf("syncStatus").at(-1)?.sessionExpired ? true : undefined), "sessionExpired");

    await applyServerChanges(db, [{ entity: "ticket", op: "upsert", id: T1, row: ticket(T1) }]);
    await record("ticket.note_added", { ticketId: T1, text: "x" }, { db });
    vi.stubGlobal("fetch", () => Promise.reject(new TypeError("Failed to fetch")));
    const answer = await call({ type: "sync" });
    expect(answer).toMatchObject({ type: "done", result: { ok: false, error: { code: "offline" } } });
    await until(() => (valuesOf("syncStatus").at(-1)?.lastError?.code === "offline" ? true : undefined), "the offline error");
    expect(valuesOf("syncStatus").at(-1)?.waiting).toBe(1);
  });

  it("answers a call that fails with the reason instead of leaving the page waiting", async () => {
    db.close();
    await db.delete();
    // The store's connection is gone for good (deleted under the host): the call says so.
    vi.spyOn(db, "open").mockRejectedValue(new Error("storage unavailable"));
    const answer = await call({ type: "adopt", user: TECH });
    expect(answer).toMatchObject({ type: "failed", message: "storage unavailable" });
  });
});
