import { describe, expect, it } from "vitest";
import fc from "fast-check";
import convertUnits from "convert-units";
import {
  convert,
  convertLength,
  convertPressure,
  convertSpeed,
  convertTemperature,
  convertTorque,
  convertVolume,
  exactFactor,
  formatDecimal,
  formatInchFraction,
  LENGTH_UNITS,
  nearestInchFraction,
  parseInches,
  parseInchesToMm,
  PRESSURE_UNITS,
  roundHalfUp,
  TORQUE_UNITS,
  VOLUME_UNITS,
  type LengthUnit,
  type PressureUnit,
  type VolumeUnit,
} from "@/lib/trade/units";

const rel = (a: number, b: number) => (b === 0 ? Math.abs(a) : Math.abs(a / b - 1));

describe("exact definitions", () => {
  it("inch and millimetre", () => {
    expect(convertLength(1, "in", "mm")).toBe(25.4); // [NIST exact] [16 CFR 500.19] 1 in = 25.4 mm
    expect(exactFactor("in", "mm")).toEqual({ numerator: 127n, denominator: 5n }); // [16 CFR 500.19] 25.4 = 127/5
    expect(convertLength(3 / 16, "in", "mm")).toBe(4.7625); // [NIST exact] 3/16 × 25.4 = 4.7625
    expect(convertLength(4.7625, "mm", "in")).toBe(0.1875); // [NIST exact] inverse of the above
    expect(convertLength(1, "ft", "m")).toBe(0.3048); // [NIST exact] 1 ft = 12 in = 0.3048 m
    expect(convertLength(10, "ft", "m")).toBe(3.048); // [NIST exact] 10 ft = 3.048 m (the "10 ft (3 m)" fueling distance)
  });

  it("US gallon and fluid ounce", () => {
    expect(convertVolume(1, "gal", "L")).toBe(3.785411784); // [NIST Handbook 44 App. C] 1 US gal = 3.785411784 L exactly
    expect(convertVolume(1, "fl-oz", "mL")).toBe(29.5735295625); // [NIST Handbook 44 App. C] 1 US fl oz = 29.5735295625 mL
    expect(convertVolume(1, "gal", "fl-oz")).toBe(128); // [NIST Handbook 44 App. C] 128 fl oz per gal
    expect(convertVolume(231, "in3", "gal")).toBe(1); // [NIST Handbook 44 App. C] 1 US gal = 231 in³
    expect(convertVolume(1, "cm3", "mL")).toBe(1); // [SI] 1 cm³ = 1 mL
  });

  it("pressure", () => {
    // [NIST SP 811 App. B, from memory] 1 psi = 6.894757293168 kPa (13 significant digits quoted)
    expect(rel(convertPressure(1, "psi", "kPa"), 6.894757293168)).toBeLessThan(1e-12);
    // [derived exactly] 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² = 6.894757293168361 kPa
    const f = exactFactor("psi", "kPa");
    expect(Number(f.numerator) / Number(f.denominator)).toBeCloseTo(6.894757293168361, 14);
    expect(convertPressure(1, "bar", "kPa")).toBe(100); // [SI exact] 1 bar = 100 kPa
    expect(rel(convertPressure(100, "psi", "bar"), 6.894757293168)).toBeLessThan(1e-12); // [NIST SP 811, from memory]
  });

  it("torque", () => {
    // [NIST SP 811 App. B, from memory] 1 lbf·in = 0.112984829 N·m (9 significant digits quoted)
    expect(rel(convertTorque(1, "lbf-in", "N-m"), 0.112984829)).toBeLessThan(5e-9);
    // [derived exactly] 1 lbf·ft = 12 lbf·in = 1.3558179483314004 N·m
    expect(convertTorque(1, "lbf-ft", "lbf-in")).toBe(12);
    expect(convertTorque(1, "lbf-ft", "N-m")).toBeCloseTo(1.3558179483314004, 14);
  });

  it("temperature", () => {
    expect(convertTemperature(212, "F", "C")).toBe(100); // [NIST exact] 212 °F = 100 °C
    expect(convertTemperature(32, "F", "C")).toBe(0); // [NIST exact] 32 °F = 0 °C
    expect(convertTemperature(-40, "C", "F")).toBe(-40); // [NIST exact] −40 is the same on both scales
    expect(convertTemperature(0, "C", "K")).toBe(273.15); // [SI exact] 0 °C = 273.15 K
  });

  it("speed", () => {
    expect(convertSpeed(3600, "rpm", "rps")).toBe(60); // [definition] 60 rpm = 1 rev/s
  });
});

