/**
 * One sync round on the device: upload waiting photos, push the outbox in batches, then pull until the
 * server has nothing more. Plain TypeScript over Dexie and `fetch`, so the same code runs in the
 * browser and in the Node simulation (with a fault-injecting fetch).
 *
 * Guarantees it keeps (with the server's answers):
 * - An outbox entry leaves the outbox only in the transaction that stores the server's answer for it:
 *   applied/duplicate → gone; rejected → moved to "needs attention" with the reason. A lost request or
 *   answer leaves it where it was, and the retry is harmless (the server answers `duplicate`).
 * - A pulled page is applied in one transaction together with the new cursor, and only if the cursor
 *   it was asked from is still the stored one; the cursor never moves back.
 */
import {
  MAX_PUSH_BATCH,
  PROTOCOL_VERSION,
  encodePendingTickets,
  pullResponseSchema,
  pushResponseSchema,
  type PendingReport,
  type PullResponse,
  type PushResponse,
} from "./protocol";
import {
  PULLED_TABLES,
  readDeviceUser,
  readIdentity,
  readSyncState,
  updateSyncState,
  writeMeta,
  type DeviceDb,
  type OutboxEntry,
  type SyncError,
} from "./device-db";
import { applyServerChanges } from "./effects";
import { uuid } from "./ids";
import { dropBlobIfUnused } from "./record";

/** Changes per push: the server's limit, so a day's work goes in a handful of requests. */
export const PUSH_BATCH_SIZE = MAX_PUSH_BATCH;

export interface SyncProgress {
  phase: "idle" | "photos" | "push" | "pull";
  /** Changes sent and acknowledged so far, of those waiting when the round began. */
  pushed: number;
  toPush: number;
  /** Changes received so far, and roughly how many remain. */
  pulled: number;
  remaining: number;
}

export interface SyncOptions {
  db: DeviceDb;
  fetch: typeof fetch;
  /** "" in the browser (same origin); an absolute origin in tests. */
  baseUrl?: string;
  batchSize?: number;
  pageLimit?: number;
  onProgress?: (p: SyncProgress) => void;
  now?: () => Date;
}

export type SyncResult =
  | { ok: true; pushed: number; rejected: number; pulled: number }
  | { ok: false; error: SyncError; pushed: number; rejected: number; pulled: number };

/** The server does not know this phone's cursor (it was restored from a backup). */
class ResetNeeded extends Error {}

class Stop extends Error {
  constructor(readonly error: Omit<SyncError, "at">) {
    super(error.message);
  }
}

const MESSAGES = {
  offline: "No connection to the shop's server. Your changes are safe on this phone and go out when it is back.",
  session_expired: "Your sign-in has expired. Sign in again to send your changes; they are kept on this phone.",
  device_owner: "This phone's store belongs to another person. Sign in as that person to send their changes.",
  update_required: "This app is out of date for the server. Reload it to update; your changes are kept.",
  server: "The server had a problem. Your changes are kept; sync will try again.",
} as const;

async function call(opts: SyncOptions, path: string, init?: RequestInit): Promise<Response> {
  let res: Response;
  try {
    res = await opts.fetch(`${opts.baseUrl ?? ""}${path}`, { credentials: "same-origin", cache: "no-store", ...init });
  } catch {
    throw new Stop({ code: "offline", message: MESSAGES.offline });
  }
  if (res.ok) return res;
  let message: string | undefined;
  try {
    message = ((await res.json()) as { error?: { message?: string } }).error?.message;
  } catch {
    // not our error shape (a proxy page, say)
  }
  if (res.status === 401) throw new Stop({ code: "session_expired", message: MESSAGES.session_expired });
  if (res.status === 403) throw new Stop({ code: "device_owner", message: message ?? MESSAGES.device_owner });
  if (res.status === 426) throw new Stop({ code: "update_required", message: message ?? MESSAGES.update_required });
  if (res.status === 409 && path.startsWith("/api/sync/pull")) throw new ResetNeeded();
  throw new Stop({ code: "server", message: message ? `${MESSAGES.server} (${message})` : MESSAGES.server });
}

