/**
 * npm run bench:sync — sync throughput against the production server on loopback (not a test).
 *
 * A temporary DATA_DIR with the demo shop plus 2,000 open tickets. Then, in one run:
 *  - pull_2000_ms: a fresh device's first pull of the working set (all pages, validated as the device does);
 *  - a busy shop's day for one tech: 60 tickets × 40 bench entries, 60 findings, 120 tune entries and
 *    60 photos of about 300 kB:
 *    (a) batched through the real protocol (photos PUT by hash, then pushes as large as the device sends, then the pull that
 *        brings the echo back): records per second of the pushes, and the whole day's sync time;
 *    (b) naive: the same records, one HTTP request each;
 *    (c) the physical floor: the same rows inserted straight into SQLite with better-sqlite3 in one
 *        transaction (plain tables; the rate with the change-log triggers is printed too).
 * Prints a table; the last line is one JSON object.
 *
 * Env: PORT (default 3201), KEEP=1 keeps the temporary folder, SKIP_BUILD=1 serves the existing build,
 * PROFILE_DIR=<dir> writes a CPU profile of the server.
 */
import { spawn, type ChildProcess } from "node:child_process";
import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { buildIfNeeded } from "../../scripts/lib/build";
import { openDatabase, type Db } from "../../db/client";
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from "../../db/seed";
import { insertTicket } from "../../lib/tickets/tickets";
import { PROTOCOL_VERSION, pullResponseSchema, type OutboxMutation } from "../../lib/sync/protocol";
import { createdRow } from "../../lib/sync/rows";
import { PHOTO_UPLOADS_AT_ONCE, PUSH_BATCH_SIZE } from "../../lib/sync/engine";

process.env.NEXT_TELEMETRY_DISABLED = "1";
process.env.BCRYPT_COST ??= "8";
const PORT = Number(process.env.PORT || 3201);
const BASE = `http://127.0.0.1:${PORT}`;
const TECH = DEMO_USERS[2]!;
const TECH2 = DEMO_USERS[3]!;
const DAY_TICKETS = 60;
const ENTRIES_PER_TICKET = 40;
const PHOTO_BYTES = 300 * 1024;
const OPEN_TICKETS = 2000;

const ms = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e6;
const now = () => process.hrtime.bigint();

// ---------------------------------------------------------------------------------------------
// Data

function addShop(db: Db): string[] {
  const dayTickets: string[] = [];
  const customer = db.$client.prepare("INSERT INTO customers (id, first_name, last_name, phone, email) VALUES (?, ?, ?, ?, ?)");
  const machine = db.$client.prepare("INSERT INTO machines (id, customer_id, kind, engine_type, make, model, serial) VALUES (?, ?, ?, ?, ?, ?, ?)");
  db.transaction((tx) => {
    for (let i = 0; i < OPEN_TICKETS; i++) {
      const c = crypto.randomUUID();
      const m = crypto.randomUUID();
      customer.run(c, `Customer${i}`, `Invented${i}`, `555-${String(i % 10000).padStart(4, "0")}`, `c${i}@example.com`);
      machine.run(m, c, i % 3 ? "chain_saw" : "walk_mower", i % 3 ? "two_stroke" : "four_stroke", "Varnholt", `VH-${i % 90}`, `SN${i}`);
      const tech = i < DAY_TICKETS ? TECH.id : i % 2 ? TECH2.id : null;
      const t = insertTicket(tx, { machineId: m, customerId: c, complaint: "Hard to start, bogs under load.", status: "on_bench", assignedTechId: tech, createdById: DEMO_USERS[1]!.id });
      if (i < DAY_TICKETS) dayTickets.push(t.id);
    }
  });
  db.$client
      .prepare("INSERT INTO procedures (id, machine_kind, name, version, definition) VALUES (?, ?, ?, ?, ?)")
      .run("two-stroke-saw", "chain_saw", "Two-stroke chain saw", 1, JSON.stringify({ steps: Array.from({ length: 40 }, (_, k) => ({ id: `step-${k}` })) }));
  return dayTickets;
}

