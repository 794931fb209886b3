import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  ANSI_C84_1_RANGE_A,
  checkCompression,
  checkHertz,
  checkPlugGap,
  checkRpm,
  checkVolts,
  compareToBand,
  DEFAULT_COMPRESSION_BAND_PSI,
  displacementCm3,
  displacementFrom,
  generatorHz,
  type ReadingCheck,
} from "@/lib/trade/readings";
import { convertPressure } from "@/lib/trade/units";
import type { Result } from "@/lib/trade/result";

const value = (r: Result<ReadingCheck>): ReadingCheck => {
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

describe("band comparison", () => {
  it("is inclusive and three-way", () => {
    const band = { min: 10, max: 20 };
    expect([9.99, 10, 15, 20, 20.01].map((v) => compareToBand(v, band))).toEqual(["low", "within", "within", "within", "high"]);
  });
  it("property: exactly one verdict, consistent with the limits", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: -2e6, max: 2e6, noNaN: true }), (a, b, x) => {
        const band = { min: Math.min(a, b), max: Math.max(a, b) };
        const v = compareToBand(x, band);
        if (v === "low") return x < band.min;
        if (v === "high") return x > band.max;
        return x >= band.min - 1e-9 * Math.max(1, Math.abs(band.min), Math.abs(band.max)) && x <= band.max + 1e-9 * Math.max(1, Math.abs(band.min), Math.abs(band.max));
      }),
    );
  });
});

describe("compression", () => {
  it("default band is 100–150 psi and only a soft warning [common practice, no single source]", () => {
    expect(DEFAULT_COMPRESSION_BAND_PSI).toEqual({ min: 100, max: 150 }); // [common practice] REFERENCES "commonly quoted near 100–150 psi"
    const low = value(checkCompression({ reading: 85, unit: "psi" }));
    expect(low).toMatchObject({ verdict: "low", basis: "common-practice", soft: true });
    expect(low.message).toMatch(/common practice/);
    expect(value(checkCompression({ reading: 125, unit: "psi" })).verdict).toBe("within");
  });

  it("owner band is a hard spec; a kPa gauge is compared in kPa", () => {
    const band = { min: 110, max: 160 };
    const r = value(checkCompression({ reading: 700, unit: "kPa", ownerBandPsi: band }));
    // [NIST SP 811, from memory] 110 psi = 758.42 kPa, so 700 kPa is low
    expect(r).toMatchObject({ verdict: "low", basis: "owner-spec", soft: false, unit: "kPa" });
    expect(r.band.min).toBeCloseTo(758.423, 3);
    // a reading typed exactly on the limit in the other unit is within, never flipped by rounding
    const edge = value(checkCompression({ reading: convertPressure(110, "psi", "kPa"), unit: "kPa", ownerBandPsi: band }));
    expect(edge.verdict).toBe("within");
    expect(value(checkCompression({ reading: 11.5, unit: "bar", ownerBandPsi: band })).verdict).toBe("high"); // 11.5 bar = 166.8 psi
  });

  it("bad readings and bands come back as messages", () => {
    expect(checkCompression({ reading: Number.NaN, unit: "psi" }).ok).toBe(false);
    expect(checkCompression({ reading: -5, unit: "psi" }).ok).toBe(false);
    expect(checkCompression({ reading: 100, unit: "psi", ownerBandPsi: { min: 150, max: 100 } }).ok).toBe(false);
  });
});

describe("spark plug gap", () => {
  it("in vs mm spec: 0.020 in = 0.508 mm is within 0.50–0.65 mm [NIST exact] [common practice for the band]", () => {
    const r = value(checkPlugGap({ reading: 0.02, unit: "in", spec: { min: 0.5, max: 0.65, unit: "mm" } }));
    expect(r.verdict).toBe("within");
    expect(value(checkPlugGap({ reading: 0.03, unit: "in", spec: { min: 0.5, max: 0.65, unit: "mm" } })).verdict).toBe("high");
    expect(value(checkPlugGap({ reading: 0.45, unit: "mm", spec: { min: 0.02, max: 0.026, unit: "in" } })).verdict).toBe("low");
  });
  it("nominal ± tolerance; exactly 0.030 in against 0.76 mm ± 0.05 [common practice: 0.030 in for small four-strokes]", () => {
    // [NIST exact] 0.030 in = 0.762 mm, inside 0.71–0.81 mm
    expect(value(checkPlugGap({ reading: 0.03, unit: "in", spec: { nominal: 0.76, tolerance: 0.05, unit: "mm" } })).verdict).toBe("within");
    // exactly on a limit expressed in another unit: 0.508 mm vs min 0.020 in
    expect(value(checkPlugGap({ reading: 0.508, unit: "mm", spec: { min: 0.02, max: 0.026, unit: "in" } })).verdict).toBe("within");
  });
  it("refuses a bad spec", () => {
    expect(checkPlugGap({ reading: 0.5, unit: "mm", spec: { nominal: 0, tolerance: 0.1, unit: "mm" } }).ok).toBe(false);
    expect(checkPlugGap({ reading: 0.5, unit: "mm", spec: { min: 0.7, max: 0.6, unit: "mm" } }).ok).toBe(false);
  });
});

