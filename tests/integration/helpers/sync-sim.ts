/**
 * A seeded simulation of a shop syncing: several devices record random bench work offline and sync
 * through a fault-injecting fetch into the real route handlers, while the counter edits tickets on
 * the server and the server restarts. `runCase(seed)` returns what happened for the checks.
 */
import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { PUT as photoPut } from "@/app/api/photos/[sha256]/route";
import { closeDb, getDb, openDatabase, type Db } from "@/db/client";
import { insertTicket } from "@/lib/tickets/tickets";
import { TICKET_STATUSES, CLOSED_STATUSES } from "@/lib/tickets/status";
import { BENCH_STATUSES, type MutationName } from "@/lib/sync/protocol";
import { DeviceDb, readSyncState } from "@/lib/sync/device-db";
import { record, RecordError, type RecordInput } from "@/lib/sync/record";
import { adoptSignedInUser } from "@/lib/sync/session";
import { syncOnce, type SyncResult } from "@/lib/sync/engine";
import { withUser, type TestUser } from "./auth-session";
import { COUNTER, TECH, TECH2, seedShop } from "./sync-fixtures";

/** mulberry32: a small, well-known seeded PRNG (Tommy Ettinger's public-domain generator). */
export function prng(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    int: (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1)),
    chance: (p: number) => next() < p,
    pick: <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)]!,
    weighted: <T extends string>(w: Record<T, number>): T => {
      const total = Object.values<number>(w).reduce((s, x) => s + x, 0);
      let r = next() * total;
      for (const [k, v] of Object.entries<number>(w)) if ((r -= v) < 0) return k as T;
      return Object.keys(w)[0] as T;
    },
  };
}
type Rng = ReturnType<typeof prng>;

/** Memory-backed temp space when there is one (the cases write many small files). */
const TMP = fs.existsSync("/dev/shm") ? "/dev/shm" : os.tmpdir();

// A template database (migrated and seeded once), copied for each case.
let template: string | undefined;
async function templateFile(): Promise<string> {
  if (template) return template;
  const dir = fs.mkdtempSync(path.join(TMP, "benchwright-sim-template-"));
  const file = path.join(dir, "benchwright.sqlite");
  const db = openDatabase(file);
  await seedShop(db);
  db.$client.pragma("wal_checkpoint(TRUNCATE)");
  db.$client.close();
  template = file;
  return file;
}

type Fate = "ok" | "drop_request" | "drop_response" | "duplicate" | "delay" | "unauthorized";

export interface SimDevice {
  index: number;
  user: TestUser;
  db: DeviceDb;
  recorded: Array<{ mutationId: string; name: MutationName; args: Record<string, unknown> }>;
  cursors: number[];
  cursorWrites: number;
  cursorWentBack: string[];
}

export interface SimStats {
  requests: number;
  fates: Record<Fate, number>;
  restarts: number;
  syncs: number;
  failedSyncs: number;
  recorded: number;
  refusedLocally: number;
  counterEdits: number;
}

export interface SimCase {
  seed: number;
  db: () => Db;
  devices: SimDevice[];
  initialVersions: Map<string, number>;
  counterUpdates: Map<string, number>;
  stats: SimStats;
  cleanup: () => void;
}

const BASE = "http://sim.test";

