/**
 * Two-stroke premix: oil for an amount of gasoline at R:1, and the ratio of a given mix.
 *
 * "R:1" means oil = gasoline ÷ R (not ÷ (R + 1)): 50:1 is 2 % of the gasoline.
 * Exact values are kept; `chartDisplay` rounds the way printed mixing charts do
 * (2.56 fl oz → "2.6 fl oz", 31.25 mL → "31 mL").
 */
import { err, ok, type Result } from "./result";
import type { Cited } from "./sources";
import { convertVolume, formatDecimal, UNIT_LABELS } from "./units";

export const PREMIX_UNITS = ["gal", "fl-oz", "L", "mL"] as const;
export type PremixUnit = (typeof PREMIX_UNITS)[number];
export type Volume = { value: number; unit: PremixUnit };

/** Ratios printed on most small-engine mixing charts. */
export const COMMON_RATIOS = [25, 32, 40, 50] as const;

/** Outside this range a ratio is unusual for air-cooled two-strokes (common practice, no single source). */
export const USUAL_RATIO_RANGE = { min: 16, max: 100 } as const;

export type OilAmount = {
  /** Oil in the requested unit, exact (not rounded). */
  oil: Volume;
  /** Chart-style rounded text, e.g. "2.6 US fl oz". */
  display: string;
  /** Oil as a percentage of the gasoline (100 / R). */
  percentOfGasoline: number;
  /** Soft notes (unusual ratio); never a reason to refuse. */
  warnings: string[];
};

const isUnit = (u: string): u is PremixUnit => (PREMIX_UNITS as readonly string[]).includes(u);

function checkVolume(v: Volume, what: string): string | undefined {
  if (!isUnit(v.unit)) return `Choose a unit for the ${what} (US gal, US fl oz, L or mL).`;
  if (!Number.isFinite(v.value)) return `Enter the amount of ${what} as a number.`;
  if (v.value <= 0) return `The amount of ${what} must be more than 0.`;
  return undefined;
}

function ratioWarnings(ratio: number): string[] {
  if (ratio < USUAL_RATIO_RANGE.min || ratio > USUAL_RATIO_RANGE.max) {
    return [
      `${formatRatio(ratio)} is outside the usual ${USUAL_RATIO_RANGE.min}:1 to ${USUAL_RATIO_RANGE.max}:1 range for air-cooled two-strokes. Check the maker's manual.`,
    ];
  }
  return [];
}

/** Decimals a printed chart shows for each unit. */
export function chartDecimals(value: number, unit: PremixUnit): number {
  switch (unit) {
    case "fl-oz":
      return 1;
    case "mL":
      return Math.abs(value) < 10 ? 1 : 0;
    case "L":
    case "gal":
      return 2;
  }
}

/** Chart-style text: "2.6 US fl oz", "31 mL", "0.02 L". */
export function chartDisplay(value: number, unit: PremixUnit): string {
  return `${formatDecimal(value, chartDecimals(value, unit))} ${UNIT_LABELS[unit]}`;
}

/** "50:1", "49.2:1". */
export function formatRatio(ratio: number): string {
  return `${formatDecimal(ratio, 1)}:1`;
}

/** Exact oil amount: gasoline (in the oil's unit) ÷ R. */
const oilValue = (gasoline: Volume, ratio: number, oilUnit: PremixUnit): number =>
  convertVolume(gasoline.value, gasoline.unit, oilUnit) / ratio;

/** Oil needed for `gasoline` at `ratio`:1, answered in `oilUnit` (units may be mixed freely). */
export function oilForGasoline(gasoline: Volume, ratio: number, oilUnit: PremixUnit): Result<OilAmount> {
  const bad = checkVolume(gasoline, "gasoline");
  if (bad) return err(bad);
  if (!Number.isFinite(ratio) || ratio <= 0) return err("Enter the ratio as a number more than 0, e.g. 50 for 50:1.");
  if (!isUnit(oilUnit)) return err("Choose a unit for the oil (US gal, US fl oz, L or mL).");
  const value = oilValue(gasoline, ratio, oilUnit);
  return ok({
    oil: { value, unit: oilUnit },
    display: chartDisplay(value, oilUnit),
    percentOfGasoline: 100 / ratio,
    warnings: ratioWarnings(ratio),
  });
}

export type MixRatio = { ratio: number; display: string; warnings: string[] };

/** Ratio R (as in R:1) of a mix of `oil` in `gasoline`: R = gasoline ÷ oil, in the same unit. */
export function ratioOfMix(oil: Volume, gasoline: Volume): Result<MixRatio> {
  const badOil = checkVolume(oil, "oil");
  if (badOil) return err(badOil);
  const badGas = checkVolume(gasoline, "gasoline");
  if (badGas) return err(badGas);
  const ratio = convertVolume(gasoline.value, gasoline.unit, "mL") / convertVolume(oil.value, oil.unit, "mL");
  return ok({ ratio, display: formatRatio(ratio), warnings: ratioWarnings(ratio) });
}

