import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  formatWorked,
  laborActions,
  laborByTicket,
  laborState,
  laborTap,
  laborUndo,
  parseEventTime,
  secondsToMinutes,
  type LaborEvent,
  type TimedLaborEvent,
} from "@/lib/bench/labor";

let n = 0;
const ev = (kind: LaborEvent["kind"], at: string, voids?: string): LaborEvent => ({ id: `e${++n}`, kind, at, ...(voids ? { voids } : {}) });

describe("worked time from stored start / pause / stop times", () => {
  it("start 08:00, pause 08:45, start 09:00, stop 09:30 → 75 min [arithmetic: 45 + 30]", () => {
    const events = [ev("start", "2026-05-04T08:00:00Z"), ev("pause", "2026-05-04T08:45:00Z"), ev("start", "2026-05-04T09:00:00Z"), ev("stop", "2026-05-04T09:30:00Z")];
    const s = laborState(events, "2026-05-04T17:00:00Z");
    expect(s).toMatchObject({ status: "stopped", runningSince: null, workedSeconds: 4500, workedMinutes: 75, ignored: [] });
    expect(s.segments).toEqual([
      { start: "2026-05-04T08:00:00Z", end: "2026-05-04T08:45:00Z", seconds: 2700 },
      { start: "2026-05-04T09:00:00Z", end: "2026-05-04T09:30:00Z", seconds: 1800 },
    ]);
  });

  it("a running timer counts up to now, in whole minutes rounded half up", () => {
    const events = [ev("start", "2026-05-04T08:00:00Z")];
    expect(laborState(events, "2026-05-04T08:20:29Z")).toMatchObject({ status: "running", runningSince: "2026-05-04T08:00:00Z", workedMinutes: 20 });
    expect(laborState(events, "2026-05-04T08:20:30Z").workedMinutes).toBe(21);
    expect([secondsToMinutes(0), secondsToMinutes(29), secondsToMinutes(30), secondsToMinutes(89), secondsToMinutes(90)]).toEqual([0, 0, 1, 1, 2]);
  });

  it("times with offsets across the US daylight-saving change count real elapsed time", () => {
    // [15 U.S.C. 260a] DST begins at 2:00 a.m. on the second Sunday of March (8 March 2026);
    // [ISO 8601] 01:30 −05:00 and 03:30 −04:00 are one hour apart (06:30Z and 07:30Z).
    const events = [ev("start", "2026-03-08T01:30:00-05:00"), ev("stop", "2026-03-08T03:30:00-04:00")];
    expect(laborState(events, new Date("2026-03-08T12:00:00Z")).workedMinutes).toBe(60);
  });

  it("the state comes from the stored events alone: a JSON round trip (a reload) gives the same answer", () => {
    const events = [ev("start", "2026-05-04T08:00:00Z"), ev("pause", "2026-05-04T08:10:00Z"), ev("start", "2026-05-04T08:15:00Z")];
    const reloaded = JSON.parse(JSON.stringify(events)) as LaborEvent[];
    const now = "2026-05-04T08:40:00Z";
    expect(laborState(reloaded, now)).toEqual(laborState(events, now));
    expect(laborState(reloaded, now)).toMatchObject({ status: "running", workedMinutes: 35 });
  });

  it("events stored out of order are applied in time order", () => {
    const a = ev("start", "2026-05-04T08:00:00Z");
    const b = ev("stop", "2026-05-04T08:30:00Z");
    expect(laborState([b, a], "2026-05-04T09:00:00Z")).toMatchObject({ status: "stopped", workedMinutes: 30, ignored: [] });
  });
});

