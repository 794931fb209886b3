/**
 * Unit conversions for the bench, built from exact definitions.
 *
 * Every unit's size is stored as an exact rational (BigInt numerator/denominator) in a base
 * unit of its dimension. A conversion reduces the ratio of the two sizes to lowest terms and
 * computes `value * n / d` in floating point, so a conversion whose product is exactly
 * representable (e.g. 3/16 in → mm: 0.1875 × 127 / 5) gives the correctly rounded result.
 *
 * Definitions:
 * - 1 in = 25.4 mm exactly (international yard and pound, 1959; 16 CFR 500.19).
 * - 1 lb = 0.45359237 kg exactly; standard gravity g = 9.80665 m/s² exactly, so
 *   1 lbf = 4.4482216152605 N exactly (NIST SP 811 App. B).
 * - 1 psi = 1 lbf / in² = 6894.757293168… Pa; 1 bar = 100 kPa exactly.
 * - 1 US gal = 231 in³ = 3.785411784 L exactly; 1 US fl oz = 1/128 US gal (NIST Handbook 44 App. C).
 * - °F = °C × 9/5 + 32; K = °C + 273.15.
 */
import { err, ok, type Result } from "./result";

type Rational = readonly [bigint, bigint];

const gcd = (a: bigint, b: bigint): bigint => {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
};

/** Parse an exact decimal literal ("25.4", "3.785411784") into a rational. */
const dec = (literal: string): Rational => {
  const [whole = "0", frac = ""] = literal.split(".");
  const n = BigInt(whole + frac);
  const d = 10n ** BigInt(frac.length);
  const g = gcd(n, d);
  return [n / g, d / g];
};
const mul = (...rs: Rational[]): Rational => {
  let n = 1n;
  let d = 1n;
  for (const [a, b] of rs) {
    n *= a;
    d *= b;
  }
  const g = gcd(n, d);
  return [n / g, d / g];
};
const div = (a: Rational, b: Rational): Rational => mul(a, [b[1], b[0]]);
const int = (n: number): Rational => [BigInt(n), 1n];

// ---- Exact defining constants -------------------------------------------------------------
/** 1 in in millimetres, exact (16 CFR 500.19). */
export const MM_PER_INCH = 25.4;
/** 1 lb (avoirdupois) in kilograms, exact. */
export const KG_PER_POUND = 0.45359237;
/** Standard acceleration of gravity, m/s², exact (by definition). */
export const STANDARD_GRAVITY = 9.80665;
/** 1 US gallon in litres, exact (231 in³). */
export const LITRES_PER_US_GALLON = 3.785411784;
/** 1 US fluid ounce in millilitres, exact (1/128 US gal). */
export const ML_PER_US_FL_OZ = 29.5735295625;
/** US fluid ounces in one US gallon, exact. */
export const US_FL_OZ_PER_GALLON = 128;

const INCH_M = div(dec("25.4"), int(1000)); // metres
const LBF_N = mul(dec("0.45359237"), dec("9.80665")); // newtons
const GALLON_L = dec("3.785411784"); // litres

// ---- Unit tables ----------------------------------------------------------------------------
export const LENGTH_UNITS = ["in", "ft", "mm", "cm", "m"] as const;
export const PRESSURE_UNITS = ["psi", "kPa", "bar"] as const;
export const TORQUE_UNITS = ["lbf-in", "lbf-ft", "N-m"] as const;
export const VOLUME_UNITS = ["gal", "fl-oz", "L", "mL", "cm3", "in3"] as const;
export const TEMPERATURE_UNITS = ["F", "C", "K"] as const;
export const SPEED_UNITS = ["rpm", "rps"] as const;

export type LengthUnit = (typeof LENGTH_UNITS)[number];
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type TorqueUnit = (typeof TORQUE_UNITS)[number];
export type VolumeUnit = (typeof VOLUME_UNITS)[number];
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
export type SpeedUnit = (typeof SPEED_UNITS)[number];
export type LinearUnit = LengthUnit | PressureUnit | TorqueUnit | VolumeUnit | SpeedUnit;
export type Unit = LinearUnit | TemperatureUnit;
export type Dimension = "length" | "pressure" | "torque" | "volume" | "temperature" | "speed";

/** Size of each unit in its dimension's base unit (m, Pa, N·m, L, rev/s). */
const LENGTH: Record<LengthUnit, Rational> = {
  in: INCH_M,
  ft: mul(INCH_M, int(12)),
  mm: [1n, 1000n],
  cm: [1n, 100n],
  m: [1n, 1n],
};
const PRESSURE: Record<PressureUnit, Rational> = {
  psi: div(LBF_N, mul(INCH_M, INCH_M)),
  kPa: [1000n, 1n],
  bar: [100000n, 1n],
};
const TORQUE: Record<TorqueUnit, Rational> = {
  "lbf-in": mul(LBF_N, INCH_M),
  "lbf-ft": mul(LBF_N, INCH_M, int(12)),
  "N-m": [1n, 1n],
};
const VOLUME: Record<VolumeUnit, Rational> = {
  gal: GALLON_L,
  "fl-oz": div(GALLON_L, int(128)),
  L: [1n, 1n],
  mL: [1n, 1000n],
  cm3: [1n, 1000n],
  in3: mul(INCH_M, INCH_M, INCH_M, int(1000)), // m³ → L
};
const SPEED: Record<SpeedUnit, Rational> = {
  rpm: [1n, 60n],
  rps: [1n, 1n],
};

