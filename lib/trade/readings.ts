/**
 * Bench readings against a spec band: low / within / high, with a message and the basis of the band.
 *
 * Bands are inclusive at both ends. Comparisons are made after converting to one unit and allow a
 * relative slack of 1e-9 so a reading typed exactly on a limit in another unit (0.020 in vs 0.508 mm)
 * is "within" and never flips on binary rounding.
 *
 * Basis of a band:
 * - "owner-spec": set by the shop on the procedure (hard pass/fail);
 * - "standard-from-memory": a published standard recalled from memory (confirm before citing);
 * - "common-practice": a fact of the trade with no single source (soft warning only).
 */
import { err, ok, type Result } from "./result";
import {
  convertLength,
  convertPressure,
  formatDecimal,
  UNIT_LABELS,
  type LengthUnit,
  type PressureUnit,
} from "./units";

export type Verdict = "low" | "within" | "high";
export type BandBasis = "owner-spec" | "standard-from-memory" | "common-practice";
export type Band = { min: number; max: number };

export type ReadingCheck = {
  verdict: Verdict;
  message: string;
  /** The band used, in `unit`. */
  band: Band;
  unit: string;
  basis: BandBasis;
  /** Soft: show as a warning, never as a failed step. */
  soft: boolean;
  source?: string;
};

const SLACK = 1e-9;

function validBand(band: Band, what: string): string | undefined {
  if (!Number.isFinite(band.min) || !Number.isFinite(band.max)) return `Set both limits of the ${what} band.`;
  if (band.min > band.max) return `The ${what} band's low limit is above its high limit.`;
  return undefined;
}

/** Compare a value with an inclusive band: "low" | "within" | "high". */
export function compareToBand(value: number, band: Band): Verdict {
  const tol = SLACK * Math.max(1, Math.abs(band.min), Math.abs(band.max));
  if (value < band.min - tol) return "low";
  if (value > band.max + tol) return "high";
  return "within";
}

const fmt = (v: number, unitLabel: string, decimals: number) => `${formatDecimal(v, decimals)} ${unitLabel}`;

function checkAgainst(
  value: number,
  band: Band,
  opts: { what: string; unitLabel: string; decimals: number; basis: BandBasis; source?: string },
): ReadingCheck {
  const verdict = compareToBand(value, band);
  const range = `${formatDecimal(band.min, opts.decimals)}–${fmt(band.max, opts.unitLabel, opts.decimals)}`;
  const reading = fmt(value, opts.unitLabel, opts.decimals);
  const soft = opts.basis !== "owner-spec";
  const where =
    verdict === "within" ? `within ${range}` : verdict === "low" ? `below ${range}` : `above ${range}`;
  const suffix =
    opts.basis === "common-practice"
      ? " (typical range, common practice; set the spec on the procedure)"
      : opts.basis === "standard-from-memory"
        ? ` (${opts.source ?? "published standard"}, from memory: confirm before citing)`
        : "";
  return {
    verdict,
    message: `${opts.what} ${reading} is ${where}${suffix}.`,
    band,
    unit: opts.unitLabel,
    basis: opts.basis,
    soft,
    ...(opts.source ? { source: opts.source } : {}),
  };
}

function needNumber(value: number, what: string): string | undefined {
  return Number.isFinite(value) ? undefined : `Enter the ${what} as a number.`;
}

// ---- Compression --------------------------------------------------------------------------------

/** Commonly quoted healthy compression for small two-strokes (common practice, soft band). */
export const DEFAULT_COMPRESSION_BAND_PSI: Band = { min: 100, max: 150 };

/**
 * Compression gauge reading (psi or kPa) vs the procedure's band in psi. With no owner band the
 * default 100–150 psi is used as a soft band: a warning, never a failed step.
 */
