import { describe, expect, it } from "vitest";
import { CHAIN_SAW } from "@/lib/procedures/built-in/chain-saw";
import { describeStepValue, stepById } from "@/lib/procedures/describe";
import { buildBenchSheetView, laborMinutes, type SheetRows } from "@/lib/counter/bench-sheet-view";
import type { BenchEntryRow } from "@/lib/sync/protocol";

const T = "ticket-1";
const empty = (): SheetRows => ({ bench_entry: [], finding: [], tune_entry: [], photo: [], labor_entry: [], ticket_note: [], part_used: [] });
const entry = (stepId: string, value: BenchEntryRow["value"], at: string, extra: Partial<BenchEntryRow> = {}): BenchEntryRow => ({
  id: `${stepId}-${at}`, ticketId: T, procedureId: CHAIN_SAW.id, procedureVersion: CHAIN_SAW.version, stepId, value, note: null, at,
  recordedBy: "u-tech", voidedAt: null, voidedBy: null, voidReason: null, ...extra,
});
const procs = new Map([[CHAIN_SAW.id, CHAIN_SAW]]);
const names = new Map([["u-tech", "Tomas Brevik"]]);

describe("a recorded result in words", () => {
  it("names the picked options, pass/fail labels and a reading with its verdict", () => {
    expect(describeStepValue(stepById(CHAIN_SAW, "pull-over-feel"), { kind: "choice", selected: ["weak"] })).toBe("Weak");
    expect(describeStepValue(stepById(CHAIN_SAW, "chain-brake"), { kind: "pass-fail", pass: false })).toBe("Faulty"); // the step's own fail label
    // [common practice, no single source] the soft default compression band is 100–150 psi: 85 psi is low
    expect(describeStepValue(stepById(CHAIN_SAW, "compression-gauge"), { kind: "reading", value: 85, unit: "psi" })).toBe("85 psi (low)");
    expect(describeStepValue(stepById(CHAIN_SAW, "parts-used"), { kind: "parts", items: [{ partId: "fuel-line", sizeId: "id-1-8-in", quantity: 1 }] })).toBe(
      "Fuel line (1/8 in ID) × 1",
    );
  });

  it("replays a tune log: seated, out 1 ¼, then ¼ out → 1 ½ turns out", () => {
    const v = { kind: "tune", baselines: { low: { kind: "seated-then-out", eighths: 10 } }, entries: [{ screw: "low", direction: "ccw", eighths: 2 }] };
    expect(describeStepValue(stepById(CHAIN_SAW, "tune"), v)).toBe("Low-speed mixture screw: 1 ½ turns out from seated");
  });

  it("never throws on a value that does not fit", () => {
    expect(describeStepValue(stepById(CHAIN_SAW, "tune"), { kind: "nope" })).toBe("(unreadable result)");
  });
});

describe("the counter's view of a synced sheet", () => {
  it("shows the latest answer per step in bench order, with earlier and voided answers as history", () => {
    const rows = empty();
    rows.bench_entry = [
      entry("primed-start", { kind: "choice", selected: ["no-start"] }, "2026-11-30T10:05:00.000Z"),
      entry("pull-over-feel", { kind: "choice", selected: ["fair"] }, "2026-11-30T10:00:00.000Z"),
      entry("pull-over-feel", { kind: "choice", selected: ["strong"] }, "2026-11-30T10:02:00.000Z"),
      entry("primed-start", { kind: "choice", selected: ["ran-briefly"] }, "2026-11-30T10:07:00.000Z", {
        voidedAt: "2026-11-30T10:08:00.000Z", voidedBy: "u-tech", voidReason: "tapped the wrong chip",
      }),
    ];
    const view = buildBenchSheetView(rows, procs, names);
    expect(view.procedureTitle).toBe(CHAIN_SAW.title);
    expect(view.entries.map((e) => [e.stepId, e.answer])).toEqual([
      ["pull-over-feel", "Strong"],
      ["primed-start", "No start"],
    ]);
    expect(view.entries[0]!.history).toEqual([{ answer: "Fair", at: "2026-11-30T10:00:00.000Z", by: "Tomas Brevik", voided: false, voidReason: null }]);
    expect(view.entries[1]!.history[0]).toMatchObject({ answer: "Ran briefly, then died", voided: true, voidReason: "tapped the wrong chip" });
  });

  it("orders findings by grade, hides withdrawn ones and replays the tune entries", () => {
    const rows = empty();
    const f = (id: string, grade: "cause" | "due_soon" | "advisory", withdrawn = false) => ({
      id, ticketId: T, stepId: null, grade, title: id, note: "", photoIds: [], suggestedParts: [], suggestedLaborMinutes: null,
      alternatives: null, withdrawn, createdBy: "u-tech", at: "2026-11-30T10:00:00.000Z", changedAt: null, changedBy: null, revision: 1,
    });
    rows.finding = [f("advice", "advisory"), f("gone", "cause", true), f("main", "cause"), f("soon", "due_soon")];
    rows.tune_entry = [
      { id: "b", ticketId: T, screw: "high", kind: "baseline", direction: null, eighths: 8, baselineKind: "seated-then-out", at: "2026-11-30T10:00:00.000Z", recordedBy: "u-tech" },
      { id: "t", ticketId: T, screw: "high", kind: "turn", direction: "cw", eighths: 1, baselineKind: null, at: "2026-11-30T10:01:00.000Z", recordedBy: "u-tech" },
    ];
    const view = buildBenchSheetView(rows, procs, names);
    expect(view.findings.map((x) => x.id)).toEqual(["main", "soon", "advice"]);
    expect(view.tune).toEqual([{ screw: "high", label: "High-speed mixture screw", position: "⅞ turn out from seated" }]);
    expect(view.isEmpty).toBe(false);
    expect(buildBenchSheetView(empty(), procs, names).isEmpty).toBe(true);
  });

  it("sums labor to whole minutes and counts an open interval up to now", () => {
    const rows = [
      { id: "a", ticketId: T, userId: "u", startedAt: "2026-11-30T10:00:00.000Z", endedAt: "2026-11-30T10:45:30.000Z" },
      { id: "b", ticketId: T, userId: "u", startedAt: "2026-11-30T11:00:00.000Z", endedAt: null },
    ];
    expect(laborMinutes(rows, new Date("2026-11-30T11:30:00.000Z"))).toEqual({ minutes: 75, running: true });
  });
});
