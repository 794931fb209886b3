/**
 * Integer-cent arithmetic. Amounts are integer cents (JS safe integers); rates are integers:
 * basis points (1 bp = 0.01 %) for markups and shop-supplies percentages, parts per million
 * (1 ppm = 0.0001 %) for tax rates, so 8.875 % = 88 750 ppm is exact.
 *
 * All products are formed exactly in BigInt and rounded once, half up (away from zero on a tie),
 * which is the sales-tax rule of the Streamlined Sales and Use Tax Agreement states (e.g.
 * R.I. Gen. Laws §44-18.1-25): carry to the third decimal and round up when it is 5 or more.
 * $2.50 × 5 % = $0.125 → $0.13.
 */

export const BP_PER_UNIT = 10_000; // 100 % = 10 000 bp
export const PPM_PER_UNIT = 1_000_000; // 100 % = 1 000 000 ppm

export function assertCents(value: number, what = "amount"): void {
  if (!Number.isSafeInteger(value)) throw new RangeError(`${what} must be a whole number of cents (got ${value})`);
}

/** n / d rounded half away from zero; d must be positive. */
export function divRoundHalfUp(n: bigint, d: bigint): bigint {
  if (d <= 0n) throw new RangeError("divisor must be positive");
  const neg = n < 0n;
  const abs = neg ? -n : n;
  const q = (2n * abs + d) / (2n * d);
  return neg ? -q : q;
}

function toSafeNumber(v: bigint): number {
  if (v > BigInt(Number.MAX_SAFE_INTEGER) || v < BigInt(Number.MIN_SAFE_INTEGER)) {
    throw new RangeError("amount is too large to handle exactly");
  }
  return Number(v);
}

/** round_half_up(a × b / d) for integers a, b and positive integer d. */
export function mulDivHalfUp(a: number, b: number, d: number): number {
  if (!Number.isSafeInteger(a) || !Number.isSafeInteger(b) || !Number.isSafeInteger(d)) {
    throw new RangeError("mulDivHalfUp takes whole numbers only");
  }
  return toSafeNumber(divRoundHalfUp(BigInt(a) * BigInt(b), BigInt(d)));
}

/** Tax (or any percentage given in ppm) on an amount, rounded half up to the cent. */
export function applyPpm(amountCents: number, ratePpm: number): number {
  return mulDivHalfUp(amountCents, ratePpm, PPM_PER_UNIT);
}

/** Percentage given in basis points of an amount, rounded half up to the cent. */
export function applyBp(amountCents: number, rateBp: number): number {
  return mulDivHalfUp(amountCents, rateBp, BP_PER_UNIT);
}

/** Price after a markup in basis points, rounded half up: 1000 ¢ + 3500 bp → 1350 ¢. */
export function withMarkup(unitCents: number, markupBp: number): number {
  return mulDivHalfUp(unitCents, BP_PER_UNIT + markupBp, BP_PER_UNIT);
}

/**
 * Split `totalCents` in proportion to non-negative integer `weights` so the parts add up exactly
 * (largest remainder; ties go to the earlier index). If every weight is 0 the first part takes
 * the whole total.
 */
export function allocateCents(totalCents: number, weights: readonly number[]): number[] {
  assertCents(totalCents, "total");
  if (weights.length === 0) {
    if (totalCents !== 0) throw new RangeError("cannot allocate a non-zero total over no parts");
    return [];
  }
  for (const w of weights) if (!Number.isSafeInteger(w) || w < 0) throw new RangeError("weights must be whole numbers ≥ 0");
  const sumW = weights.reduce((s, w) => s + BigInt(w), 0n);
  if (sumW === 0n) return weights.map((_, i) => (i === 0 ? totalCents : 0));
  const neg = totalCents < 0;
  const total = BigInt(Math.abs(totalCents));
  const floors = weights.map((w) => (total * BigInt(w)) / sumW);
  const rems = weights.map((w, i) => ({ i, r: (total * BigInt(w)) % sumW }));
  let left = total - floors.reduce((s, f) => s + f, 0n);
  rems.sort((a, b) => (a.r === b.r ? a.i - b.i : a.r > b.r ? -1 : 1));
  for (const { i } of rems) {
    if (left === 0n) break;
    floors[i] = (floors[i] ?? 0n) + 1n;
    left -= 1n;
  }
  return floors.map((f) => (neg ? -Number(f) : Number(f)));
}
