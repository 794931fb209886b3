import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("@/lib/auth/auth", () => import("./helpers/auth-session"));

import fs from "node:fs";
import path from "node:path";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { PUT as photoPut } from "@/app/api/photos/[sha256]/route";
import { closeDb, getDb, type Db } from "@/db/client";
import { DeviceDb, readIdentity, readSyncState } from "@/lib/sync/device-db";
import { syncOnce } from "@/lib/sync/engine";
import { record, dismissAttention } from "@/lib/sync/record";
import { adoptSignedInUser } from "@/lib/sync/session";
import { serverView } from "@/lib/sync/server/pull";
import { withUser, type TestUser } from "./helpers/auth-session";
import { tempDb } from "./helpers/db";
import { T, TECH, seedShop } from "./helpers/sync-fixtures";

let ctx: ReturnType<typeof tempDb>;
let db: Db;
let device: DeviceDb;
let n = 0;
beforeEach(async () => {
  ctx = tempDb();
  closeDb();
  db = getDb();
  await seedShop(db);
  device = new DeviceDb(`engine-${++n}`, { indexedDB: new IDBFactory(), IDBKeyRange });
  await adoptSignedInUser(TECH, { db: device });
});
afterEach(() => {
  device.close();
  closeDb();
  ctx.cleanup();
});

/** The route handlers as a fetch, signed in as `who()` (null = the session has ended). */
function server(who: () => TestUser | null = () => TECH): typeof fetch {
  return (async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const req = new Request(String(input), init);
    const { pathname } = new URL(req.url);
    return withUser(who(), async () => {
      if (pathname === "/api/sync/push") return pushRoute(req, undefined);
      if (pathname === "/api/sync/pull") return pullRoute(req, undefined);
      const m = /^\/api\/photos\/(.+)$/.exec(pathname);
      if (m) return photoPut(req, { params: Promise.resolve({ sha256: m[1]! }) });
      return new Response("no", { status: 404 });
    });
  }) as typeof fetch;
}
const sync = (fetch = server()) => syncOnce({ db: device, fetch, baseUrl: "http://test" });
const note = (text: string, ticketId = T(1)) => record("ticket.note_added", { ticketId, text }, { db: device });
const serverNotes = () => (db.$client.prepare("SELECT text FROM ticket_notes ORDER BY text").all() as Array<{ text: string }>).map((r) => r.text);

