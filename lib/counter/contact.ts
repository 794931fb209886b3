/**
 * Checks for what the counter types about a customer and a machine. Pure: no framework, no database.
 */
import { err, ok, type Result } from "../trade/result";

/** ITU-T E.164: an international number has at most 15 digits, country code included. */
export const PHONE_MAX_DIGITS = 15;
/** The shortest number we take: a 7-digit local number (e.g. 555-0142 without its area code). */
export const PHONE_MIN_DIGITS = 7;

export function phoneDigits(s: string): string {
  return s.replace(/\D/g, "");
}

/**
 * A phone number as typed: digits with spaces, dashes, dots or brackets, an optional leading "+".
 * Letters are refused (a number spelled in letters cannot be dialled from every phone).
 * Returns the number with runs of spaces collapsed.
 */
export function checkPhone(input: string): Result<string> {
  const s = input.trim().replace(/\s+/g, " ");
  if (s === "") return err("Enter a phone number.");
  if (!/^\+?[\d ().-]+$/.test(s)) {
    return err("Use digits only (spaces, dashes, dots and brackets are fine), e.g. 555-0142.");
  }
  const n = phoneDigits(s).length;
  if (n < PHONE_MIN_DIGITS) return err(`That is ${n} digit${n === 1 ? "" : "s"}; a phone number has at least ${PHONE_MIN_DIGITS}.`);
  if (n > PHONE_MAX_DIGITS) return err(`That is ${n} digits; a phone number has at most ${PHONE_MAX_DIGITS}, country code included.`);
  return ok(s);
}

/** Serial numbers compare without case, spaces, dashes, dots or slashes: "vh451-20931" = "VH451 20931". */
export function normalizeSerial(s: string): string {
  return s.toUpperCase().replace(/[\s\-./]/g, "");
}
