import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  applyTuneEntry,
  applyTuneLog,
  describeEntry,
  describePosition,
  formatEighths,
  formatTurns,
  MEANING_BASIS,
  parseTurns,
  startTune,
  type TuneEntry,
  type TuneState,
} from "@/lib/trade/tune";

function start(...args: Parameters<typeof startTune>): TuneState {
  const r = startTune(...args);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

describe("fractions of a turn", () => {
  it("formats eighths with unicode fractions", () => {
    // [arithmetic] n eighths = n/8 turn, reduced
    expect([1, 2, 3, 4, 5, 6, 7].map(formatEighths)).toEqual(["⅛", "¼", "⅜", "½", "⅝", "¾", "⅞"]);
    expect(formatEighths(0)).toBe("0");
    expect(formatEighths(8)).toBe("1");
    expect(formatEighths(10)).toBe("1 ¼");
    expect(formatEighths(23)).toBe("2 ⅞");
    expect(formatEighths(-2)).toBe("−¼");
  });

  it("says turn or turns, out or in", () => {
    expect(formatTurns(10)).toBe("1 ¼ turns out");
    expect(formatTurns(4)).toBe("½ turn out");
    expect(formatTurns(8)).toBe("1 turn out");
    expect(formatTurns(-2)).toBe("¼ turn in");
    expect(formatTurns(0)).toBe("0 turns");
  });

  it("parses turns as typed", () => {
    expect(parseTurns("1 1/4")).toEqual({ ok: true, value: 10 });
    expect(parseTurns("1-1/4 turns")).toEqual({ ok: true, value: 10 });
    expect(parseTurns("1 ¼")).toEqual({ ok: true, value: 10 });
    expect(parseTurns("⅜")).toEqual({ ok: true, value: 3 });
    expect(parseTurns("3/8")).toEqual({ ok: true, value: 3 });
    expect(parseTurns("1.5")).toEqual({ ok: true, value: 12 });
    expect(parseTurns("2 turns")).toEqual({ ok: true, value: 16 });
    for (const bad of ["", "1/3", "0.1", "abc", "1 9/8", "1/0"]) expect(parseTurns(bad).ok, bad).toBe(false);
  });

  it("property: parse(format(n)) = n for every eighth up to 10 turns", () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 80 }), (n) => {
      const r = parseTurns(formatEighths(n));
      return r.ok && r.value === n;
    }));
  });
});

describe("net position per screw", () => {
  it("seated then out 1 ¼, then ⅛ in and ¼ out → 1 ⅜ turns out from seated", () => {
    const log = applyTuneLog({ low: { kind: "seated-then-out", eighths: 10 } }, [
      { screw: "low", direction: "cw", eighths: 1 },
      { screw: "low", direction: "ccw", eighths: 2 },
    ]);
    expect(log.ok).toBe(true);
    if (!log.ok) return;
    expect(log.value.low.netEighths).toBe(11);
    expect(describePosition(log.value.low)).toBe("1 ⅜ turns out from seated");
    expect(log.value.high.netEighths).toBe(0); // untouched screws stay as found
    expect(describePosition(log.value.high)).toBe("as found");
  });

  it("as found: the net is the change, + out / − in", () => {
    const log = applyTuneLog({}, [
      { screw: "idle", direction: "cw", eighths: 4 },
      { screw: "idle", direction: "cw", eighths: 2 },
      { screw: "high", direction: "cw", eighths: 3 },
    ]);
    expect(log.ok).toBe(true);
    if (!log.ok) return;
    expect(log.value.idle.netEighths).toBe(-6);
    expect(describePosition(log.value.idle)).toBe("¾ turn in from as found");
    expect(describePosition(log.value.high)).toBe("⅜ turn in from as found");
  });

  it("property: net = baseline + Σ out − Σ in for any accepted log", () => {
    const entry = fc.record({
      screw: fc.constantFrom("low" as const, "high" as const),
      direction: fc.constantFrom("cw" as const, "ccw" as const),
      eighths: fc.integer({ min: 1, max: 16 }),
    });
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 24 }), fc.array(entry, { maxLength: 20 }), (base, entries) => {
        let state = start({ low: { kind: "seated-then-out", eighths: base }, high: { kind: "as-found" } });
        let expectedLow = base;
        let expectedHigh = 0;
        for (const e of entries) {
          const d = e.direction === "ccw" ? e.eighths : -e.eighths;
          const r = applyTuneEntry(state, e);
          if (e.screw === "low" && expectedLow + d < 0) {
            if (r.ok) return false; // must be refused
            continue; // and the state is unchanged
          }
          if (!r.ok) return false;
          state = r.value;
          if (e.screw === "low") expectedLow += d;
          else expectedHigh += d;
        }
        return state.low.netEighths === expectedLow && state.high.netEighths === expectedHigh && state.low.netEighths >= 0;
      }),
    );
  });
});

