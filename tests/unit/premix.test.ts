import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  chartDisplay,
  ETHANOL_BLENDS,
  ETHANOL_MAX_PERCENT_SMALL_ENGINES,
  ETHANOL_SOURCES,
  ethanolVerdict,
  oilForGasoline,
  premixChart,
  PREMIX_UNITS,
  ratioOfMix,
  type PremixUnit,
} from "@/lib/trade/premix";
import { convertVolume } from "@/lib/trade/units";

function oil(value: number, unit: PremixUnit, ratio: number, oilUnit: PremixUnit) {
  const r = oilForGasoline({ value, unit }, ratio, oilUnit);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

describe("oil for gasoline at R:1 — worked values", () => {
  // [REFERENCES worked value] exact arithmetic, oil = gasoline ÷ R
  it.each([
    [25, 5.12, 40],
    [32, 4.0, 31.25],
    [40, 3.2, 25],
    [50, 2.56, 20],
  ])("%i:1 → %f US fl oz per US gal and %f mL per L", (ratio, flozPerGal, mlPerL) => {
    expect(oil(1, "gal", ratio, "fl-oz").oil.value).toBeCloseTo(flozPerGal, 12);
    expect(oil(1, "L", ratio, "mL").oil.value).toBeCloseTo(mlPerL, 12);
  });

  it("larger batches", () => {
    expect(oil(2.5, "gal", 50, "fl-oz").oil.value).toBeCloseTo(6.4, 12); // [REFERENCES worked value] 2.5 gal at 50:1 → 6.4 fl oz
    expect(oil(5, "L", 50, "mL").oil.value).toBeCloseTo(100, 12); // [REFERENCES worked value] 5 L at 50:1 → 100 mL
  });

  it("R:1 means gasoline ÷ R, not ÷ (R + 1): 50:1 is 2 % of the gasoline", () => {
    const r = oil(1, "gal", 50, "fl-oz");
    expect(r.percentOfGasoline).toBe(2); // [REFERENCES, read] 50:1 = 2 %
    expect(r.oil.value).not.toBeCloseTo(128 / 51, 3); // the ÷ (R + 1) mistake would give 2.51
  });

  it("mixed units: 1 US gal of fuel at 50:1, answer in mL", () => {
    // [NIST Handbook 44 App. C] 3785.411784 mL / 50 = 75.70823568 mL
    const r = oil(1, "gal", 50, "mL");
    expect(r.oil.value).toBeCloseTo(75.70823568, 10);
    expect(r.display).toBe("76 mL");
  });

  it("keeps the exact value and rounds only the display, like printed charts", () => {
    const r = oil(1, "gal", 50, "fl-oz");
    expect(r.oil.value).toBe(2.56); // exact kept
    expect(r.display).toBe("2.6 US fl oz"); // [REFERENCES worked value] printed charts round 2.56 to 2.6
    expect(oil(1, "gal", 25, "fl-oz").display).toBe("5.1 US fl oz");
    expect(oil(1, "L", 32, "mL").display).toBe("31 mL");
    expect(chartDisplay(2.5, "mL")).toBe("2.5 mL");
    expect(chartDisplay(0.0156, "L")).toBe("0.02 L");
  });

  it("the chart table holds the worked values", () => {
    const chart = premixChart();
    const row50 = chart.find((r) => r.ratio === 50);
    expect(row50?.cells.map((c) => c.display)).toEqual(["2.6 US fl oz", "6.4 US fl oz", "20 mL", "100 mL"]); // [REFERENCES worked value]
  });
});

describe("ratio of a mix", () => {
  it("oil + gasoline → R", () => {
    const r = ratioOfMix({ value: 2.56, unit: "fl-oz" }, { value: 1, unit: "gal" });
    expect(r.ok && r.value.ratio).toBeCloseTo(50, 12); // [REFERENCES worked value] 2.56 fl oz in 1 gal = 50:1
    expect(r.ok && r.value.display).toBe("50:1");
    const chartRounded = ratioOfMix({ value: 2.6, unit: "fl-oz" }, { value: 1, unit: "gal" });
    expect(chartRounded.ok && chartRounded.value.display).toBe("49.2:1"); // 128 / 2.6 = 49.23
    const metric = ratioOfMix({ value: 100, unit: "mL" }, { value: 5, unit: "L" });
    expect(metric.ok && metric.value.ratio).toBeCloseTo(50, 12); // [REFERENCES worked value] 100 mL in 5 L
  });

  it("property: oil for R, then the ratio of that mix, gives R back (any units)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 50, noNaN: true }),
        fc.constantFrom(...PREMIX_UNITS),
        fc.constantFrom(...PREMIX_UNITS),
        fc.double({ min: 10, max: 120, noNaN: true }),
        (amount, gasUnit, oilUnit, ratio) => {
          const o = oilForGasoline({ value: amount, unit: gasUnit }, ratio, oilUnit);
          if (!o.ok) return false;
          const back = ratioOfMix(o.value.oil, { value: amount, unit: gasUnit });
          return back.ok && Math.abs(back.value.ratio / ratio - 1) < 1e-12;
        },
      ),
    );
  });

  it("property: the oil amount converted to another unit equals asking in that unit", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 50, noNaN: true }),
        fc.constantFrom(...PREMIX_UNITS),
        fc.constantFrom(...PREMIX_UNITS),
        fc.constantFrom(...PREMIX_UNITS),
        fc.integer({ min: 16, max: 100 }),
        (amount, gasUnit, u1, u2, ratio) => {
          const a = oil(amount, gasUnit, ratio, u1).oil.value;
          const b = oil(amount, gasUnit, ratio, u2).oil.value;
          return Math.abs(convertVolume(a, u1, u2) / b - 1) < 1e-12;
        },
      ),
    );
  });
});