describe("cross-check against convert-units@2 (independent reference library)", () => {
  // Tolerances are that library's own factor errors, measured against the exact definitions:
  // length in↔m 3.2e-8 (its m→ft anchor 3.28084), pressure psi↔kPa 3.9e-7 (anchor 0.00014503768078),
  // volume L↔fl oz 3.0e-9 (anchor 33.8140226); within one system its factors are exact (1e-12 here).
  const TOL = { length: 1e-7, pressure: 1e-6, volume: 1e-8, sameSystem: 1e-12 } as const;
  const cuName: Record<string, string> = { L: "l", mL: "ml" };
  const metric = new Set(["mm", "cm", "m", "kPa", "bar", "L", "mL"]);
  const tolFor = (dim: "length" | "pressure" | "volume", a: string, b: string) =>
    metric.has(a) === metric.has(b) ? TOL.sameSystem : TOL[dim];

  const value = fc.double({ min: 0.001, max: 1e5, noNaN: true });

  it.each([
    ["length", LENGTH_UNITS],
    ["pressure", PRESSURE_UNITS],
    ["volume", ["gal", "fl-oz", "L", "mL"] as const],
  ] as const)("%s: every pair of units agrees within the library's tolerance", (dim, units) => {
    const ours = (v: number, a: string, b: string) =>
      dim === "length"
        ? convertLength(v, a as LengthUnit, b as LengthUnit)
        : dim === "pressure"
          ? convertPressure(v, a as PressureUnit, b as PressureUnit)
          : convertVolume(v, a as VolumeUnit, b as VolumeUnit);
    for (const a of units) {
      for (const b of units) {
        fc.assert(
          fc.property(value, (v) => {
            const theirs = convertUnits(v).from(cuName[a] ?? a).to(cuName[b] ?? b);
            return rel(ours(v, a, b), theirs) <= tolFor(dim, a, b);
          }),
          { numRuns: 50 },
        );
      }
    }
  });

  it("a deliberately wrong factor would be caught by the tolerance", () => {
    // guard that the cross-check can fail: 25.41 mm/in is 4e-4 off, far outside 1e-7
    expect(rel(1 * 25.41, convertUnits(1).from("in").to("mm"))).toBeGreaterThan(1e-7);
  });

  it("temperature agrees (°F ↔ °C) within 1e-9 degree", () => {
    fc.assert(
      fc.property(fc.double({ min: -100, max: 1000, noNaN: true }), (f) => {
        return Math.abs(convertTemperature(f, "F", "C") - convertUnits(f).from("F").to("C")) < 1e-9;
      }),
    );
  });

  it("torque agrees with lb→kg × g × in→m from convert-units, within 1e-6 (its lb anchor is 8.2e-7 off)", () => {
    const lbfInNm = convertUnits(1).from("lb").to("kg") * 9.80665 * convertUnits(1).from("in").to("m");
    expect(rel(convertTorque(1, "lbf-in", "N-m"), lbfInNm)).toBeLessThan(1e-6);
  });

  it("rpm agrees with convert-units' frequency rpm → Hz (rev/s), exactly", () => {
    expect(convertSpeed(1800, "rpm", "rps")).toBe(convertUnits(1800).from("rpm").to("Hz"));
  });
});

describe("there and back (property)", () => {
  const v = fc.double({ min: 1e-6, max: 1e9, noNaN: true });
  const within = (a: number, b: number) => rel(a, b) <= 1e-15; // a few ulps of round-off, no more

  it("length", () => {
    fc.assert(
      fc.property(v, fc.constantFrom(...LENGTH_UNITS), fc.constantFrom(...LENGTH_UNITS), (x, a, b) =>
        within(convertLength(convertLength(x, a, b), b, a), x),
      ),
    );
  });
  it("pressure", () => {
    fc.assert(
      fc.property(v, fc.constantFrom(...PRESSURE_UNITS), fc.constantFrom(...PRESSURE_UNITS), (x, a, b) =>
        within(convertPressure(convertPressure(x, a, b), b, a), x),
      ),
    );
  });
  it("torque", () => {
    fc.assert(
      fc.property(v, fc.constantFrom(...TORQUE_UNITS), fc.constantFrom(...TORQUE_UNITS), (x, a, b) =>
        within(convertTorque(convertTorque(x, a, b), b, a), x),
      ),
    );
  });
  it("volume", () => {
    fc.assert(
      fc.property(v, fc.constantFrom(...VOLUME_UNITS), fc.constantFrom(...VOLUME_UNITS), (x, a, b) =>
        within(convertVolume(convertVolume(x, a, b), b, a), x),
      ),
    );
  });
  it("temperature (absolute 1e-9 degree)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -273.15, max: 5000, noNaN: true }),
        fc.constantFrom("F" as const, "C" as const, "K" as const),
        fc.constantFrom("F" as const, "C" as const, "K" as const),
        (x, a, b) => Math.abs(convertTemperature(convertTemperature(x, a, b), b, a) - x) < 1e-9,
      ),
    );
  });
  it("every n/64 in up to 4 in maps to mm and back exactly", () => {
    // [NIST exact] n/64 in × 127 is exact in binary before the single division by 5
    for (let n = 0; n <= 64 * 4; n++) {
      const mm = convertLength(n / 64, "in", "mm");
      expect(convertLength(mm, "mm", "in")).toBe(n / 64);
    }
  });
});