describe("taps that make no sense are ignored and reported, never double-counted", () => {
  it("a second start while running (two taps, or two devices)", () => {
    const dup = ev("start", "2026-05-04T08:05:00Z");
    const events = [ev("start", "2026-05-04T08:00:00Z"), dup, ev("stop", "2026-05-04T08:30:00Z")];
    const s = laborState(events, "2026-05-04T09:00:00Z");
    expect(s.workedMinutes).toBe(30);
    expect(s.ignored).toEqual([{ eventId: dup.id, reason: "The timer was already running." }]);
  });

  it("a pause while paused, a stop while paused, a pause before any start", () => {
    const early = ev("pause", "2026-05-04T07:00:00Z");
    const again = ev("pause", "2026-05-04T08:20:00Z");
    const events = [early, ev("start", "2026-05-04T08:00:00Z"), ev("pause", "2026-05-04T08:10:00Z"), again, ev("stop", "2026-05-04T08:30:00Z")];
    const s = laborState(events, "2026-05-04T09:00:00Z");
    expect(s).toMatchObject({ status: "stopped", workedMinutes: 10 });
    expect(s.ignored.map((i) => i.eventId)).toEqual([early.id, again.id]);
  });

  it("a time without a zone is refused (it could be any of 24 zones)", () => {
    const local = ev("start", "2026-05-04T08:00:00");
    const s = laborState([local], "2026-05-04T09:00:00Z");
    expect(s).toMatchObject({ status: "idle", workedMinutes: 0 });
    expect(s.ignored).toEqual([{ eventId: local.id, reason: '"2026-05-04T08:00:00" is not a time with a zone.' }]);
    expect(Number.isNaN(parseEventTime("yesterday"))).toBe(true);
    expect(parseEventTime("2026-05-04T08:00:00.250+02:00")).toBe(Date.UTC(2026, 4, 4, 6, 0, 0, 250));
  });

  it("a start stamped after now (a phone clock ahead) counts zero, never negative", () => {
    const s = laborState([ev("start", "2026-05-04T09:05:00Z")], "2026-05-04T09:00:00Z");
    expect(s).toMatchObject({ status: "running", workedSeconds: 0, workedMinutes: 0 });
  });
});

describe("taps and undo", () => {
  const t = (iso: string) => new Date(iso);

  it("offers the right buttons for each state", () => {
    expect(laborActions("idle")).toEqual(["start"]);
    expect(laborActions("running")).toEqual(["pause", "stop"]);
    expect(laborActions("paused")).toEqual(["start", "stop"]);
    expect(laborActions("stopped")).toEqual(["start"]);
  });

  it("a tap gives the event to store, or a clear refusal", () => {
    const start = laborTap([], "start", t("2026-05-04T08:00:00Z"), "a");
    expect(start).toEqual({ ok: true, value: { id: "a", kind: "start", at: "2026-05-04T08:00:00.000Z" } });
    const events = start.ok ? [start.value] : [];
    expect(laborTap(events, "start", t("2026-05-04T08:01:00Z"), "b")).toEqual({ ok: false, message: "The timer is already running." });
    expect(laborTap([], "pause", t("2026-05-04T08:01:00Z"), "c")).toEqual({ ok: false, message: "The timer has not been started." });
    expect(laborTap(events, "pause", t("2026-05-04T08:30:00Z"), "d").ok).toBe(true);
  });

  it("undo is a void entry: the stop is taken back and the timer runs again", () => {
    const start = ev("start", "2026-05-04T08:00:00Z");
    const stop = ev("stop", "2026-05-04T08:30:00Z");
    const undo = laborUndo([start, stop], t("2026-05-04T08:31:00Z"), "u1");
    expect(undo).toEqual({ ok: true, value: { id: "u1", kind: "void", at: "2026-05-04T08:31:00.000Z", voids: stop.id } });
    const events = undo.ok ? [start, stop, undo.value] : [];
    expect(laborState(events, "2026-05-04T09:00:00Z")).toMatchObject({ status: "running", workedMinutes: 60 });
    // undo again takes back the start; then nothing is left to undo
    const undo2 = laborUndo(events, t("2026-05-04T09:00:00Z"), "u2");
    expect(undo2.ok && undo2.value.voids).toBe(start.id);
    const all = undo2.ok ? [...events, undo2.value] : events;
    expect(laborState(all, "2026-05-04T09:00:00Z")).toMatchObject({ status: "idle", workedMinutes: 0 });
    expect(laborUndo(all, t("2026-05-04T09:01:00Z"), "u3")).toEqual({ ok: false, message: "There is nothing to undo on this timer." });
  });

  it("a void of an event that is not there is reported", () => {
    const stray = ev("void", "2026-05-04T08:00:00Z", "nope");
    expect(laborState([stray], "2026-05-04T09:00:00Z").ignored).toEqual([{ eventId: stray.id, reason: "It takes back an event that is not there." }]);
  });
});

