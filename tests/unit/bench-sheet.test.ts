/**
 * The bench sheet on the phone (lib/bench/sheet): results per step from bench entries, tune entries and photos;
 * the tune log replayed; time worked from stored start and end times.
 *
 * Sources: tune-screw arithmetic and meaning are common practice, no single source (out = counter-clockwise =
 * richer); eighths of a turn are plain arithmetic. The chain-saw steps are our own built-in procedure.
 */
import { describe, expect, it } from "vitest";
import { formatClock, laborTotal, parseProcedures, sheetProcedure, sheetResults, sheetState, tuneLog } from "@/lib/bench/sheet";
import { BUILT_IN_PROCEDURES, procedureFor } from "@/lib/procedures";
import type { BenchEntryRow, LaborEntryRow, PhotoRow, TuneEntryRow } from "@/lib/sync/protocol";

const SAW = procedureFor("chain_saw", "two_stroke")!;
const T = "00000000-0000-4000-8000-0000000000aa";

let n = 0;
const at = (min: number) => new Date(Date.UTC(2026, 11, 1, 9, min)).toISOString();
const entry = (stepId: string, value: unknown, min: number, voided = false): BenchEntryRow => ({
  id: `e${++n}`,
  ticketId: T,
  procedureId: SAW.id,
  procedureVersion: SAW.version,
  stepId,
  value: value as BenchEntryRow["value"],
  note: null,
  at: at(min),
  recordedBy: "u1",
  voidedAt: voided ? at(min + 1) : null,
  voidedBy: voided ? "u1" : null,
  voidReason: null,
});
const tune = (screw: TuneEntryRow["screw"], kind: TuneEntryRow["kind"], eighths: number, min: number, direction: TuneEntryRow["direction"] = null): TuneEntryRow => ({
  id: `t${++n}`,
  ticketId: T,
  screw,
  kind,
  direction,
  eighths,
  baselineKind: kind === "baseline" ? (screw === "idle" ? "as-found" : "seated-then-out") : null,
  at: at(min),
  recordedBy: "u1",
});

describe("sheetResults", () => {
  it("takes the newest entry per step that is not voided", () => {
    const rows = [
      entry("pull-over-feel", { kind: "choice", selected: ["weak"] }, 1),
      entry("pull-over-feel", { kind: "choice", selected: ["fair"] }, 2),
      entry("pull-over-feel", { kind: "choice", selected: ["strong"] }, 3, true),
    ];
    const r = sheetResults(SAW, { benchEntries: rows, tuneEntries: [], photos: [] });
    expect(r["pull-over-feel"]).toEqual({ kind: "choice", selected: ["fair"] });
  });

  it("a step whose only answer was voided has no result", () => {
    const r = sheetResults(SAW, { benchEntries: [entry("chain-tension", { kind: "choice", selected: ["loose"] }, 1, true)], tuneEntries: [], photos: [] });
    expect(r["chain-tension"]).toBeUndefined();
  });

  it("the tune step's result is the whole tune log; a photo step's is its photos", () => {
    const photoStep = SAW.sections.flatMap((s) => s.steps).find((s) => s.kind === "photo")!;
    const photo: PhotoRow = { id: "p1", ticketId: T, sha256: "a".repeat(64), mime: "image/jpeg", bytes: 10, width: 1, height: 1, stepId: photoStep.id, findingId: null, caption: null, at: at(5), takenBy: "u1" };
    const r = sheetResults(SAW, { benchEntries: [], tuneEntries: [tune("low", "baseline", 8, 1), tune("low", "turn", 1, 2, "ccw")], photos: [photo] });
    expect(r.tune).toEqual({ kind: "tune", baselines: { low: { kind: "seated-then-out", eighths: 8 } }, entries: [{ screw: "low", direction: "ccw", eighths: 1 }] });
    expect(r[photoStep.id]).toEqual({ kind: "photo", photoIds: ["a".repeat(64)] });
  });
});