/** What will still be waiting after `sending` goes out: the count and the tickets (for the counter). */
async function pendingAfter(db: DeviceDb, sending: ReadonlySet<number>): Promise<PendingReport> {
  const perTicket = new Map<string, number>();
  let count = 0;
  await db.outbox.each((e) => {
    if (sending.has(e.seq)) return;
    count += 1;
    if (e.ticketId) perTicket.set(e.ticketId, (perTicket.get(e.ticketId) ?? 0) + 1);
  });
  const tickets = [...perTicket].slice(0, 500).map(([ticketId, changes]) => ({ ticketId, changes }));
  return { count, tickets };
}

/** Photos uploaded at the same time (a few overlap the network's latency; more would only crowd a phone's uplink). */
export const PHOTO_UPLOADS_AT_ONCE = 3;

type UploadOutcome = "ok" | "refused" | "retry" | "offline" | "unauthorized";

async function uploadOne(opts: SyncOptions, sha256: string): Promise<UploadOutcome> {
  const { db } = opts;
  const blob = await db.photoBlobs.get(sha256);
  if (!blob || blob.uploadedAt || blob.uploadError) return "ok"; // nothing to send (the server decides)
  let res: Response;
  try {
    res = await opts.fetch(`${opts.baseUrl ?? ""}/api/photos/${sha256}`, {
      method: "PUT",
      body: blob.blob,
      headers: { "Content-Type": blob.mime },
      credentials: "same-origin",
    });
  } catch {
    return "offline";
  }
  if (res.ok) {
    await db.photoBlobs.update(sha256, { uploadedAt: (opts.now?.() ?? new Date()).toISOString() });
    return "ok";
  }
  if (res.status === 400 || res.status === 413 || res.status === 415) {
    // Refused for good: the push goes ahead, the server refuses the attachment, and the tech sees why.
    let message = `The photo was refused (${res.status}).`;
    try {
      message = ((await res.json()) as { error: { message: string } }).error.message;
    } catch {
      // keep the plain message
    }
    await db.photoBlobs.update(sha256, { uploadError: message });
    return "refused";
  }
  return res.status === 401 ? "unauthorized" : "retry";
}

/** Uploads the photo bytes a batch needs. Returns the batch cut before the first photo that could not go yet. */
async function uploadPhotos(opts: SyncOptions, batch: OutboxEntry[]): Promise<OutboxEntry[]> {
  const wanted = batch.map((e, i) => [e, i] as const).filter(([e]) => e.name === "photo.attached");
  const outcomes = new Map<number, UploadOutcome>();
  for (let k = 0; k < wanted.length; k += PHOTO_UPLOADS_AT_ONCE) {
    const group = wanted.slice(k, k + PHOTO_UPLOADS_AT_ONCE);
    const done = await Promise.all(group.map(([e]) => uploadOne(opts, String(e.args.sha256))));
    group.forEach(([, i], j) => outcomes.set(i, done[j]!));
    if (done.includes("unauthorized")) throw new Stop({ code: "session_expired", message: MESSAGES.session_expired });
    if (done.includes("retry") || done.includes("offline")) break;
  }
  const firstStuck = wanted.find(([, i]) => outcomes.get(i) !== "ok" && outcomes.get(i) !== "refused");
  if (!firstStuck) return batch;
  const cut = firstStuck[1];
  if (cut === 0) {
    if (outcomes.get(cut) === "offline") throw new Stop({ code: "offline", message: MESSAGES.offline });
    throw new Stop({ code: "photo_upload", message: "A photo could not be uploaded yet; your changes are kept and sync will try again." });
  }
  return batch.slice(0, cut);
}