describe("a seated screw cannot go further in", () => {
  it("refuses with a clear message and changes nothing", () => {
    const state = start({ low: { kind: "seated-then-out", eighths: 2 } });
    const r = applyTuneEntry(state, { screw: "low", direction: "cw", eighths: 3 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.message).toContain("Refused");
      expect(r.message).toContain("only ¼ turn out from seated");
      expect(r.message).toContain("⅜ turn further in");
    }
    expect(state.low.netEighths).toBe(2);
    // going exactly to seated is fine
    const seated = applyTuneEntry(state, { screw: "low", direction: "cw", eighths: 2 });
    expect(seated.ok && seated.value.low.netEighths).toBe(0);
    if (seated.ok) {
      expect(describePosition(seated.value.low)).toBe("seated (0 turns out)");
      const more = applyTuneEntry(seated.value, { screw: "low", direction: "cw", eighths: 1 });
      expect(!more.ok && more.message).toContain("already seated");
    }
  });

  it("a whole log stops at the refused entry, keeping what came before", () => {
    const entries: TuneEntry[] = [
      { screw: "high", direction: "ccw", eighths: 2 },
      { screw: "high", direction: "cw", eighths: 16 },
      { screw: "high", direction: "ccw", eighths: 1 },
    ];
    const log = applyTuneLog({ high: { kind: "seated-then-out", eighths: 8 } }, entries);
    expect(log.ok).toBe(false);
    if (!log.ok) {
      expect(log.entryNumber).toBe(2);
      expect(log.message).toMatch(/^Entry 2: Refused/);
      expect(log.state?.high.netEighths).toBe(10);
    }
  });

  it("refuses malformed entries and baselines with messages", () => {
    const state = start();
    for (const e of [
      { screw: "low", direction: "cw", eighths: 0 },
      { screw: "low", direction: "cw", eighths: 1.5 },
      { screw: "low", direction: "up", eighths: 1 },
      { screw: "choke", direction: "cw", eighths: 1 },
      { screw: "low", direction: "cw", eighths: 81 },
    ]) {
      const r = applyTuneEntry(state, e as TuneEntry);
      expect(r.ok, JSON.stringify(e)).toBe(false);
    }
    expect(startTune({ idle: { kind: "seated-then-out", eighths: 8 } }).ok).toBe(false);
    expect(startTune({ low: { kind: "seated-then-out", eighths: -1 } }).ok).toBe(false);
  });
});

describe("what a change means [common practice, no single source; the maker's manual overrides]", () => {
  it("mixture: counter-clockwise = out = richer, clockwise = in = leaner", () => {
    expect(describeEntry({ screw: "low", direction: "ccw", eighths: 2 }).meaning).toMatch(/^Out: richer low-speed/);
    expect(describeEntry({ screw: "low", direction: "cw", eighths: 2 }).meaning).toMatch(/^In: leaner low-speed/);
    const h = describeEntry({ screw: "high", direction: "cw", eighths: 1 });
    expect(h.meaning).toMatch(/leaner high-speed/);
    expect(h.warning).toMatch(/lean/i);
    expect(describeEntry({ screw: "high", direction: "ccw", eighths: 1 }).warning).toBeUndefined();
  });

  it("idle: clockwise = faster idle", () => {
    expect(describeEntry({ screw: "idle", direction: "cw", eighths: 4 }).meaning).toMatch(/^Faster idle/);
    expect(describeEntry({ screw: "idle", direction: "ccw", eighths: 4 }).meaning).toMatch(/^Slower idle/);
  });

  it("every meaning is marked as common practice that the manual overrides", () => {
    const e = describeEntry({ screw: "low", direction: "ccw", eighths: 10 });
    expect(e.summary).toBe("L screw 1 ¼ turns counter-clockwise (out)");
    expect(e.basis).toBe(MEANING_BASIS);
    expect(MEANING_BASIS).toMatch(/common practice/i);
    expect(MEANING_BASIS).toMatch(/manual overrides/);
  });
});