interface Photo {
  bytes: Buffer;
  sha256: string;
}

/** ~300 kB that starts like a JPEG (the server checks magic bytes, not the picture). */
function makePhoto(): Photo {
  const bytes = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from("JFIF\0"), crypto.randomBytes(PHOTO_BYTES - 11)]);
  return { bytes, sha256: crypto.createHash("sha256").update(bytes).digest("hex") };
}

/** The day's records for one device: in recording order, each a mutation with fresh ids. */
function dayOfWork(tickets: string[], photos: Photo[], start = Date.parse("2026-05-04T08:00:00.000Z")): OutboxMutation[] {
  const out: OutboxMutation[] = [];
  let seq = 0;
  let clock = start;
  const at = () => new Date((clock += 7_000)).toISOString();
  const add = (name: string, args: Record<string, unknown>) =>
    out.push({ mutationId: crypto.randomUUID(), seq: ++seq, name, args, at: new Date(clock).toISOString() });
  tickets.forEach((ticketId, i) => {
    for (let k = 0; k < ENTRIES_PER_TICKET; k++) {
      add("bench.entry.recorded", { id: crypto.randomUUID(), ticketId, procedureId: "two-stroke-saw", procedureVersion: 1, stepId: `step-${k}`, value: { pressurePsi: 100 + (k % 50) }, at: at() });
    }
    const photo = photos[i]!;
    const photoId = crypto.randomUUID();
    add("photo.attached", { id: photoId, ticketId, sha256: photo.sha256, mime: "image/jpeg", bytes: photo.bytes.length, width: 1600, height: 1200, at: at() });
    add("finding.added", {
      id: crypto.randomUUID(), ticketId, grade: "cause", title: "Varnished carburetor", note: "Old fuel gummed the jets.", photoIds: [photoId],
      suggestedParts: [{ description: "Carburetor rebuild kit", qty: 1 }], suggestedLaborMinutes: 45, at: at(),
    });
    add("tune.recorded", { id: crypto.randomUUID(), ticketId, screw: "low", kind: "baseline", eighths: 8, baselineKind: "seated-then-out", at: at() });
    add("tune.recorded", { id: crypto.randomUUID(), ticketId, screw: "low", kind: "turn", direction: "ccw", eighths: 2, at: at() });
  });
  return out;
}

// ---------------------------------------------------------------------------------------------
// HTTP

let cookie = "";
function keepCookies(res: Response) {
  const jar = new Map(cookie.split("; ").filter(Boolean).map((c) => [c.split("=")[0]!, c]));
  for (const sc of res.headers.getSetCookie()) {
    const pair = sc.split(";")[0]!;
    jar.set(pair.split("=")[0]!, pair);
  }
  cookie = [...jar.values()].join("; ");
}
async function http(pathname: string, init: RequestInit = {}): Promise<Response> {
  const res = await fetch(BASE + pathname, { ...init, redirect: "manual", headers: { ...(init.headers as Record<string, string>), cookie } });
  keepCookies(res);
  return res;
}

async function signIn(email: string) {
  const { csrfToken } = (await (await http("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await http("/api/auth/callback/credentials", {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken, email, password: DEMO_PASSWORD }).toString(),
  });
  if (res.status !== 302 || !cookie.includes("session-token")) throw new Error(`sign-in failed (${res.status})`);
}

async function pushBatch(deviceId: string, mutations: OutboxMutation[]) {
  const res = await http("/api/sync/push", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ protocolVersion: PROTOCOL_VERSION, deviceId, mutations, pending: { count: 0, tickets: [] } }),
  });
  if (!res.ok) throw new Error(`push failed ${res.status}: ${await res.text()}`);
  const body = (await res.json()) as { results: Array<{ status: string; reason?: { message: string } }> };
  const bad = body.results.find((r) => r.status !== "applied");
  if (bad) throw new Error(`a change was not applied: ${JSON.stringify(bad)}`);
}