describe("input errors come back as messages", () => {
  it("refuses impossible input without throwing", () => {
    const bad = [
      oilForGasoline({ value: 0, unit: "gal" }, 50, "fl-oz"),
      oilForGasoline({ value: Number.NaN, unit: "gal" }, 50, "fl-oz"),
      oilForGasoline({ value: 1, unit: "gal" }, 0, "fl-oz"),
      oilForGasoline({ value: 1, unit: "quart" as PremixUnit }, 50, "fl-oz"),
      ratioOfMix({ value: 0, unit: "mL" }, { value: 1, unit: "L" }),
    ];
    for (const r of bad) {
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message).toMatch(/\w{3,}/);
    }
  });

  it("warns (softly) about ratios outside the usual range [common practice, no single source]", () => {
    expect(oil(1, "gal", 50, "fl-oz").warnings).toEqual([]);
    expect(oil(1, "gal", 8, "fl-oz").warnings).toHaveLength(1);
    expect(oil(1, "gal", 150, "fl-oz").warnings).toHaveLength(1);
  });
});

describe("ethanol guidance", () => {
  it("E10 is the most a small engine may take; E15, E20, E85 never", () => {
    expect(ETHANOL_MAX_PERCENT_SMALL_ENGINES).toBe(10); // [40 CFR 80.1504(a)(1)] more than 10 % ethanol prohibited in nonroad engines
    const allowed = Object.fromEntries(ETHANOL_BLENDS.map((b) => [b.label, b.allowed]));
    expect(allowed).toEqual({ E0: true, E10: true, E15: false, E20: false, E85: false }); // [NC State Extension AG-763W]
    const allowedAt = (p: number) => {
      const r = ethanolVerdict(p);
      if (!r.ok) throw new Error(r.message);
      return r.value.allowed;
    };
    expect(allowedAt(0)).toBe(true);
    expect(allowedAt(10)).toBe(true); // [40 CFR 80.1504(a)(1)] up to 10 % is allowed
    expect(allowedAt(10.5)).toBe(false); // [40 CFR 80.1504(a)(1)] "more than 10 %"
    expect(allowedAt(15)).toBe(false); // [US DOE AFDC E15 page] chain saws, mowers prohibited from E15
    expect(allowedAt(85)).toBe(false); // [NC State Extension AG-763W] never E85
    expect(ethanolVerdict(-1).ok).toBe(false);
    expect(ethanolVerdict(Number.NaN).ok).toBe(false);
  });

  it("names its sources", () => {
    const sources = ETHANOL_SOURCES.map((s) => s.source).join(" | ");
    expect(sources).toContain("40 CFR 80.1504(a)(1)");
    expect(sources).toContain("part 1090");
    expect(sources).toContain("AG-763W");
  });
});
