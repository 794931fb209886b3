/**
 * Labor timer math. The timer is never a running counter in memory: it is derived from stored events
 * (start / pause / stop, each with the time it happened), so it survives a reload, a closed tab or going offline.
 *
 * - `start` begins a segment of work (also to resume after a pause or a stop);
 * - `pause` ends the segment for a break; `stop` ends it and the timer rests;
 * - `void` takes back an earlier event by id (undo is a void entry, never a delete).
 *
 * Events are applied in time order (ties in the order given). An event that makes no sense in its place —
 * a second start while running (two taps, two devices), a pause while not running — is ignored and reported,
 * so the total never double-counts. Times are ISO 8601 strings with a zone (UTC "Z" or an offset); an open
 * segment runs until `now`. Minutes are whole minutes, rounded half up from the seconds worked.
 *
 * Pure TypeScript, no framework.
 */
import { err, ok, type Result } from "../trade/result";

export const LABOR_EVENT_KINDS = ["start", "pause", "stop", "void"] as const;
export type LaborEventKind = (typeof LABOR_EVENT_KINDS)[number];

export type LaborEvent = {
  id: string;
  kind: LaborEventKind;
  /** ISO 8601 with a zone, e.g. "2026-05-04T08:00:00Z" or "2026-05-04T08:00:00-05:00". */
  at: string;
  /** For `void`: the id of the event taken back. */
  voids?: string;
};

export type LaborStatus = "idle" | "running" | "paused" | "stopped";

export type LaborSegment = { start: string; end: string | null; seconds: number };

export type LaborState = {
  status: LaborStatus;
  /** When the open segment began (status "running"). */
  runningSince: string | null;
  workedSeconds: number;
  workedMinutes: number;
  segments: LaborSegment[];
  ignored: { eventId: string; reason: string }[];
};

export type TimedLaborEvent = LaborEvent & { ticketId: string; techId?: string };

const ZONED_ISO = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/;

/** Milliseconds since the epoch for a zoned ISO 8601 time, or NaN. */
export function parseEventTime(at: string): number {
  return ZONED_ISO.test(at) ? Date.parse(at) : Number.NaN;
}

const toMs = (now: Date | number | string): number =>
  typeof now === "number" ? now : typeof now === "string" ? parseEventTime(now) : now.getTime();

/** Whole minutes from seconds, half up: 89 s → 1, 90 s → 2. */
export const secondsToMinutes = (seconds: number): number => Math.floor((seconds + 30) / 60);

/** The timer's state from its events, at `now`. */
export function laborState(events: readonly LaborEvent[], now: Date | number | string): LaborState {
  const nowMs = toMs(now);
  const ignored: LaborState["ignored"] = [];
  const voided = new Set<string>();
  for (const e of events) {
    if (e.kind === "void") {
      if (e.voids && events.some((x) => x.id === e.voids && x.kind !== "void")) voided.add(e.voids);
      else ignored.push({ eventId: e.id, reason: "It takes back an event that is not there." });
    }
  }
  const timed = events
    .map((e, i) => ({ e, i, ms: parseEventTime(e.at) }))
    .filter(({ e, ms }) => {
      if (e.kind === "void" || voided.has(e.id)) return false;
      if (Number.isNaN(ms)) {
        ignored.push({ eventId: e.id, reason: `"${e.at}" is not a time with a zone.` });
        return false;
      }
      return true;
    })
    .sort((a, b) => a.ms - b.ms || a.i - b.i);

  let status: LaborStatus = "idle";
  let openStart: { at: string; ms: number } | null = null;
  const segments: LaborSegment[] = [];
  let workedMs = 0;

  for (const { e, ms } of timed) {
    if (e.kind === "start") {
      if (status === "running") {
        ignored.push({ eventId: e.id, reason: "The timer was already running." });
        continue;
      }
      openStart = { at: e.at, ms };
      status = "running";
    } else {
      if (status !== "running" || !openStart) {
        if (e.kind === "stop" && status === "paused") {
          status = "stopped";
          continue;
        }
        ignored.push({ eventId: e.id, reason: `The timer was not running, so there was nothing to ${e.kind}.` });
        continue;
      }
      const length = ms - openStart.ms;
      workedMs += length;
      segments.push({ start: openStart.at, end: e.at, seconds: Math.floor(length / 1000) });
      openStart = null;
      status = e.kind === "pause" ? "paused" : "stopped";
    }
  }
  if (status === "running" && openStart) {
    const length = Math.max(0, nowMs - openStart.ms);
    workedMs += Number.isNaN(length) ? 0 : length;
    segments.push({ start: openStart.at, end: null, seconds: Math.floor(length / 1000) });
  }
  const workedSeconds = Math.floor(workedMs / 1000);
  return {
    status,
    runningSince: status === "running" && openStart ? openStart.at : null,
    workedSeconds,
    workedMinutes: secondsToMinutes(workedSeconds),
    segments,
    ignored,
  };
}

