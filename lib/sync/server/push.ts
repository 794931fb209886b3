import "server-only";
import crypto from "node:crypto";
import type { Db } from "@/db/client";
import type { CurrentUser } from "@/lib/auth/guard";
import { AppError, zodFields } from "@/lib/http/errors";
import { STATUS_LABELS, type TicketStatus } from "@/lib/tickets/status";
import {
  BENCH_STATUSES,
  MUTATION_ENTITY,
  PROTOCOL_VERSION,
  entityIdOf,
  mutationSchemas,
  type MutationArgs,
  type MutationName,
  type OutboxMutation,
  type PushRequest,
  type PushResponse,
  type PushResult,
  type RejectReason,
  type TuneEntryRow,
} from "../protocol";
import { changedFinding, createdRow, isRefusal, stoppedLabor, voidedEntry } from "../rows";
import { tuneEntryProblem } from "../rules";
import { bindDevice, storeReport } from "./devices";
import { currentChange, factsOfTicket, insertRow, maxVersion, readRow, stmt, ticketHead, updateRow, type TicketHead } from "./store";

type Outcome = { ok: true } | { ok: false; reason: RejectReason };
const reject = (code: RejectReason["code"], message: string, extra: Partial<RejectReason> = {}): Outcome => ({
  ok: false,
  reason: { code, message, ...extra },
});

const shortDate = (ms: number | null) => (ms ? new Date(ms).toISOString().slice(0, 10) : "earlier");

/** Ticket headers read during one batch (cleared whenever the batch writes a ticket). */
type Heads = Map<string, TicketHead | null>;

/** The ticket a fact is recorded against: it must exist and still be open. */
function openTicket(db: Db, ticketId: string, heads: Heads): TicketHead | Outcome {
  let head = heads.get(ticketId);
  if (head === undefined) heads.set(ticketId, (head = ticketHead(db, ticketId)));
  if (!head) return reject("not_found", "This ticket is not on the server (it may have been removed). The change was not added.");
  if (!head.open) {
    const label = STATUS_LABELS[head.status as TicketStatus] ?? head.status;
    return reject("closed", `Ticket #${head.number} was closed (${label}, ${shortDate(head.closedAt)}). The change was not added; tell the counter.`);
  }
  return head;
}
const isOutcome = (x: unknown): x is Outcome => typeof x === "object" && x !== null && "ok" in x;