describe("the device's sync round", () => {
  it("pulls the working set, pushes what was recorded, and ends holding the server's view", async () => {
    expect((await sync()).ok).toBe(true);
    await note("sat since June");
    const r = await sync();
    expect(r).toMatchObject({ ok: true, pushed: 1, rejected: 0 });
    expect(serverNotes()).toEqual(["sat since June"]);
    expect(await device.outbox.count()).toBe(0);
    const mine = new Map<string, unknown>();
    for (const [table, entity] of [["tickets", "ticket"], ["machines", "machine"], ["customers", "customer"], ["procedures", "procedure"], ["ticketNotes", "ticket_note"]] as const) {
      for (const row of await device.table(table).toArray()) mine.set(`${entity}:${(row as { id: string }).id}`, row);
    }
    expect(mine).toEqual(serverView(db));
  });

  it("offline: keeps the outbox and says so", async () => {
    await sync();
    await note("offline note");
    const r = await sync((async () => {
      throw new TypeError("fetch failed");
    }) as typeof fetch);
    expect(r).toMatchObject({ ok: false, error: { code: "offline" } });
    expect(await device.outbox.count()).toBe(1);
    expect((await readSyncState(device)).lastError?.code).toBe("offline");
  });

  it("session expired: keeps the outbox, asks to sign in again, then the push goes out", async () => {
    await sync();
    await note("before the session ended");
    let who: TestUser | null = null;
    const r = await sync(server(() => who));
    expect(r).toMatchObject({ ok: false, error: { code: "session_expired" } });
    expect((await readSyncState(device)).sessionExpired).toBe(true);
    expect(await device.outbox.count()).toBe(1);
    // The tech signs in again (the bench sees /api/me answer the same person).
    who = TECH;
    await adoptSignedInUser(TECH, { db: device });
    expect((await readSyncState(device)).sessionExpired).toBe(false);
    expect((await sync(server(() => who))).ok).toBe(true);
    expect(serverNotes()).toEqual(["before the session ended"]);
  });

  it("an old app gets 'update the app' and keeps its changes", async () => {
    await sync();
    await note("kept");
    const old = (async () =>
      Response.json({ error: { code: "upgrade_required", message: "This app is out of date." } }, { status: 426 })) as typeof fetch;
    expect(await sync(old)).toMatchObject({ ok: false, error: { code: "update_required" } });
    expect(await device.outbox.count()).toBe(1);
  });

  it("a photo the server refuses (415) lands in needs attention with the reason; its bytes stay until dismissed", async () => {
    await sync();
    const bytes = new TextEncoder().encode("GIF89a not a supported photo");
    const sha256 = Buffer.from(await crypto.subtle.digest("SHA-256", bytes)).toString("hex");
    await record("photo.attached", { ticketId: T(1), sha256, mime: "image/jpeg", bytes: bytes.length }, { db: device, blob: new Blob([bytes]) });
    const r = await sync();
    expect(r).toMatchObject({ ok: true, rejected: 1 });
    const [item] = await device.attention.toArray();
    expect(item).toMatchObject({ name: "photo.attached", reason: { code: "photo_missing" }, uploadError: expect.stringContaining("JPEG, PNG and WebP") });
    expect(await device.photos.count()).toBe(0); // the server's tombstone replaced the local row
    expect(await device.photoBlobs.count()).toBe(1);
    await dismissAttention(item!.mutationId, { db: device });
    expect(await device.photoBlobs.count()).toBe(0);
  });

  it("after the server is restored from an older backup, the phone re-registers and sends what was still waiting", async () => {
    const file = path.join(ctx.dir, "benchwright.sqlite");
    db.$client.pragma("wal_checkpoint(TRUNCATE)");
    fs.copyFileSync(file, `${file}.backup`);
    await sync();
    await note("sent before the restore"); // acknowledged, so gone from the phone: the restore loses it
    await sync();
    await note("waiting during the restore");
    const before = (await readIdentity(device))!.deviceId;
    closeDb();
    for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
    fs.copyFileSync(`${file}.backup`, file);
    db = getDb();
    await note("recorded after the restore");
    const r = await sync();
    expect(r.ok).toBe(true);
    // The restored server expects #1 from this device; the phone only has #2 and #3 left: it starts over
    // as a new device with its waiting changes renumbered, and fetches the shop again.
    expect((await readIdentity(device))!.deviceId).not.toBe(before);
    expect(serverNotes()).toEqual(["recorded after the restore", "waiting during the restore"]);
    expect(await device.outbox.count()).toBe(0);
  });

  it("re-registers when the server has this device but is missing changes it had acknowledged", async () => {
    await sync();
    await note("one");
    await note("two");
    await sync();
    const deviceId = (await readIdentity(device))!.deviceId;
    // The server lost its record of this device's changes (a restore that kept the device row).
    db.$client.prepare("DELETE FROM applied_mutations WHERE device_id = ?").run(deviceId);
    db.$client.prepare("UPDATE devices SET last_seq = 0 WHERE id = ?").run(deviceId);
    await note("three");
    expect((await device.outbox.toArray()).map((e) => e.seq)).toEqual([3]);
    const r = await sync();
    expect(r.ok).toBe(true);
    expect((await readIdentity(device))!.deviceId).not.toBe(deviceId);
    expect(serverNotes()).toEqual(["one", "three", "two"]);
  });

  it("a cursor the server does not know (restored database) makes the phone fetch everything again, keeping its outbox", async () => {
    await sync();
    const state = await readSyncState(device);
    await device.meta.put({ key: "sync", value: { ...state, cursor: state.cursor + 10_000 } });
    await note("still here");
    expect((await sync()).ok).toBe(true);
    expect((await readSyncState(device)).cursor).toBeLessThan(state.cursor + 10_000);
    expect(serverNotes()).toEqual(["still here"]);
    expect(await device.tickets.count()).toBeGreaterThan(0);
  });
});