describe("sheetState", () => {
  it("a primed start that ran briefly suggests fuel delivery and counts the step done", () => {
    const before = sheetState(SAW, { benchEntries: [], tuneEntries: [], photos: [] }, "chain_saw");
    const after = sheetState(SAW, { benchEntries: [entry("primed-start", { kind: "choice", selected: ["ran-briefly"] }, 1)], tuneEntries: [], photos: [] }, "chain_saw");
    expect(after.answered).toBe(before.answered + 1);
    expect(after.suggestions.map((s) => s.ruleId)).toContain("primed-ran-briefly");
    expect(after.open).not.toContain("primed-start");
  });

  it("no start shows the spark test, which a good start hides", () => {
    const noStart = sheetState(SAW, { benchEntries: [entry("primed-start", { kind: "choice", selected: ["no-start"] }, 1)], tuneEntries: [], photos: [] });
    const runs = sheetState(SAW, { benchEntries: [entry("primed-start", { kind: "choice", selected: ["kept-running"] }, 1)], tuneEntries: [], photos: [] });
    expect(noStart.visible.has("spark-test")).toBe(true);
    expect(runs.visible.has("spark-test")).toBe(false);
  });
});

describe("tuneLog", () => {
  it("replays baselines and turns: seated, out 1 turn, ⅛ out → 1 ⅛ turns out", () => {
    const log = tuneLog([tune("low", "baseline", 8, 1), tune("low", "turn", 1, 2, "ccw"), tune("high", "baseline", 8, 3), tune("high", "turn", 2, 4, "cw")]);
    expect(log.state.low.netEighths).toBe(9);
    expect(log.state.high.netEighths).toBe(6);
    expect([...log.baselined].sort()).toEqual(["high", "low"]);
    expect(log.turns).toHaveLength(2);
    expect(log.problem).toBeNull();
  });

  it("a turn past seated (from two phones' logs merged) is reported and left out, never applied", () => {
    const log = tuneLog([tune("high", "baseline", 2, 1), tune("high", "turn", 4, 2, "cw")]);
    expect(log.state.high.netEighths).toBe(2);
    expect(log.problem).toMatch(/cannot go ½ turn further in/);
  });

  it("a later baseline resets that screw", () => {
    const log = tuneLog([tune("low", "baseline", 8, 1), tune("low", "turn", 4, 2, "ccw"), tune("low", "baseline", 10, 3)]);
    expect(log.state.low.netEighths).toBe(10);
  });
});

describe("laborTotal", () => {
  const row = (start: number, end: number | null, userId = "u1"): LaborEntryRow => ({ id: `l${++n}`, ticketId: T, userId, startedAt: at(start), endedAt: end === null ? null : at(end) });
  it("sums closed stretches and a running one up to now", () => {
    const now = new Date(at(50));
    const t = laborTotal([row(0, 20), row(30, null)], "u1", now);
    expect(t.minutes).toBe(40);
    expect(t.running?.startedAt).toBe(at(30));
  });
  it("another person's running timer counts in the total but is not this person's to pause", () => {
    const t = laborTotal([row(0, null, "u2")], "u1", new Date(at(10)));
    expect(t.minutes).toBe(10);
    expect(t.running).toBeNull();
  });
  it("formats a clock", () => {
    expect(formatClock(0)).toBe("0:00:00");
    expect(formatClock(3725)).toBe("1:02:05");
  });
});

describe("sheetProcedure", () => {
  it("follows the procedure the entries were recorded against, else the one for the machine", () => {
    const held = parseProcedures(BUILT_IN_PROCEDURES.map((p) => ({ id: p.id, machineKind: p.machineKinds.join(","), name: p.title, version: p.version, definition: p })));
    expect(held).toHaveLength(BUILT_IN_PROCEDURES.length);
    expect(sheetProcedure({ kind: "chain_saw", engineType: "two_stroke" }, [], held)?.id).toBe(SAW.id);
    const mower = procedureFor("walk_mower", "four_stroke")!;
    const recorded = { ...entry("oil-level", { kind: "choice", selected: ["ok"] }, 1), procedureId: mower.id };
    expect(sheetProcedure({ kind: "chain_saw", engineType: "two_stroke" }, [recorded], held)?.id).toBe(mower.id);
    expect(sheetProcedure({ kind: "chain_saw", engineType: "electric" }, [], held)).toBeUndefined();
  });
  it("leaves out a definition that does not parse", () => {
    expect(parseProcedures([{ id: "x", machineKind: "chain_saw", name: "x", version: 1, definition: { nope: true } }])).toEqual([]);
  });
});