describe("minutes per ticket", () => {
  it("sums each tech's own timer on a ticket, keeps tickets apart, and says which are running", () => {
    const e = (ticketId: string, techId: string, kind: LaborEvent["kind"], at: string): TimedLaborEvent => ({ ...ev(kind, at), ticketId, techId });
    const events = [
      e("T1", "ana", "start", "2026-05-04T08:00:00Z"),
      e("T1", "ana", "stop", "2026-05-04T08:40:00Z"),
      e("T1", "bo", "start", "2026-05-04T08:10:00Z"), // a second tech on the same ticket at the same time
      e("T1", "bo", "stop", "2026-05-04T08:30:00Z"),
      e("T2", "ana", "start", "2026-05-04T09:00:00Z"),
    ];
    const totals = laborByTicket(events, "2026-05-04T09:15:00Z");
    expect(totals.get("T1")).toEqual({ ticketId: "T1", workedMinutes: 60, workedSeconds: 3600, running: false });
    expect(totals.get("T2")).toEqual({ ticketId: "T2", workedMinutes: 15, workedSeconds: 900, running: true });
  });

  it("formats minutes for the sheet", () => {
    expect([formatWorked(0), formatWorked(45), formatWorked(65), formatWorked(600)]).toEqual(["0 min", "45 min", "1 h 05 min", "10 h 00 min"]);
    expect(() => formatWorked(-1)).toThrow(RangeError);
  });
});

describe("against an independent sum of the worked spans (property)", () => {
  it("any sequence of work and breaks totals the sum of its work spans, in any stored order", () => {
    const base = Date.UTC(2026, 4, 4, 7, 0, 0);
    fc.assert(
      fc.property(
        fc.array(fc.record({ work: fc.integer({ min: 1, max: 7200 }), rest: fc.integer({ min: 1, max: 3600 }), pause: fc.boolean() }), {
          minLength: 1,
          maxLength: 12,
        }),
        fc.integer({ min: 0, max: 1000 }),
        (spans, seed) => {
          const events: LaborEvent[] = [];
          let t = base;
          let expectedSeconds = 0;
          spans.forEach((s, i) => {
            events.push({ id: `s${i}`, kind: "start", at: new Date(t).toISOString() });
            t += s.work * 1000;
            expectedSeconds += s.work;
            events.push({ id: `e${i}`, kind: s.pause ? "pause" : "stop", at: new Date(t).toISOString() });
            t += s.rest * 1000;
          });
          // Fisher–Yates with a small LCG from the seed: the stored order must not matter
          const shuffled = [...events];
          let x = seed + 1;
          for (let i = shuffled.length - 1; i > 0; i--) {
            x = (x * 1103515245 + 12345) % 2147483648;
            const j = x % (i + 1);
            [shuffled[i], shuffled[j]] = [shuffled[j] as LaborEvent, shuffled[i] as LaborEvent];
          }
          const s = laborState(shuffled, t);
          expect(s.workedSeconds).toBe(expectedSeconds);
          expect(s.workedMinutes).toBe(Math.floor((expectedSeconds + 30) / 60));
          expect(s.ignored).toEqual([]);
        },
      ),
      { numRuns: 200 },
    );
  });
});