/** Pulls until done (as a device does, validating every page); returns the changes received. */
async function pullAll(deviceId: string, cursor = 0, limit = 500): Promise<{ changes: number; tickets: number; cursor: number; pages: number }> {
  let snapshot: string | null = null;
  let changes = 0;
  let tickets = 0;
  let pages = 0;
  for (;;) {
    const q = new URLSearchParams({ v: String(PROTOCOL_VERSION), deviceId, cursor: String(cursor), limit: String(limit) });
    if (snapshot) q.set("snapshot", snapshot);
    const res = await http(`/api/sync/pull?${q}`);
    if (!res.ok) throw new Error(`pull failed ${res.status}`);
    const page = pullResponseSchema.parse(await res.json());
    pages += 1;
    changes += page.changes.length;
    tickets += page.changes.filter((c) => c.entity === "ticket" && c.op === "upsert").length;
    if (page.snapshot) snapshot = page.snapshot;
    else {
      snapshot = null;
      cursor = Math.max(cursor, page.cursor);
    }
    if (!page.more) return { changes, tickets, cursor, pages };
  }
}

// ---------------------------------------------------------------------------------------------
// The physical floor

const FACT_SQL: Record<string, { sql: string; entity: "bench_entry" | "finding" | "tune_entry" | "photo" }> = {
  "bench.entry.recorded": {
    entity: "bench_entry",
    sql: "INSERT INTO bench_entries (id, ticket_id, procedure_id, procedure_version, step_id, value, note, at, recorded_by, voided_at, voided_by, void_reason) VALUES (?,?,?,?,?,?,?,?,?,?,?,?)",
  },
  "finding.added": {
    entity: "finding",
    sql: "INSERT INTO findings (id, ticket_id, step_id, grade, title, note, photo_ids, suggested_parts, suggested_labor_minutes, alternatives, withdrawn, created_by, at, changed_at, changed_by, revision) VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?)",
  },
  "tune.recorded": {
    entity: "tune_entry",
    sql: "INSERT INTO tune_entries (id, ticket_id, screw, kind, direction, eighths, baseline_kind, at, recorded_by) VALUES (?,?,?,?,?,?,?,?,?)",
  },
  "photo.attached": {
    entity: "photo",
    sql: "INSERT INTO photos (id, ticket_id, sha256, mime, bytes, width, height, step_id, finding_id, caption, at, taken_by) VALUES (?,?,?,?,?,?,?,?,?,?,?,?)",
  },
};

function rawValues(m: OutboxMutation): unknown[] {
  const row = createdRow(m.name as never, m.args as never, TECH.id) as unknown as Record<string, unknown>;
  const time = (v: unknown) => (v === null ? null : Date.parse(String(v)));
  const json = (v: unknown) => (v === null ? null : JSON.stringify(v));
  switch (m.name) {
    case "bench.entry.recorded":
      return [row.id, row.ticketId, row.procedureId, row.procedureVersion, row.stepId, json(row.value), row.note, time(row.at), row.recordedBy, null, null, null];
    case "finding.added":
      return [row.id, row.ticketId, row.stepId, row.grade, row.title, row.note, json(row.photoIds), json(row.suggestedParts), row.suggestedLaborMinutes, json(row.alternatives), 0, row.createdBy, time(row.at), null, null, 1];
    case "tune.recorded":
      return [row.id, row.ticketId, row.screw, row.kind, row.direction, row.eighths, row.baselineKind, time(row.at), row.recordedBy];
    default:
      return [row.id, row.ticketId, row.sha256, row.mime, row.bytes, row.width, row.height, row.stepId, row.findingId, row.caption, time(row.at), row.takenBy];
  }
}