/** Stores the server's answers for a batch, in one transaction. Returns how many left the outbox. */
async function storeAnswers(db: DeviceDb, batch: OutboxEntry[], answer: PushResponse, now: string) {
  const bySeq = new Map(batch.map((e) => [e.mutationId, e]));
  let acknowledged = 0;
  let rejected = 0;
  let gap: number | null = null;
  await db.transaction("rw", db.tables, async () => {
    const changes = [];
    for (const r of answer.results) {
      const e = bySeq.get(r.mutationId);
      if (!e || !(await db.outbox.get(e.seq))) continue; // answered already (another tab) or not ours
      if (r.status === "rejected" && r.reason.code === "gap") {
        gap ??= r.reason.expectedSeq ?? null;
        continue;
      }
      await db.outbox.delete(e.seq);
      acknowledged += 1;
      if (r.status === "rejected") {
        rejected += 1;
        let uploadError: string | null = null;
        if (e.name === "photo.attached") uploadError = (await db.photoBlobs.get(String(e.args.sha256)))?.uploadError ?? null;
        await db.attention.put({ ...e, reason: r.reason, rejectedAt: now, uploadError });
        if (r.current) changes.push(r.current);
      } else if (e.name === "photo.attached") {
        await dropBlobIfUnused(db, String(e.args.sha256));
      }
    }
    // Put the server's rows back in place of refused changes (with any later waiting change on top).
    if (changes.length) await applyServerChanges(db, changes);
  });
  return { acknowledged, rejected, gap: gap as number | null };
}

/**
 * The server is missing changes this phone already had acknowledged (it was restored from a backup):
 * start over as a new device, renumbering the waiting changes from 1, so nothing waiting is lost.
 */
async function registerAgain(db: DeviceDb): Promise<void> {
  await db.transaction("rw", db.tables, async () => {
    const deviceId = uuid();
    const waiting = await db.outbox.orderBy("seq").toArray();
    await db.outbox.clear();
    let seq = 1;
    for (const e of waiting) await db.outbox.add({ ...e, seq: seq++, deviceId });
    await writeMeta(db, "device", { deviceId, nextSeq: seq });
  });
}

async function pushAll(opts: SyncOptions, progress: SyncProgress, report: () => void) {
  const { db } = opts;
  const batchSize = opts.batchSize ?? PUSH_BATCH_SIZE;
  let rejected = 0;
  let renumbered = false;
  for (let round = 0; round < 10_000; round++) {
    const identity = await readIdentity(db);
    const first = await db.outbox.orderBy("seq").limit(batchSize).toArray();
    if (!first.length || !identity) return rejected;
    progress.phase = first.some((e) => e.name === "photo.attached") ? "photos" : "push";
    report();
    const batch = await uploadPhotos(opts, first);
    progress.phase = "push";
    report();
    const pending = await pendingAfter(db, new Set(batch.map((e) => e.seq)));
    const body = {
      protocolVersion: PROTOCOL_VERSION,
      deviceId: batch[0]!.deviceId,
      mutations: batch.map((e) => ({ mutationId: e.mutationId, seq: e.seq, name: e.name, args: e.args, at: e.at })),
      pending,
    };
    const res = await call(opts, "/api/sync/push", { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) });
    const parsed = pushResponseSchema.safeParse(await res.json().catch(() => null));
    if (!parsed.success) throw new Stop({ code: "server", message: MESSAGES.server });
    const stored = await storeAnswers(db, batch, parsed.data, (opts.now?.() ?? new Date()).toISOString());
    rejected += stored.rejected;
    progress.pushed += stored.acknowledged;
    report();
    if (stored.gap !== null) {
      const firstWaiting = (await db.outbox.orderBy("seq").first())?.seq ?? Infinity;
      if (stored.gap < firstWaiting && !renumbered) {
        await registerAgain(db);
        renumbered = true;
        continue;
      }
      throw new Stop({ code: "gap", message: `The server is missing change #${stored.gap} from this phone; sync will try again.` });
    }
    if (batch.length < first.length) {
      throw new Stop({ code: "photo_upload", message: "A photo could not be uploaded yet; the rest waits and sync will try again." });
    }
    if (stored.acknowledged === 0) {
      // Another tab may have stored these answers first; stop only if the same changes are still at the front.
      const front = await db.outbox.orderBy("seq").first();
      if (front && front.seq === first[0]!.seq) throw new Stop({ code: "server", message: MESSAGES.server });
    }
  }
  return rejected;
}