export type PremixChartRow = { ratio: number; cells: { gasoline: Volume; oil: Volume; display: string }[] };

/** A printed-chart style table: oil per listed gasoline amount for each ratio. */
export function premixChart(
  ratios: readonly number[] = COMMON_RATIOS,
  amounts: readonly { gasoline: Volume; oilUnit: PremixUnit }[] = [
    { gasoline: { value: 1, unit: "gal" }, oilUnit: "fl-oz" },
    { gasoline: { value: 2.5, unit: "gal" }, oilUnit: "fl-oz" },
    { gasoline: { value: 1, unit: "L" }, oilUnit: "mL" },
    { gasoline: { value: 5, unit: "L" }, oilUnit: "mL" },
  ],
): PremixChartRow[] {
  return ratios.map((ratio) => ({
    ratio,
    cells: amounts.map(({ gasoline, oilUnit }) => {
      const value = oilValue(gasoline, ratio, oilUnit);
      return { gasoline, oil: { value, unit: oilUnit }, display: chartDisplay(value, oilUnit) };
    }),
  }));
}

// ---- Oil classes and ethanol guidance ---------------------------------------------------------

/** Two-stroke oil classes for air-cooled engines, lowest to highest. */
export const TWO_STROKE_OIL_CLASSES: readonly Cited[] = [
  {
    text: "JASO M345 grades for air-cooled two-strokes: FB < FC < FD (FA was withdrawn in 2004).",
    source: "JASO M345",
    marker: "read",
  },
  {
    text: "ISO grades for air-cooled two-strokes: ISO-L-EGB < EGC < EGD.",
    source: "ISO 13738",
    marker: "memory",
  },
  {
    text: "Outboard (water-cooled) two-stroke oil is not for air-cooled engines.",
    source: "Engine-manual and extension-service guidance",
    marker: "read",
  },
];

/** Most ethanol (volume %) that gasoline for small engines may contain. */
export const ETHANOL_MAX_PERCENT_SMALL_ENGINES = 10;

export type EthanolBlend = { label: string; percent: number; allowed: boolean; note: string };

export const ETHANOL_BLENDS: readonly EthanolBlend[] = [
  { label: "E0", percent: 0, allowed: true, note: "Ethanol-free gasoline: fine; best for storage." },
  { label: "E10", percent: 10, allowed: true, note: "Up to 10 % ethanol: the most small engines may use." },
  { label: "E15", percent: 15, allowed: false, note: "Never in small engines: prohibited in nonroad engines." },
  { label: "E20", percent: 20, allowed: false, note: "Never in small engines." },
  { label: "E85", percent: 85, allowed: false, note: "Never in small engines (flex-fuel vehicles only)." },
];

export const ETHANOL_SOURCES: readonly Cited[] = [
  {
    text: "Gasoline with more than 10 % ethanol must not be used in gasoline-powered nonroad engines and equipment.",
    source: "40 CFR 80.1504(a)(1), since moved into 40 CFR part 1090",
    marker: "read",
  },
  {
    text: "E15 is prohibited in nonroad engines such as chain saws and lawn mowers.",
    source: "US DOE Alternative Fuels Data Center, E15 page",
    marker: "read",
  },
  {
    text: "Up to 10 % ethanol is acceptable in small engines; never use E15, E20 or E85.",
    source: "NC State Extension AG-763W",
    marker: "read",
  },
];

export type EthanolVerdict = { allowed: boolean; message: string; sources: readonly Cited[] };

/** Is gasoline with `percent` % ethanol acceptable in a small engine? */
export function ethanolVerdict(percent: number): Result<EthanolVerdict> {
  if (!Number.isFinite(percent) || percent < 0 || percent > 100) {
    return err("Enter the ethanol content as a percentage from 0 to 100 (E10 = 10).");
  }
  const allowed = percent <= ETHANOL_MAX_PERCENT_SMALL_ENGINES;
  const message = allowed
    ? `${formatDecimal(percent, 1)} % ethanol is within the ${ETHANOL_MAX_PERCENT_SMALL_ENGINES} % limit for small engines.`
    : `${formatDecimal(percent, 1)} % ethanol is over the ${ETHANOL_MAX_PERCENT_SMALL_ENGINES} % limit: do not use it in small engines (never E15, E20 or E85).`;
  return ok({ allowed, message, sources: ETHANOL_SOURCES });
}