/** What the tech can tap next. */
export function laborActions(status: LaborStatus): ("start" | "pause" | "stop")[] {
  switch (status) {
    case "idle":
    case "stopped":
      return ["start"];
    case "running":
      return ["pause", "stop"];
    case "paused":
      return ["start", "stop"];
  }
}

const REFUSALS: Record<LaborStatus, string> = {
  idle: "The timer has not been started.",
  running: "The timer is already running.",
  paused: "The timer is paused: tap Start to carry on, or Stop.",
  stopped: "The timer is stopped: tap Start to begin again.",
};

/**
 * The event for a tap, or a clear refusal when the tap makes no sense now (the state is unchanged).
 * The caller stores the event; the state is derived again from the stored events.
 */
export function laborTap(
  events: readonly LaborEvent[],
  kind: "start" | "pause" | "stop",
  now: Date,
  id: string,
): Result<LaborEvent> {
  const { status } = laborState(events, now);
  if (!laborActions(status).includes(kind)) return err(REFUSALS[status]);
  return ok({ id, kind, at: now.toISOString() });
}

/** A void of the latest event still in force (undo), or an error when there is nothing to undo. */
export function laborUndo(events: readonly LaborEvent[], now: Date, id: string): Result<LaborEvent> {
  const voided = new Set(events.filter((e) => e.kind === "void" && e.voids).map((e) => e.voids));
  const live = events
    .map((e, i) => ({ e, i, ms: parseEventTime(e.at) }))
    .filter(({ e, ms }) => e.kind !== "void" && !voided.has(e.id) && !Number.isNaN(ms))
    .sort((a, b) => a.ms - b.ms || a.i - b.i);
  const last = live.at(-1);
  if (!last) return err("There is nothing to undo on this timer.");
  return ok({ id, kind: "void", at: now.toISOString(), voids: last.e.id });
}

export type TicketLabor = { ticketId: string; workedMinutes: number; workedSeconds: number; running: boolean };

/**
 * Minutes per ticket. Each tech's events on a ticket make that tech's own timer; the ticket's total is the sum
 * of its techs' timers (two techs at once count twice: two people's time).
 */
export function laborByTicket(events: readonly TimedLaborEvent[], now: Date | number | string): Map<string, TicketLabor> {
  const timers = new Map<string, TimedLaborEvent[]>();
  for (const e of events) {
    const key = JSON.stringify([e.ticketId, e.techId ?? ""]);
    const list = timers.get(key) ?? [];
    list.push(e);
    timers.set(key, list);
  }
  const out = new Map<string, TicketLabor>();
  for (const list of timers.values()) {
    const ticketId = (list[0] as TimedLaborEvent).ticketId;
    const s = laborState(list, now);
    const prev = out.get(ticketId) ?? { ticketId, workedMinutes: 0, workedSeconds: 0, running: false };
    const workedSeconds = prev.workedSeconds + s.workedSeconds;
    out.set(ticketId, {
      ticketId,
      workedSeconds,
      workedMinutes: secondsToMinutes(workedSeconds),
      running: prev.running || s.status === "running",
    });
  }
  return out;
}

/** "1 h 05 min", "45 min", "0 min". */
export function formatWorked(minutes: number): string {
  if (!Number.isInteger(minutes) || minutes < 0) throw new RangeError("minutes must be a whole number ≥ 0");
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return h === 0 ? `${m} min` : `${h} h ${String(m).padStart(2, "0")} min`;
}