const TABLES: Record<Exclude<Dimension, "temperature">, Record<string, Rational>> = {
  length: LENGTH,
  pressure: PRESSURE,
  torque: TORQUE,
  volume: VOLUME,
  speed: SPEED,
};

/** Display labels (the unit symbols we print). */
export const UNIT_LABELS: Record<Unit, string> = {
  in: "in",
  ft: "ft",
  mm: "mm",
  cm: "cm",
  m: "m",
  psi: "psi",
  kPa: "kPa",
  bar: "bar",
  "lbf-in": "lbf·in",
  "lbf-ft": "lbf·ft",
  "N-m": "N·m",
  gal: "US gal",
  "fl-oz": "US fl oz",
  L: "L",
  mL: "mL",
  cm3: "cm³",
  in3: "in³",
  F: "°F",
  C: "°C",
  K: "K",
  rpm: "rpm",
  rps: "rev/s",
};

export function dimensionOf(unit: string): Dimension | undefined {
  for (const [dim, table] of Object.entries(TABLES)) if (unit in table) return dim as Dimension;
  if ((TEMPERATURE_UNITS as readonly string[]).includes(unit)) return "temperature";
  return undefined;
}

/** Exact factor from one unit to another of the same table, as a reduced fraction n/d. */
export function exactFactor(from: LinearUnit, to: LinearUnit): { numerator: bigint; denominator: bigint } {
  const dim = dimensionOf(from);
  if (!dim || dim === "temperature" || dimensionOf(to) !== dim) {
    throw new RangeError(`Cannot convert ${from} to ${to}`);
  }
  const table = TABLES[dim];
  const a = table[from];
  const b = table[to];
  if (!a || !b) throw new RangeError(`Unknown unit ${from} or ${to}`);
  const [n, d] = div(a, b);
  return { numerator: n, denominator: d };
}

const MAX_SAFE = BigInt(Number.MAX_SAFE_INTEGER);
function scale(value: number, from: LinearUnit, to: LinearUnit): number {
  if (from === to) return value;
  const { numerator: n, denominator: d } = exactFactor(from, to);
  if (n <= MAX_SAFE && d <= MAX_SAFE) return (value * Number(n)) / Number(d);
  return value * (Number(n) / Number(d));
}

export const convertLength = (value: number, from: LengthUnit, to: LengthUnit): number => scale(value, from, to);
export const convertPressure = (value: number, from: PressureUnit, to: PressureUnit): number =>
  scale(value, from, to);
export const convertTorque = (value: number, from: TorqueUnit, to: TorqueUnit): number => scale(value, from, to);
export const convertVolume = (value: number, from: VolumeUnit, to: VolumeUnit): number => scale(value, from, to);
export const convertSpeed = (value: number, from: SpeedUnit, to: SpeedUnit): number => scale(value, from, to);

export function convertTemperature(value: number, from: TemperatureUnit, to: TemperatureUnit): number {
  if (from === to) return value;
  // to °C first
  const c = from === "C" ? value : from === "F" ? ((value - 32) * 5) / 9 : value - 273.15;
  if (to === "C") return c;
  if (to === "F") return (c * 9) / 5 + 32;
  return c + 273.15;
}

/**
 * Convert between any two units named by string (for UI pickers). Unknown units and units of
 * different dimensions return a clear message instead of throwing.
 */
export function convert(value: number, from: string, to: string): Result<number> {
  if (!Number.isFinite(value)) return err("Enter a number.");
  const df = dimensionOf(from);
  const dt = dimensionOf(to);
  if (!df) return err(`Unknown unit "${from}".`);
  if (!dt) return err(`Unknown unit "${to}".`);
  if (df !== dt) return err(`Cannot convert ${df} (${from}) to ${dt} (${to}).`);
  if (df === "temperature") return ok(convertTemperature(value, from as TemperatureUnit, to as TemperatureUnit));
  return ok(scale(value, from as LinearUnit, to as LinearUnit));
}

// ---- Decimal display --------------------------------------------------------------------------

/**
 * Round half up (away from zero) to `digits` decimals, working on the decimal digits of the
 * value trimmed to 12 significant figures, so 2.55 (stored as 2.54999…) rounds to 2.6 as on paper.
 */