export function checkCompression(input: {
  reading: number;
  unit: PressureUnit;
  ownerBandPsi?: Band;
}): Result<ReadingCheck> {
  const bad = needNumber(input.reading, "compression reading");
  if (bad) return err(bad);
  if (input.reading < 0) return err("A compression gauge reading cannot be below 0.");
  if (input.ownerBandPsi) {
    const badBand = validBand(input.ownerBandPsi, "compression");
    if (badBand) return err(badBand);
  }
  const band = input.ownerBandPsi ?? DEFAULT_COMPRESSION_BAND_PSI;
  const basis: BandBasis = input.ownerBandPsi ? "owner-spec" : "common-practice";
  const bandInUnit: Band = {
    min: convertPressure(band.min, "psi", input.unit),
    max: convertPressure(band.max, "psi", input.unit),
  };
  return ok(
    checkAgainst(input.reading, bandInUnit, {
      what: "Compression",
      unitLabel: UNIT_LABELS[input.unit],
      decimals: input.unit === "bar" ? 2 : 0,
      basis,
    }),
  );
}

// ---- Spark plug gap -----------------------------------------------------------------------------

/** Typical plug gaps (common practice, no single source); the plug or engine maker's spec wins. */
export const TYPICAL_PLUG_GAPS = [
  { engine: "small two-stroke", bandMm: { min: 0.5, max: 0.65 }, bandIn: { min: 0.02, max: 0.026 } },
  { engine: "small four-stroke mower", nominalMm: 0.76, nominalIn: 0.03 },
] as const;

export type GapSpec = { min: number; max: number; unit: "in" | "mm" } | { nominal: number; tolerance: number; unit: "in" | "mm" };

/** Plug gap reading vs spec; reading and spec may be in different units (in / mm). */
export function checkPlugGap(input: { reading: number; unit: "in" | "mm"; spec: GapSpec }): Result<ReadingCheck> {
  const bad = needNumber(input.reading, "plug gap");
  if (bad) return err(bad);
  if (input.reading < 0) return err("A plug gap cannot be below 0.");
  const s = input.spec;
  let band: Band;
  if ("nominal" in s) {
    if (!Number.isFinite(s.nominal) || !Number.isFinite(s.tolerance) || s.nominal <= 0 || s.tolerance < 0) {
      return err("Set the plug gap spec: a nominal gap above 0 and a tolerance of 0 or more.");
    }
    band = { min: s.nominal - s.tolerance, max: s.nominal + s.tolerance };
  } else {
    band = { min: s.min, max: s.max };
  }
  const badBand = validBand(band, "plug gap");
  if (badBand) return err(badBand);
  const toReading = (v: number) => convertLength(v, s.unit as LengthUnit, input.unit);
  return ok(
    checkAgainst(
      input.reading,
      { min: toReading(band.min), max: toReading(band.max) },
      { what: "Plug gap", unitLabel: UNIT_LABELS[input.unit], decimals: input.unit === "in" ? 3 : 2, basis: "owner-spec" },
    ),
  );
}

// ---- Engine speed -------------------------------------------------------------------------------

/** Engine speed (rpm, e.g. from a tachometer) vs the procedure's window. */
export function checkRpm(input: { reading: number; window: Band }): Result<ReadingCheck> {
  const bad = needNumber(input.reading, "engine speed");
  if (bad) return err(bad);
  if (input.reading < 0) return err("Engine speed cannot be below 0 rpm.");
  const badBand = validBand(input.window, "rpm");
  if (badBand) return err(badBand);
  return ok(checkAgainst(input.reading, input.window, { what: "Engine speed", unitLabel: "rpm", decimals: 0, basis: "owner-spec" }));
}

// ---- Generator output ---------------------------------------------------------------------------

/**
 * ANSI C84.1 Range A service voltage for 120 V and 240 V nominal: ±5 % (114–126 V, 228–252 V).
 * From memory: confirm against the standard before citing.
 */
export const ANSI_C84_1_RANGE_A: Readonly<Record<120 | 240, Band>> = {
  120: { min: 114, max: 126 },
  240: { min: 228, max: 252 },
};
export const ANSI_C84_1_SOURCE = "ANSI C84.1 Range A";