/** Median rows/s of inserting the day's rows in one transaction into a copy of the database. */
function rawRate(dbFile: string, tickets: string[], photos: Photo[], withTriggers: boolean): number {
  const copy = `${dbFile}.raw-${withTriggers ? "t" : "p"}.sqlite`;
  const src = openDatabase(dbFile, { migrate: false });
  src.$client.pragma("wal_checkpoint(TRUNCATE)");
  src.$client.close();
  fs.copyFileSync(dbFile, copy);
  const db = openDatabase(copy, { migrate: false });
  if (!withTriggers) {
    for (const { name } of db.$client.prepare("SELECT name FROM sqlite_master WHERE type = 'trigger'").all() as Array<{ name: string }>) {
      db.$client.exec(`DROP TRIGGER ${name}`);
    }
  }
  const statements = Object.fromEntries(Object.entries(FACT_SQL).map(([k, v]) => [k, db.$client.prepare(v.sql)]));
  const rates: number[] = [];
  for (let run = 0; run < 5; run++) {
    const work = dayOfWork(tickets, photos);
    const values = work.map((m) => [m.name, rawValues(m)] as const);
    const t0 = now();
    db.$client.transaction(() => {
      for (const [name, v] of values) statements[name]!.run(...v);
    })();
    rates.push(work.length / (ms(t0) / 1000));
  }
  db.$client.close();
  for (const f of [copy, `${copy}-wal`, `${copy}-shm`]) fs.rmSync(f, { force: true });
  rates.sort((a, b) => a - b);
  return rates[2]!;
}

// ---------------------------------------------------------------------------------------------