export function roundHalfUp(value: number, digits: number): number {
  if (!Number.isFinite(value)) return value;
  const clean = Number(value.toPrecision(12));
  const sign = clean < 0 ? -1 : 1;
  const abs = Math.abs(clean);
  if (/e/i.test(String(abs))) {
    // very large or very small magnitudes: plain scaling is as good as it gets
    const f = 10 ** digits;
    return sign * (Math.floor(abs * f + 0.5) / f) || 0;
  }
  // shift the decimal point in the string form so no binary error creeps in
  const shifted = Number(`${abs}e${digits}`);
  if (shifted >= Number.MAX_SAFE_INTEGER) return clean; // beyond the precision we keep anyway
  const rounded = Math.floor(shifted + 0.5);
  return sign * Number(`${rounded}e-${digits}`) || 0;
}

/** Format with at most `maxDecimals` decimals (half up), trailing zeros trimmed: 4.7625 → "4.7625". */
export function formatDecimal(value: number, maxDecimals: number, minDecimals = 0): string {
  const r = roundHalfUp(value, maxDecimals);
  let s = r.toFixed(maxDecimals);
  if (s.includes(".")) {
    s = s.replace(/0+$/, "");
    const decimals = s.length - s.indexOf(".") - 1;
    if (decimals < minDecimals) s += "0".repeat(minDecimals - decimals);
    s = s.replace(/\.$/, "");
  }
  return s === "-0" ? "0" : s;
}

export function formatQuantity(value: number, unit: Unit, maxDecimals = 2): string {
  return `${formatDecimal(value, maxDecimals)} ${UNIT_LABELS[unit]}`;
}

// ---- Fractions of an inch ---------------------------------------------------------------------

export type InchFraction = { whole: number; numerator: number; denominator: number };

/**
 * Parse a length in inches as written at the bench: "3/16", "3/16 in", `3/16"`, "1 1/4",
 * "1-1/4 in", "0.25", ".25in". Returns the value in inches.
 */
export function parseInches(text: string): Result<number> {
  const s = text
    .trim()
    .replace(/(inches|inch|in\.?|″|")$/i, "")
    .trim();
  if (s === "") return err("Enter a length in inches, e.g. 3/16 or 0.25.");
  const mixed = /^(\d+)(?:\s+|-)(\d+)\s*\/\s*(\d+)$/.exec(s);
  const frac = /^(\d+)\s*\/\s*(\d+)$/.exec(s);
  const decimal = /^(\d+(?:\.\d*)?|\.\d+)$/.exec(s);
  let whole = 0;
  let num = 0;
  let den = 1;
  if (mixed) {
    whole = Number(mixed[1]);
    num = Number(mixed[2]);
    den = Number(mixed[3]);
  } else if (frac) {
    num = Number(frac[1]);
    den = Number(frac[2]);
  } else if (decimal) {
    return ok(Number(decimal[1]));
  } else {
    return err(`"${text}" is not a length in inches. Write it like 3/16, 1 1/4 or 0.25.`);
  }
  if (den === 0) return err(`"${text}": the bottom of the fraction cannot be 0.`);
  if (mixed && num >= den) return err(`"${text}": in a mixed number the fraction must be less than 1.`);
  return ok(whole + num / den);
}

/** Parse inches and convert to millimetres exactly: "3/16 in" → 4.7625. */
export function parseInchesToMm(text: string): Result<number> {
  const r = parseInches(text);
  if (!r.ok) return r;
  return ok(convertLength(r.value, "in", "mm"));
}

/** Nearest fraction of an inch with a power-of-two denominator up to `maxDenominator` (reduced). */
export function nearestInchFraction(inches: number, maxDenominator = 64): InchFraction & { exact: boolean } {
  if (!Number.isFinite(inches) || inches < 0) throw new RangeError("inches must be a finite, non-negative number");
  const units = Math.round(inches * maxDenominator);
  let whole = Math.floor(units / maxDenominator);
  let numerator = units - whole * maxDenominator;
  let denominator = maxDenominator;
  while (numerator !== 0 && numerator % 2 === 0 && denominator % 2 === 0) {
    numerator /= 2;
    denominator /= 2;
  }
  if (numerator === 0) denominator = 1;
  const exact = Math.abs(units / maxDenominator - inches) < 1e-9;
  if (numerator === denominator) {
    whole += 1;
    numerator = 0;
    denominator = 1;
  }
  return { whole, numerator, denominator, exact };
}

/** "3/16 in", "1 1/4 in", "2 in"; prefixed with "≈ " when the value is not an exact 1/maxDenominator. */
export function formatInchFraction(inches: number, maxDenominator = 64): string {
  const f = nearestInchFraction(inches, maxDenominator);
  const parts: string[] = [];
  if (f.whole > 0 || f.numerator === 0) parts.push(String(f.whole));
  if (f.numerator > 0) parts.push(`${f.numerator}/${f.denominator}`);
  return `${f.exact ? "" : "≈ "}${parts.join(" ")} in`;
}