/** Generator output voltage vs nominal. 120 / 240 V default to ANSI C84.1 Range A; other nominals need an owner band. */
export function checkVolts(input: { reading: number; nominal: number; ownerBand?: Band }): Result<ReadingCheck> {
  const bad = needNumber(input.reading, "voltage");
  if (bad) return err(bad);
  if (input.reading < 0) return err("Enter the voltage as a positive number (AC RMS).");
  if (input.ownerBand) {
    const badBand = validBand(input.ownerBand, "voltage");
    if (badBand) return err(badBand);
    return ok(checkAgainst(input.reading, input.ownerBand, { what: "Output", unitLabel: "V", decimals: 1, basis: "owner-spec" }));
  }
  const std = input.nominal === 120 || input.nominal === 240 ? ANSI_C84_1_RANGE_A[input.nominal] : undefined;
  if (!std) return err(`No standard band is built in for ${input.nominal} V nominal: set the band on the procedure.`);
  return ok(
    checkAgainst(input.reading, std, {
      what: "Output",
      unitLabel: "V",
      decimals: 1,
      basis: "standard-from-memory",
      source: ANSI_C84_1_SOURCE,
    }),
  );
}

/** Default frequency window: nominal ± 5 % (common practice for portable generators, no single source). */
export const DEFAULT_HZ_WINDOW_FRACTION = 0.05;

/** Generator frequency vs 60 Hz or 50 Hz nominal, owner-set window or the soft ± 5 % default. */
export function checkHertz(input: { reading: number; nominal: 50 | 60; ownerWindow?: Band }): Result<ReadingCheck> {
  const bad = needNumber(input.reading, "frequency");
  if (bad) return err(bad);
  if (input.nominal !== 50 && input.nominal !== 60) return err("Nominal frequency must be 50 Hz or 60 Hz.");
  if (input.reading < 0) return err("Frequency cannot be below 0 Hz.");
  if (input.ownerWindow) {
    const badBand = validBand(input.ownerWindow, "frequency");
    if (badBand) return err(badBand);
    return ok(checkAgainst(input.reading, input.ownerWindow, { what: "Frequency", unitLabel: "Hz", decimals: 1, basis: "owner-spec" }));
  }
  const d = input.nominal * DEFAULT_HZ_WINDOW_FRACTION;
  return ok(
    checkAgainst(
      input.reading,
      { min: input.nominal - d, max: input.nominal + d },
      { what: "Frequency", unitLabel: "Hz", decimals: 1, basis: "common-practice" },
    ),
  );
}

/** Output frequency of a synchronous generator: f = rpm × poles / 120 (2-pole at 3600 rpm → 60 Hz). */
export function generatorHz(rpm: number, poles = 2): number {
  if (!Number.isInteger(poles) || poles < 2 || poles % 2 !== 0) throw new RangeError("poles must be an even integer ≥ 2");
  return (rpm * poles) / 120;
}

// ---- Displacement -------------------------------------------------------------------------------

/** Swept volume of one cylinder in cm³ from bore and stroke in mm: π/4 · b² · s / 1000. */
export function displacementCm3(boreMm: number, strokeMm: number, cylinders = 1): Result<number> {
  if (!Number.isFinite(boreMm) || boreMm <= 0) return err("Enter the bore in mm as a number above 0.");
  if (!Number.isFinite(strokeMm) || strokeMm <= 0) return err("Enter the stroke in mm as a number above 0.");
  if (!Number.isInteger(cylinders) || cylinders < 1) return err("Cylinders must be a whole number, at least 1.");
  return ok(((Math.PI / 4) * boreMm * boreMm * strokeMm * cylinders) / 1000);
}

/** Same, from bore and stroke in any length unit. */
export function displacementFrom(bore: number, stroke: number, unit: LengthUnit, cylinders = 1): Result<number> {
  return displacementCm3(convertLength(bore, unit, "mm"), convertLength(stroke, unit, "mm"), cylinders);
}