/** Applies one validated mutation. Throws only on a bug (the batch is then rolled back whole). */
function applyOne(
  db: Db,
  user: CurrentUser,
  name: MutationName,
  args: Record<string, unknown>,
  ctx: { at: string; mutationId: string; deviceId: string; heads: Heads },
): Outcome {
  switch (name) {
    case "bench.entry.recorded":
    case "finding.added":
    case "photo.attached":
    case "labor.started":
    case "ticket.note_added":
    case "parts.used":
    case "tune.recorded": {
      const ticket = openTicket(db, String(args.ticketId), ctx.heads);
      if (isOutcome(ticket)) return ticket;
      const entity = MUTATION_ENTITY[name] as "bench_entry";
      if (name === "parts.used" && args.unitPriceCents !== undefined && user.role === "tech") {
        return reject("forbidden", "A bench technician cannot set prices; the counter prices parts.");
      }
      if (name === "photo.attached") {
        const file = stmt(db, "SELECT 1 FROM photo_files WHERE sha256 = ?").get(String(args.sha256));
        if (!file) return reject("photo_missing", "The photo itself has not reached the server, so it was not attached.");
      }
      const row = createdRow(name, args as never, user.id) as unknown as Record<string, unknown>;
      if (name === "tune.recorded") {
        const problem = tuneEntryProblem(factsOfTicket(db, "tune_entry", ticket.id), row as unknown as TuneEntryRow);
        if (problem) return reject("tune_refused", problem);
      }
      try {
        insertRow(db, entity, row);
      } catch (err) {
        // One statement: when it fails nothing of it (trigger writes included) is kept.
        if ((err as { code?: string }).code === "SQLITE_CONSTRAINT_PRIMARYKEY") {
          return reject("id_taken", "Another change already used this record's id. It was not added twice.");
        }
        throw err;
      }
      return { ok: true };
    }
    case "bench.entry.voided": {
      const a = args as MutationArgs<"bench.entry.voided">;
      const row = readRow(db, "bench_entry", a.id);
      if (!row) return reject("not_found", "The entry to void is not on the server.");
      const ticket = openTicket(db, row.ticketId, ctx.heads);
      if (isOutcome(ticket)) return ticket;
      if (user.role === "tech" && row.recordedBy !== user.id) {
        return reject("forbidden", "Only the person who recorded an entry (or the counter) can void it.");
      }
      const next = voidedEntry(row, a, user.id);
      if (isRefusal(next)) return reject(next.code, next.message);
      updateRow(db, "bench_entry", next);
      return { ok: true };
    }
    case "finding.changed": {
      const a = args as MutationArgs<"finding.changed">;
      const row = readRow(db, "finding", a.id);
      if (!row) return reject("not_found", "The finding to change is not on the server.");
      const ticket = openTicket(db, row.ticketId, ctx.heads);
      if (isOutcome(ticket)) return ticket;
      updateRow(db, "finding", changedFinding(row, a, user.id));
      return { ok: true };
    }
    case "labor.stopped": {
      const a = args as MutationArgs<"labor.stopped">;
      const row = readRow(db, "labor_entry", a.id);
      if (!row) return reject("not_found", "The timer to stop is not on the server.");
      if (user.role === "tech" && row.userId !== user.id) return reject("forbidden", "Only the person who started a timer can stop it.");
      // Stopping is allowed on a closed ticket: it completes time that began while the ticket was open.
      const next = stoppedLabor(row, a);
      if (isRefusal(next)) return reject(next.code, next.message);
      updateRow(db, "labor_entry", next);
      return { ok: true };
    }
    case "ticket.status_changed": {
      const a = args as MutationArgs<"ticket.status_changed">;
      const ticket = openTicket(db, a.ticketId, ctx.heads);
      if (isOutcome(ticket)) return ticket;
      if (!(BENCH_STATUSES as readonly string[]).includes(a.status)) {
        return reject("forbidden", `"${STATUS_LABELS[a.status]}" is set at the counter, not from the bench.`);
      }
      if (a.baseVersion !== ticket.version) {
        stmt(
          db,
          `INSERT INTO sync_conflicts (id, ticket_id, field, device_value, server_value, base_version, server_version, mutation_id, device_id, user_id)
           VALUES (?, ?, 'status', ?, ?, ?, ?, ?, ?, ?)`,
        ).run(crypto.randomUUID(), ticket.id, JSON.stringify(a.status), JSON.stringify(ticket.status), a.baseVersion, ticket.version, ctx.mutationId, ctx.deviceId, user.id);
        const now = STATUS_LABELS[ticket.status as TicketStatus] ?? ticket.status;
        return reject(
          "conflict",
          `Ticket #${ticket.number} was changed at the counter after you looked at it (it is now "${now}"). ` +
            `Your change to "${STATUS_LABELS[a.status]}" was kept for the counter to decide.`,
        );
      }
      ctx.heads.delete(ticket.id);
      // Two writes: a savepoint keeps them together.
      db.$client.transaction(() => {
        stmt(db, "UPDATE tickets SET status = ?, updated_at = ? WHERE id = ?").run(a.status, Date.now(), ticket.id);
        stmt(db, "INSERT INTO audit_log (actor_id, action, entity, entity_id, details) VALUES (?, 'ticket.status_changed', 'ticket', ?, ?)").run(
        user.id,
        ticket.id,
          JSON.stringify({ from: ticket.status, to: a.status, via: "bench sync", deviceId: ctx.deviceId }),
        );
      })();
      return { ok: true };
    }
  }
}

function validate(m: OutboxMutation): { name: MutationName; args: Record<string, unknown> } | Outcome {
  if (!(m.name in mutationSchemas)) {
    return reject("invalid", `This server does not know the change "${m.name}". Update the app on the server or the phone.`);
  }
  const name = m.name as MutationName;
  const parsed = mutationSchemas[name].safeParse(m.args);
  if (!parsed.success) return reject("invalid", "The change was not valid, so it was not added.", { fields: zodFields(parsed.error) });
  return { name, args: parsed.data as Record<string, unknown> };
}

function isSqliteError(err: unknown): err is Error & { code: string } {
  const code = (err as { code?: unknown } | null)?.code;
  return err instanceof Error && typeof code === "string" && code.startsWith("SQLITE_");
}

/**
 * Applies a push in one SQLite transaction. Each mutation is answered `applied`, `duplicate` (already
 * answered before: retries are harmless) or `rejected` with a reason; a rejection is recorded too, so a
 * retry gets the same answer and the device's sequence moves on. A gap in the sequence is refused
 * (nothing after it is recorded) so the device sends the missing changes first.
 */