describe("fractions of an inch", () => {
  it("parses the ways a length is written at the bench", () => {
    expect(parseInches("3/16")).toEqual({ ok: true, value: 0.1875 });
    expect(parseInches("3/16 in")).toEqual({ ok: true, value: 0.1875 });
    expect(parseInches('3/16"')).toEqual({ ok: true, value: 0.1875 });
    expect(parseInches("1 1/4")).toEqual({ ok: true, value: 1.25 });
    expect(parseInches("1-1/4 in")).toEqual({ ok: true, value: 1.25 });
    expect(parseInches(".25in")).toEqual({ ok: true, value: 0.25 });
    expect(parseInchesToMm("3/16 in")).toEqual({ ok: true, value: 4.7625 }); // [NIST exact] 3/16 in = 4.7625 mm
    expect(parseInchesToMm("1/4")).toEqual({ ok: true, value: 6.35 }); // [NIST exact] 1/4 in = 6.35 mm
  });

  it("refuses what it cannot read, with a message", () => {
    for (const bad of ["", "abc", "3/0", "1 5/4", "3//16", "-1/4"]) {
      const r = parseInches(bad);
      expect(r.ok, bad).toBe(false);
      if (!r.ok) expect(r.message.length).toBeGreaterThan(10);
    }
  });

  it("formats to the nearest reduced 1/64", () => {
    expect(formatInchFraction(0.1875)).toBe("3/16 in");
    expect(formatInchFraction(convertLength(4.7625, "mm", "in"))).toBe("3/16 in"); // [NIST exact]
    expect(formatInchFraction(1.25)).toBe("1 1/4 in");
    expect(formatInchFraction(2)).toBe("2 in");
    expect(formatInchFraction(0)).toBe("0 in");
    expect(formatInchFraction(convertLength(5, "mm", "in"))).toBe("≈ 13/64 in"); // 5 mm = 0.19685 in = 12.6/64
    expect(nearestInchFraction(0.999)).toMatchObject({ whole: 1, numerator: 0, exact: false });
  });

  it("common fuel-line sizes round-trip through text [common practice, no single source: 3/32, 1/8, 3/16, 1/4 in]", () => {
    for (const t of ["3/32", "1/8", "3/16", "1/4"]) {
      const r = parseInches(t);
      expect(r.ok).toBe(true);
      if (r.ok) expect(formatInchFraction(r.value)).toBe(`${t} in`);
    }
  });
});

describe("convert() for unit pickers", () => {
  it("converts by unit name and refuses mismatches", () => {
    expect(convert(1, "in", "mm")).toEqual({ ok: true, value: 25.4 }); // [NIST exact]
    expect(convert(1, "in", "psi").ok).toBe(false);
    expect(convert(1, "furlong", "mm").ok).toBe(false);
    expect(convert(Number.NaN, "in", "mm").ok).toBe(false);
  });
});

describe("decimal display rounding", () => {
  it("rounds half up on the decimal digits", () => {
    expect(roundHalfUp(2.56, 1)).toBe(2.6); // [REFERENCES worked value] charts print 2.56 fl oz as 2.6
    expect(roundHalfUp(2.55, 1)).toBe(2.6); // 2.55 is stored as 2.5499…; on paper it rounds up
    expect(roundHalfUp(1.005, 2)).toBe(1.01);
    expect(roundHalfUp(-2.5, 0)).toBe(-3);
    expect(formatDecimal(4.7625, 4)).toBe("4.7625");
    expect(formatDecimal(3.2, 2)).toBe("3.2");
    expect(formatDecimal(3, 2, 1)).toBe("3.0");
    expect(formatDecimal(1e-12, 2)).toBe("0");
  });
});