describe("engine speed", () => {
  it("rpm vs the procedure's window (owner-set)", () => {
    const window = { min: 2700, max: 3300 };
    expect(value(checkRpm({ reading: 2500, window })).verdict).toBe("low");
    expect(value(checkRpm({ reading: 3000, window }))).toMatchObject({ verdict: "within", soft: false });
    expect(value(checkRpm({ reading: 3400, window })).verdict).toBe("high");
    expect(checkRpm({ reading: -1, window }).ok).toBe(false);
  });
});

describe("generator output", () => {
  it("120 V nominal uses ANSI C84.1 Range A 114–126 V [from memory, confirm before citing]", () => {
    expect(ANSI_C84_1_RANGE_A[120]).toEqual({ min: 114, max: 126 }); // [ANSI C84.1 Range A, from memory]
    expect(ANSI_C84_1_RANGE_A[240]).toEqual({ min: 228, max: 252 }); // [ANSI C84.1 Range A, from memory]
    const low = value(checkVolts({ reading: 112, nominal: 120 }));
    expect(low).toMatchObject({ verdict: "low", basis: "standard-from-memory", soft: true });
    expect(low.message).toMatch(/from memory: confirm before citing/);
    expect(value(checkVolts({ reading: 126, nominal: 120 })).verdict).toBe("within");
    expect(value(checkVolts({ reading: 126.5, nominal: 120 })).verdict).toBe("high");
  });
  it("other nominals need an owner band", () => {
    expect(checkVolts({ reading: 230, nominal: 230 }).ok).toBe(false);
    expect(value(checkVolts({ reading: 230, nominal: 230, ownerBand: { min: 216, max: 244 } })).verdict).toBe("within");
  });
  it("hertz vs 60 or 50 nominal; default window ± 5 % is soft [common practice, no single source]", () => {
    expect(value(checkHertz({ reading: 62.5, nominal: 60 }))).toMatchObject({ verdict: "within", soft: true, basis: "common-practice" });
    expect(value(checkHertz({ reading: 64, nominal: 60 })).verdict).toBe("high");
    expect(value(checkHertz({ reading: 47, nominal: 50 })).verdict).toBe("low");
    expect(value(checkHertz({ reading: 61.8, nominal: 60, ownerWindow: { min: 59, max: 61.5 } }))).toMatchObject({ verdict: "high", soft: false });
  });
  it("synchronous speed: f = rpm × poles / 120 [physics, standard formula]", () => {
    expect(generatorHz(3600)).toBe(60);
    expect(generatorHz(3000)).toBe(50);
    expect(generatorHz(1800, 4)).toBe(60);
  });
});

describe("displacement", () => {
  it("60 mm bore × 43 mm stroke → 121.58 cm³ [REFERENCES worked value]", () => {
    const r = displacementCm3(60, 43);
    expect(r.ok && Math.round(r.value * 100) / 100).toBe(121.58);
  });
  it("from inches: 2 in × 2 in → π × 2 in³ = 102.96 cm³ [NIST exact for in³ → cm³]", () => {
    const r = displacementFrom(2, 2, "in");
    expect(r.ok && r.value).toBeCloseTo(Math.PI * 2 * 16.387064, 9);
  });
  it("refuses non-positive sizes", () => {
    expect(displacementCm3(0, 43).ok).toBe(false);
    expect(displacementCm3(60, Number.NaN).ok).toBe(false);
    expect(displacementCm3(60, 43, 0).ok).toBe(false);
  });
});