export function applyPush(db: Db, user: CurrentUser, req: PushRequest, meta: { userAgent?: string } = {}): PushResponse {
  if (req.protocolVersion !== PROTOCOL_VERSION) {
    throw new AppError("upgrade_required", "This app is out of date for the server. Reload it to update, then sync again; nothing was lost.");
  }
  const client = db.$client;
  const run = client.transaction((): PushResponse => {
    const device = bindDevice(db, req.deviceId, user, meta.userAgent);
    let lastSeq = device.lastSeq;
    const results: PushResult[] = [];
    const findPrior = stmt(db, "SELECT device_id, user_id, outcome, reason, name, args FROM applied_mutations WHERE mutation_id = ?");
    const record = stmt(
      db,
      "INSERT INTO applied_mutations (mutation_id, device_id, seq, name, user_id, outcome, reason, args, at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)",
    );
    let gapAt: number | null = null;
    const heads: Heads = new Map();
    for (const m of req.mutations) {
      const prior = findPrior.get(m.mutationId) as
        | { device_id: string; user_id: string; outcome: string; reason: string | null; name: string; args: string | null }
        | undefined;
      if (prior) {
        if (prior.user_id !== user.id) {
          results.push({ mutationId: m.mutationId, seq: m.seq, status: "rejected", reason: { code: "mutation_reused", message: "This change id belongs to someone else's change." } });
        } else if (prior.outcome === "applied") {
          results.push({ mutationId: m.mutationId, seq: m.seq, status: "duplicate" });
        } else {
          const reason = JSON.parse(prior.reason ?? "{}") as RejectReason;
          results.push({ mutationId: m.mutationId, seq: m.seq, status: "rejected", reason, current: currentFor(db, prior.name, JSON.parse(prior.args ?? "{}")) });
        }
        continue;
      }
      if (gapAt !== null || m.seq > lastSeq + 1) {
        gapAt ??= lastSeq + 1;
        results.push({
          mutationId: m.mutationId,
          seq: m.seq,
          status: "rejected",
          reason: { code: "gap", message: `Earlier changes from this phone have not arrived yet (expected #${gapAt}).`, retryable: true, expectedSeq: gapAt },
        });
        continue;
      }
      if (m.seq <= lastSeq) {
        results.push({
          mutationId: m.mutationId,
          seq: m.seq,
          status: "rejected",
          reason: { code: "seq_reused", message: `Sequence #${m.seq} from this phone was already used by another change.` },
        });
        continue;
      }
      const checked = validate(m);
      let outcome: Outcome;
      if (isOutcome(checked)) outcome = checked;
      else {
        try {
          // Each change writes one statement (or keeps its own savepoint), so a refusal never leaves half a change.
          outcome = applyOne(db, user, checked.name, checked.args, { at: m.at, mutationId: m.mutationId, deviceId: req.deviceId, heads });
        } catch (err) {
          if (!isSqliteError(err)) throw err;
          outcome = reject("invalid", "The server could not store this change as it is.");
          console.error("[sync] mutation refused by the database", m.name, err.code, err.message);
        }
      }
      // The args are kept for refusals only: a retry's answer hands back the server's row for them.
      const args = outcome.ok ? null : JSON.stringify(isOutcome(checked) ? m.args : checked.args);
      record.run(m.mutationId, req.deviceId, m.seq, m.name, user.id, outcome.ok ? "applied" : "rejected", outcome.ok ? null : JSON.stringify(outcome.reason), args, Date.parse(m.at));
      lastSeq = m.seq;
      if (outcome.ok) results.push({ mutationId: m.mutationId, seq: m.seq, status: "applied" });
      else results.push({ mutationId: m.mutationId, seq: m.seq, status: "rejected", reason: outcome.reason, current: currentFor(db, m.name, m.args) });
    }
    stmt(db, "UPDATE devices SET last_seq = ?, last_seen_at = ? WHERE id = ?").run(lastSeq, Date.now(), req.deviceId);
    if (req.pending) storeReport(db, req.deviceId, req.pending);
    return { protocolVersion: PROTOCOL_VERSION, lastSeq, serverVersion: maxVersion(db), results };
  });
  return run.immediate();
}

/** The server's row for the one a rejected mutation tried to write, so the device can put it back. */
function currentFor(db: Db, name: string, args: Record<string, unknown>) {
  if (!(name in MUTATION_ENTITY)) return undefined;
  const n = name as MutationName;
  const id = entityIdOf(n, args);
  if (typeof id !== "string" || id === "undefined") return undefined;
  return currentChange(db, MUTATION_ENTITY[n], id);
}