async function waitForServer(server: ChildProcess) {
  for (let i = 0; i < 120; i++) {
    if (server.exitCode !== null) throw new Error("the server exited");
    try {
      if ((await fetch(`${BASE}/api/health`)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error("the server did not start");
}

async function main() {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "benchwright-bench-sync-"));
  const dbFile = path.join(dir, "benchwright.sqlite");
  process.env.DATA_DIR = dir;
  console.log(`[bench:sync] data in ${dir}`);
  const db = openDatabase(dbFile);
  await seedDemo(db);
  const dayTickets = addShop(db);
  const openTickets = (db.$client.prepare("SELECT count(*) AS n FROM tickets WHERE status NOT IN ('handed_back','returned_unrepaired')").get() as { n: number }).n;
  db.$client.close();

  buildIfNeeded();
  // PROFILE_DIR=<dir> writes a CPU profile of the server (for finding where a request's time goes).
  const profile = process.env.PROFILE_DIR ? [`--cpu-prof`, `--cpu-prof-dir=${process.env.PROFILE_DIR}`] : [];
  const server = spawn(process.execPath, [...profile, "node_modules/next/dist/bin/next", "start", "-p", String(PORT), "-H", "127.0.0.1"], {
    env: { ...process.env, DATA_DIR: dir, AUTH_SECRET: crypto.randomBytes(32).toString("hex"), AUTH_TRUST_HOST: "true" },
    stdio: ["ignore", "ignore", "inherit"],
    detached: true,
  });
  const stop = () => {
    try {
      process.kill(-server.pid!, "SIGTERM");
    } catch {
      // already gone
    }
  };
  process.on("exit", stop);
  try {
    await waitForServer(server);
    await signIn(TECH.email);
    // Warm the routes once (first requests compile and open the database), not measured.
    const warm = crypto.randomUUID();
    await pullAll(warm, 0, 50).catch(() => undefined);

    // A fresh device's first pull of the working set.
    const fresh = crypto.randomUUID();
    let t0 = now();
    const first = await pullAll(fresh);
    const pull2000 = ms(t0);
    if (first.tickets !== openTickets) throw new Error(`pulled ${first.tickets} tickets, expected ${openTickets}`);

    const photos = Array.from({ length: DAY_TICKETS }, makePhoto);

    // (a) batched through the real protocol, on the device that just pulled.
    const day = dayOfWork(dayTickets, photos);
    t0 = now();
    for (let i = 0; i < photos.length; i += PHOTO_UPLOADS_AT_ONCE) {
      await Promise.all(
        photos.slice(i, i + PHOTO_UPLOADS_AT_ONCE).map(async (p) => {
          const res = await http(`/api/photos/${p.sha256}`, { method: "PUT", headers: { "content-type": "image/jpeg" }, body: new Uint8Array(p.bytes) });
          if (res.status !== 201) throw new Error(`photo upload ${res.status}`);
        }),
      );
    }
    const photoMs = ms(t0);
    const tPush = now();
    for (let i = 0; i < day.length; i += PUSH_BATCH_SIZE) await pushBatch(fresh, day.slice(i, i + PUSH_BATCH_SIZE));
    const pushMs = ms(tPush);
    const tEcho = now();
    const echo = await pullAll(fresh, first.cursor);
    const echoMs = ms(tEcho);
    const daySyncMs = ms(t0);

    // (b) naive: the same records, one request each, from another device.
    const naiveDay = dayOfWork(dayTickets, photos);
    const naiveDevice = crypto.randomUUID();
    t0 = now();
    for (const m of naiveDay) await pushBatch(naiveDevice, [m]);
    const naiveMs = ms(t0);

    // Fixed cost of one push request (auth, routing, an empty batch), for the notes.
    const tEmpty = now();
    for (let i = 0; i < 50; i++) await pushBatch(naiveDevice, []);
    const emptyMs = ms(tEmpty) / 50;
    server.kill("SIGTERM");
    stop();

    // (c) the physical floor.
    const rawPlain = rawRate(dbFile, dayTickets, photos, false);
    const rawTriggers = rawRate(dbFile, dayTickets, photos, true);

    const batched = day.length / (pushMs / 1000);
    const naive = naiveDay.length / (naiveMs / 1000);
    const fmt = (n: number) => Math.round(n).toLocaleString("en-US");
    const rows: Array<[string, string]> = [
      ["day: records (2,400 entries, 60 findings, 120 tune, 60 photos)", fmt(day.length)],
      [`(a) batched push (batches of ${PUSH_BATCH_SIZE}), records/s`, fmt(batched)],
      ["    push time, ms", fmt(pushMs)],
      [`    photo uploads (60 × 300 kB, ${PHOTO_UPLOADS_AT_ONCE} at a time), ms`, fmt(photoMs)],
      [`    pull of the echo (${echo.changes} changes), ms`, fmt(echoMs)],
      ["    whole day's sync (photos + push + pull), ms", fmt(daySyncMs)],
      ["(b) naive, one request per record, records/s", fmt(naive)],
      ["    one empty push request (auth, routing), ms", emptyMs.toFixed(1)],
      ["(c) raw SQLite, one transaction, plain tables, rows/s", fmt(rawPlain)],
      ["    raw SQLite with the change-log triggers, rows/s", fmt(rawTriggers)],
      ["batched ÷ naive (target ≥ 20)", (batched / naive).toFixed(1)],
      ["batched ÷ raw plain (target ≥ 0.10)", (batched / rawPlain).toFixed(3)],
      [`fresh pull of ${fmt(first.tickets)} tickets (${fmt(first.changes)} changes, ${first.pages} pages), ms`, fmt(pull2000)],
    ];
    const width = Math.max(...rows.map(([k]) => k.length));
    console.log(`\nBenchwright sync benchmark — ${os.cpus().length} cores, Node ${process.version}, loopback, production build`);
    for (const [k, v] of rows) console.log(`${k.padEnd(width)}  ${v.padStart(10)}`);
    console.log(
      JSON.stringify({
        batched_per_s: Math.round(batched),
        naive_per_s: Math.round(naive),
        raw_sqlite_per_s: Math.round(rawPlain),
        day_sync_ms: Math.round(daySyncMs),
        pull_2000_ms: Math.round(pull2000),
      }),
    );
  } finally {
    stop();
    if (process.env.KEEP !== "1") fs.rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
