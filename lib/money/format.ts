/**
 * Display and entry of money and rates. Formatting works on the integer digits (no floating point),
 * in the en-US style: 123456 → "$1,234.56", -5 → "-$0.05".
 */
import { err, ok, type Result } from "../trade/result";
import { assertCents } from "./rounding";

const group = (digits: string): string => digits.replace(/\B(?=(\d{3})+(?!\d))/g, ",");

export function formatCents(cents: number): string {
  assertCents(cents);
  const neg = cents < 0;
  const abs = Math.abs(cents);
  const dollars = Math.floor(abs / 100);
  const rest = abs % 100;
  return `${neg ? "-" : ""}$${group(String(dollars))}.${String(rest).padStart(2, "0")}`;
}

/** Parse dollars as typed ("12", "12.5", "$1,234.56", "-3.10") into integer cents. */
export function parseDollars(text: string): Result<number> {
  const s = text.trim().replace(/^\$/, "").replace(/^(-)\$/, "$1");
  const m = /^(-)?\$?(\d{1,3}(?:,\d{3})+|\d+)?(?:\.(\d*))?$/.exec(s);
  if (!m || (!m[2] && !m[3])) return err(`"${text}" is not an amount of money. Write it like 12.50.`);
  const frac = m[3] ?? "";
  if (frac.length > 2) return err(`"${text}" has more than 2 decimals: amounts are in whole cents.`);
  const dollars = Number((m[2] ?? "0").replace(/,/g, ""));
  const cents = dollars * 100 + Number(frac.padEnd(2, "0") || "0");
  if (!Number.isSafeInteger(cents)) return err(`"${text}" is too large.`);
  return ok(m[1] ? -cents : cents);
}

/**
 * Parse a percentage ("8.875", "8.875 %", "35") into integer parts of 100 % at a given scale:
 * scale 10 000 gives basis points, 1 000 000 gives parts per million. Refuses digits the scale cannot hold.
 */
export function parsePercent(text: string, scale: 10_000 | 1_000_000): Result<number> {
  const s = text.trim().replace(/\s*%$/, "");
  const m = /^(\d+)?(?:\.(\d*))?$/.exec(s);
  if (!m || (!m[1] && !m[2])) return err(`"${text}" is not a percentage. Write it like 7.25.`);
  const maxDecimals = scale === 10_000 ? 2 : 4;
  const frac = (m[2] ?? "").replace(/0+$/, "");
  if (frac.length > maxDecimals) {
    return err(`"${text}" has more than ${maxDecimals} decimals; that precision is not kept.`);
  }
  const value = Number(m[1] ?? "0") * (scale / 100) + Number(frac.padEnd(maxDecimals, "0") || "0");
  if (!Number.isSafeInteger(value)) return err(`"${text}" is too large.`);
  return ok(value);
}

/** Basis points or ppm back to a percentage string: 88 750 ppm → "8.875 %". */
export function formatPercent(value: number, scale: 10_000 | 1_000_000): string {
  const perPercent = scale / 100;
  const whole = Math.trunc(value / perPercent);
  const frac = Math.abs(value % perPercent);
  const digits = String(perPercent).length - 1;
  const fracText = frac === 0 ? "" : `.${String(frac).padStart(digits, "0").replace(/0+$/, "")}`;
  return `${value < 0 && whole === 0 ? "-" : ""}${whole}${fracText} %`;
}