async function pullAll(opts: SyncOptions, progress: SyncProgress, report: () => void): Promise<number> {
  const { db } = opts;
  const limit = opts.pageLimit ?? 500;
  let pulled = 0;
  for (let page = 0; page < 100_000; page++) {
    const identity = await readIdentity(db);
    const state = await readSyncState(db);
    const deviceId = identity?.deviceId ?? uuid();
    if (!identity) await writeMeta(db, "device", { deviceId, nextSeq: 1 });
    const pending = await pendingAfter(db, new Set());
    const q = new URLSearchParams({
      v: String(PROTOCOL_VERSION),
      deviceId,
      cursor: String(state.cursor),
      limit: String(limit),
      pending: String(pending.count),
    });
    if (state.snapshot) q.set("snapshot", state.snapshot);
    if (pending.tickets.length) q.set("pendingTickets", encodePendingTickets(pending.tickets));
    progress.phase = "pull";
    report();
    let res: Response;
    try {
      res = await call(opts, `/api/sync/pull?${q}`);
    } catch (err) {
      if (err instanceof ResetNeeded) {
        // Fetch everything again (the outbox and refused changes stay).
        await updateSyncState(db, { cursor: 0, snapshot: null });
        continue;
      }
      throw err;
    }
    const parsed = pullResponseSchema.safeParse(await res.json().catch(() => null));
    if (!parsed.success) throw new Stop({ code: "server", message: MESSAGES.server });
    const body: PullResponse = parsed.data;
    const applied = await db.transaction("rw", db.tables, async () => {
      const now = await readSyncState(db);
      if (now.cursor !== state.cursor || now.snapshot !== state.snapshot) return false; // another tab moved on: ask again
      if (state.cursor === 0 && !state.snapshot) {
        // A first pull starts from an empty copy of the shop (the outbox and refused changes stay).
        for (const t of PULLED_TABLES) await db.table(t).clear();
      }
      await applyServerChanges(db, body.changes);
      if (body.snapshot) await writeMeta(db, "sync", { ...now, snapshot: body.snapshot });
      else await writeMeta(db, "sync", { ...now, snapshot: null, cursor: Math.max(now.cursor, body.cursor) });
      return true;
    });
    if (applied) {
      pulled += body.changes.length;
      progress.pulled = pulled;
      progress.remaining = body.remaining;
      report();
      if (!body.more) return pulled;
    }
  }
  return pulled;
}

/** One whole sync round. Never throws for network or server trouble: the answer says what happened. */
export async function syncOnce(opts: SyncOptions): Promise<SyncResult> {
  const { db } = opts;
  const now = () => (opts.now?.() ?? new Date()).toISOString();
  const progress: SyncProgress = { phase: "idle", pushed: 0, toPush: await db.outbox.count(), pulled: 0, remaining: 0 };
  const report = () => opts.onProgress?.({ ...progress });
  let rejected = 0;
  try {
    const user = await readDeviceUser(db);
    const state = await readSyncState(db);
    if (!user || state.signedOut) throw new Stop({ code: "not_signed_in", message: "Sign in on this phone to sync." });
    if (state.otherSignedIn) {
      throw new Stop({ code: "device_owner", message: `${state.otherSignedIn.name} is signed in, but the changes here are ${user.name}'s. Sign in as ${user.name} to send them.` });
    }
    await updateSyncState(db, { lastAttemptAt: now() });
    if (!(await readIdentity(db))) await writeMeta(db, "device", { deviceId: uuid(), nextSeq: 1 });
    rejected = await pushAll(opts, progress, report);
    const pulled = await pullAll(opts, progress, report);
    await updateSyncState(db, { lastSyncAt: now(), lastError: null, sessionExpired: false });
    progress.phase = "idle";
    report();
    return { ok: true, pushed: progress.pushed, rejected, pulled };
  } catch (err) {
    if (!(err instanceof Stop)) throw err;
    const error: SyncError = { ...err.error, at: now() };
    await updateSyncState(db, { lastError: error, ...(error.code === "session_expired" ? { sessionExpired: true } : {}) });
    progress.phase = "idle";
    report();
    return { ok: false, error, pushed: progress.pushed, rejected, pulled: progress.pulled };
  }
}