export async function runCase(seed: number, options: { steps?: number } = {}): Promise<SimCase> {
  const rng = prng(seed);
  const dir = fs.mkdtempSync(path.join(TMP, "benchwright-sim-"));
  fs.copyFileSync(await templateFile(), path.join(dir, "benchwright.sqlite"));
  process.env.DATA_DIR = dir;
  closeDb();
  const db = () => getDb();
  const stats: SimStats = {
    requests: 0,
    fates: { ok: 0, drop_request: 0, drop_response: 0, duplicate: 0, delay: 0, unauthorized: 0 },
    restarts: 0, syncs: 0, failedSyncs: 0, recorded: 0, refusedLocally: 0, counterEdits: 0,
  };

  const initialVersions = new Map(
    (db().$client.prepare("SELECT id, version FROM tickets").all() as Array<{ id: string; version: number }>).map((t) => [t.id, t.version]),
  );
  const counterUpdates = new Map<string, number>();

  // Devices: 3 to 5; a person may have two (phone and tablet).
  const people = [TECH, TECH2, COUNTER, TECH, TECH2];
  const count = rng.int(3, 5);
  const devices: SimDevice[] = [];
  for (let i = 0; i < count; i++) {
    const ddb = new DeviceDb(`sim-${seed}-${i}`, { indexedDB: new IDBFactory(), IDBKeyRange });
    const d: SimDevice = { index: i, user: people[i]!, db: ddb, recorded: [], cursors: [], cursorWrites: 0, cursorWentBack: [] };
    await adoptSignedInUser(people[i]!, { db: ddb });
    // Watch every write of the sync state: the cursor must never move back.
    ddb.meta.hook("updating", (mods, key, obj) => {
      if (key !== "sync") return;
      const before = (obj as { value: { cursor: number } }).value.cursor;
      const after = (mods as { value?: { cursor: number } }).value?.cursor;
      d.cursorWrites += 1;
      if (after !== undefined && after < before) d.cursorWentBack.push(`${before} → ${after}`);
    });
    devices.push(d);
  }

  // The network between a device and the server, with faults while `faulty` is on.
  let faulty = true;
  const delayed: Array<() => Promise<unknown>> = [];
  const deliver = async (user: TestUser | null, url: string, init: RequestInit): Promise<Response> => {
    const req = new Request(url, init);
    const { pathname } = new URL(url);
    return withUser(user, async () => {
      if (pathname === "/api/sync/push") return pushRoute(req, undefined);
      if (pathname === "/api/sync/pull") return pullRoute(req, undefined);
      const m = /^\/api\/photos\/([^/]+)$/.exec(pathname);
      if (m) return photoPut(req, { params: Promise.resolve({ sha256: m[1]! }) });
      return new Response("not found", { status: 404 });
    });
  };
  const networkFor = (d: SimDevice): typeof fetch =>
    (async (input: RequestInfo | URL, init: RequestInit = {}) => {
      const url = String(input);
      stats.requests += 1;
      const fate: Fate = faulty
        ? rng.weighted({ ok: 55, drop_request: 10, drop_response: 12, duplicate: 10, delay: 10, unauthorized: 3 })
        : "ok";
      stats.fates[fate] += 1;
      switch (fate) {
        case "drop_request":
          throw new TypeError("fetch failed (request lost)");
        case "drop_response":
          await deliver(d.user, url, init);
          throw new TypeError("fetch failed (response lost after the server committed)");
        case "duplicate": {
          const first = await deliver(d.user, url, init);
          const second = await deliver(d.user, url, init);
          return rng.chance(0.5) ? first : second;
        }
        case "delay":
          delayed.push(() => deliver(d.user, url, init));
          throw new TypeError("fetch failed (timed out; the request is still on its way)");
        case "unauthorized":
          return deliver(null, url, init);
        default:
          return deliver(d.user, url, init);
      }
    }) as typeof fetch;

  const sync = async (d: SimDevice): Promise<SyncResult> => {
    stats.syncs += 1;
    const r = await syncOnce({ db: d.db, fetch: networkFor(d), baseUrl: BASE, batchSize: rng.int(1, 12), pageLimit: rng.int(2, 40) });
    if (!r.ok) stats.failedSyncs += 1;
    d.cursors.push((await readSyncState(d.db)).cursor);
    return r;
  };

  const deliverSomeDelayed = async (all = false) => {
    for (let i = delayed.length - 1; i >= 0; i--) {
      if (all || rng.chance(0.3)) {
        const [send] = delayed.splice(i, 1);
        await send!(); // the answer goes nowhere: the device gave up on it
      }
    }
  };

  const steps = options.steps ?? rng.int(20, 45);
  for (const d of devices) await sync(d); // everyone tries to fetch the shop first
  for (let step = 0; step < steps; step++) {
    await deliverSomeDelayed();
    const action = rng.weighted({ record: 14, sync: 5, both: 1, counter: 2, restart: 1 });
    const d = rng.pick(devices);
    if (action === "record") await recordRandom(d, rng, stats);
    else if (action === "sync") await sync(d);
    else if (action === "both") {
      // Two syncs at once (two devices, or two tabs of one), with a change recorded meanwhile.
      const other = rng.chance(0.3) ? d : rng.pick(devices);
      await Promise.all([sync(d), sync(other), recordRandom(d, rng, stats)]);
    } else if (action === "counter") counterEdit(db(), rng, counterUpdates, stats);
    else {
      closeDb(); // the server restarts: the next request re-opens the SQLite file
      stats.restarts += 1;
    }
  }

  // Quiet time: the network heals, stragglers arrive, everyone syncs until nothing is left.
  faulty = false;
  await deliverSomeDelayed(true);
  // Round 1 empties every outbox; round 2 brings everyone the others' last changes.
  for (const d of devices) {
    for (let tries = 0; tries < 5; tries++) {
      const r = await sync(d);
      if (r.ok && (await d.db.outbox.count()) === 0) break;
    }
  }
  for (const d of devices) await sync(d);

  return {
    seed,
    db,
    devices,
    initialVersions,
    counterUpdates,
    stats,
    cleanup: () => {
      for (const d of devices) d.db.close();
      closeDb();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

const AT0 = Date.parse("2026-05-04T08:00:00.000Z");

async function recordRandom(d: SimDevice, rng: Rng, stats: SimStats): Promise<void> {
  const tickets = await d.db.tickets.toArray();
  if (!tickets.length) return;
  const ticket = rng.pick(tickets);
  const at = new Date(AT0 + rng.int(0, 8 * 3600) * 1000).toISOString();
  const choice = rng.weighted({
    entry: 6, void: 1, finding: 2, change: 1, tune: 2, photo: 1, start: 1, stop: 1, status: 2, note: 2, part: 1,
  });
  let name: MutationName;
  let input: Record<string, unknown>;
  let blob: Blob | undefined;
  switch (choice) {
    case "entry":
      name = "bench.entry.recorded";
      input = { ticketId: ticket.id, procedureId: "two-stroke-saw", procedureVersion: 1, stepId: rng.pick(["compression", "spark", "plug-gap"]), value: { pressurePsi: rng.int(60, 180) }, at };
      break;
    case "void": {
      const mine = await d.db.benchEntries.where("ticketId").equals(ticket.id).filter((e) => !e.voidedAt && (d.user.role !== "tech" || e.recordedBy === d.user.id)).toArray();
      if (!mine.length) return;
      name = "bench.entry.voided";
      input = { id: rng.pick(mine).id, reason: "misread", at };
      break;
    }
    case "finding":
      name = "finding.added";
      input = { ticketId: ticket.id, grade: rng.pick(["cause", "due_soon", "advisory"] as const), title: "Worn sprocket", note: "", photoIds: [], suggestedParts: [{ description: "Rim sprocket", qty: 1 }], at };
      break;
    case "change": {
      const fs = await d.db.findings.where("ticketId").equals(ticket.id).toArray();
      if (!fs.length) return;
      name = "finding.changed";
      input = { id: rng.pick(fs).id, grade: rng.pick(["cause", "due_soon", "advisory"] as const), note: `seen ${rng.int(1, 99)}`, at };
      break;
    }
    case "tune":
      name = "tune.recorded";
      input = rng.chance(0.3)
        ? { ticketId: ticket.id, screw: rng.pick(["low", "high"] as const), kind: "baseline", eighths: rng.int(0, 12), baselineKind: "seated-then-out", at }
        : { ticketId: ticket.id, screw: rng.pick(["low", "high", "idle"] as const), kind: "turn", direction: rng.pick(["cw", "ccw"] as const), eighths: rng.int(1, 6), at };
      break;
    case "photo": {
      // Mostly JPEG; now and then a GIF the server refuses (415), so the refusal path is exercised.
      const gif = rng.chance(0.15);
      const head = gif ? Buffer.from("GIF89a") : Buffer.from([0xff, 0xd8, 0xff, 0xe0]);
      const bytes = Buffer.concat([head, Buffer.from(String(rng.int(0, 1e9)))]);
      const sha256 = crypto.createHash("sha256").update(bytes).digest("hex");
      name = "photo.attached";
      input = { ticketId: ticket.id, sha256, mime: "image/jpeg", bytes: bytes.length, at };
      blob = new Blob([bytes], { type: "image/jpeg" });
      break;
    }
    case "start":
      name = "labor.started";
      input = { ticketId: ticket.id, startedAt: at };
      break;
    case "stop": {
      const running = await d.db.laborEntries.filter((l) => l.endedAt === null && l.userId === d.user.id).toArray();
      if (!running.length) return;
      const l = rng.pick(running);
      name = "labor.stopped";
      input = { id: l.id, endedAt: new Date(Date.parse(l.startedAt) + rng.int(1, 120) * 60_000).toISOString() };
      break;
    }
    case "status":
      name = "ticket.status_changed";
      input = { ticketId: ticket.id, status: rng.pick(BENCH_STATUSES), at };
      break;
    case "note":
      name = "ticket.note_added";
      input = { ticketId: ticket.id, text: `note ${rng.int(1, 1000)}`, at };
      break;
    default:
      name = "parts.used";
      input = { ticketId: ticket.id, description: "Air filter", qty: rng.pick([1, 2, 0.5]), at, ...(d.user.role !== "tech" && rng.chance(0.5) ? { unitPriceCents: rng.int(100, 5000) } : {}) };
  }
  try {
    const r = await record(name, input as RecordInput<typeof name>, { db: d.db, blob });
    d.recorded.push({ mutationId: r.mutationId, name, args: (await d.db.outbox.where("mutationId").equals(r.mutationId).first())?.args ?? input });
    stats.recorded += 1;
  } catch (err) {
    if (!(err instanceof RecordError)) throw err;
    stats.refusedLocally += 1;
  }
}

/** The counter at work on the server: plain SQL writes, as its server actions do (the triggers capture them). */
function counterEdit(db: Db, rng: Rng, updates: Map<string, number>, stats: SimStats): void {
  stats.counterEdits += 1;
  const all = db.$client.prepare("SELECT id, status, machine_id, customer_id FROM tickets").all() as Array<{ id: string; status: string; machine_id: string; customer_id: string }>;
  const kind = rng.weighted({ status: 5, create: 1, phone: 1, assign: 1 });
  if (kind === "create") {
    const t = rng.pick(all);
    db.transaction((tx) => {
      insertTicket(tx, { machineId: t.machine_id, customerId: t.customer_id, complaint: "Back again: runs rough", createdById: COUNTER.id });
    });
    return;
  }
  if (kind === "phone") {
    db.$client.prepare("UPDATE customers SET phone = ? WHERE id = ?").run(`555-${String(rng.int(100, 9999)).padStart(4, "0")}`, rng.pick(all).customer_id);
    return;
  }
  const t = rng.pick(all);
  if (kind === "assign") {
    db.$client.prepare("UPDATE tickets SET assigned_tech_id = ? WHERE id = ?").run(rng.pick([TECH.id, TECH2.id, null]), t.id);
  } else {
    const status = rng.pick(TICKET_STATUSES);
    const closed = (CLOSED_STATUSES as readonly string[]).includes(status);
    db.$client.prepare("UPDATE tickets SET status = ?, closed_at = ?, updated_at = ? WHERE id = ?").run(status, closed ? Date.now() : null, Date.now(), t.id);
  }
  updates.set(t.id, (updates.get(t.id) ?? 0) + 1);
}
