/**
 * Repair tag codes and product barcode check digits.
 *
 * Tag code: 6 data characters + 1 check character, printed as "HAW-BR7H"-style groups of 3 and 4.
 *
 * - Check character: ISO/IEC 7064 MOD 37-2 (pure system, modulus 37, radix 2) over the standard's
 *   character values 0–9 = 0–9, A–Z = 10–35, '*' = 36. Because 37 is prime and every weight 2^i mod 37
 *   is non-zero, every single-character substitution and every swap of two neighbouring characters
 *   changes the checksum, so it is always detected.
 * - Alphabet: the 24 characters 3 4 6 7 8 9 A B C D E F G H J K M N P R T W X Y. Left out because they
 *   are easily confused when printed small, worn or handwritten: 0/O/Q, 1/I/L, 2/Z, 5/S, U/V.
 * - Generation draws 6 data characters at random and keeps the code only if its check character is
 *   also in the alphabet (rejection sampling, ~65 % of draws kept), so a printed code never shows a
 *   left-out character and the MOD 37-2 detection guarantees still hold. 24^6 ≈ 191 million data
 *   strings, about 124 million of which have an in-alphabet check character.
 * - Input is forgiving: case, spaces and dashes are ignored.
 *
 * GS1 check digit (GS1 General Specifications §7.9.1): from the right of the data digits, weights
 * 3, 1, 3, 1 …; the check digit brings the weighted sum up to a multiple of 10.
 */
import { err, ok, type Result } from "./result";

export const TAG_ALPHABET = "346789ABCDEFGHJKMNPRTWXY";
export const TAG_EXCLUDED = "0125ILOQSUVZ";
export const TAG_DATA_LENGTH = 6;
export const TAG_CODE_LENGTH = TAG_DATA_LENGTH + 1;

/** ISO/IEC 7064 MOD 37-2 character set: values 0–36. */
export const MOD37_2_CHARSET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZ*";

function mod37Value(ch: string): number {
  const v = MOD37_2_CHARSET.indexOf(ch);
  if (v < 0) throw new RangeError(`"${ch}" is not an ISO/IEC 7064 MOD 37-2 character`);
  return v;
}

/** Check character for `data` (0–9, A–Z) by ISO/IEC 7064 MOD 37-2, pure recursive method. */
export function mod37_2CheckChar(data: string): string {
  if (data.length === 0) throw new RangeError("data must not be empty");
  let p = 0;
  for (const ch of data) {
    const v = mod37Value(ch);
    if (v === 36) throw new RangeError("'*' is only allowed as the check character");
    p = ((p + v) * 2) % 37;
  }
  const check = (38 - p) % 37; // p + check ≡ 1 (mod 37)
  return MOD37_2_CHARSET[check] as string;
}

/** True if `full` (data + check character) satisfies MOD 37-2: Σ value × 2^(position−1) ≡ 1 (mod 37). */
export function mod37_2IsValid(full: string): boolean {
  if (full.length < 2) return false;
  let p = 0;
  for (const [i, ch] of [...full].entries()) {
    const v = MOD37_2_CHARSET.indexOf(ch);
    if (v < 0 || (v === 36 && i !== full.length - 1)) return false;
    p = (p * 2 + v) % 37;
  }
  return p === 1;
}

/** Upper-case and drop spaces and dashes: " haw-br7h " → "HAWBR7H". */
export function normalizeTagCode(input: string): string {
  return input.toUpperCase().replace(/[\s\-‐‑‒–—]/g, "");
}

/** "HAWBR7H" → "HAW-BR7H" (input is normalized first). */
export function formatTagCode(code: string): string {
  const c = normalizeTagCode(code);
  return c.length === TAG_CODE_LENGTH ? `${c.slice(0, 3)}-${c.slice(3)}` : c;
}

/** Check a typed or scanned tag code; on success returns the normalized code. */
export function checkTagCode(input: string): Result<string> {
  const c = normalizeTagCode(input);
  if (c.length === 0) return err("Enter the tag code (7 characters, e.g. HAW-BR7H).");
  for (const [i, ch] of [...c].entries()) {
    if (!TAG_ALPHABET.includes(ch)) {
      const why = TAG_EXCLUDED.includes(ch)
        ? `Tag codes never use ${[...TAG_EXCLUDED].join(" ")}.`
        : "Tag codes use only letters and digits.";
      return err(`Character ${i + 1} ("${ch}") is not used in tag codes. ${why} Check the tag again.`);
    }
  }
  if (c.length !== TAG_CODE_LENGTH) {
    return err(`A tag code has ${TAG_CODE_LENGTH} characters; this has ${c.length}.`);
  }
  if (!mod37_2IsValid(c)) {
    return err("This tag code does not check out: a character was probably misread or two were swapped. Check the tag again.");
  }
  return ok(c);
}

export function isValidTagCode(input: string): boolean {
  return checkTagCode(input).ok;
}

/** A uniform random number in [0, 1) from the platform's cryptographic generator. */
export function cryptoRandom(): number {
  const buf = new Uint32Array(1);
  globalThis.crypto.getRandomValues(buf);
  return (buf[0] as number) / 2 ** 32;
}

/** A new tag code (normalized, without the dash). `random` returns numbers in [0, 1). */
export function generateTagCode(random: () => number = cryptoRandom): string {
  for (let attempt = 0; attempt < 1000; attempt++) {
    let data = "";
    for (let i = 0; i < TAG_DATA_LENGTH; i++) {
      const r = random();
      if (!(r >= 0 && r < 1)) throw new RangeError("random() must return a number in [0, 1)");
      data += TAG_ALPHABET[Math.floor(r * TAG_ALPHABET.length)];
    }
    const check = mod37_2CheckChar(data);
    if (TAG_ALPHABET.includes(check)) return data + check;
  }
  throw new Error("random source keeps giving rejected codes; it is not random");
}

// ---- GS1 mod-10 -----------------------------------------------------------------------------------

export const GTIN_LENGTHS = [8, 12, 13, 14] as const;

/** GS1 mod-10 check digit for a string of data digits (the code without its last digit). */
export function gs1CheckDigit(dataDigits: string): string {
  if (!/^\d+$/.test(dataDigits)) throw new RangeError("GS1 data must be digits only");
  let sum = 0;
  let weight = 3;
  for (let i = dataDigits.length - 1; i >= 0; i--) {
    sum += Number(dataDigits[i]) * weight;
    weight = weight === 3 ? 1 : 3;
  }
  return String((10 - (sum % 10)) % 10);
}

/** Check a GTIN-8, -12 (UPC-A), -13 or -14 as scanned or typed (spaces and dashes ignored). */
export function checkGtin(input: string): Result<string> {
  const c = input.replace(/[\s-]/g, "");
  if (!/^\d+$/.test(c)) return err("A product barcode number has digits only.");
  if (!(GTIN_LENGTHS as readonly number[]).includes(c.length)) {
    return err(`A product barcode number has 8, 12, 13 or 14 digits; this has ${c.length}.`);
  }
  if (gs1CheckDigit(c.slice(0, -1)) !== c.slice(-1)) {
    return err("The barcode number's check digit does not match: a digit was probably mistyped.");
  }
  return ok(c);
}

export function isValidGtin(input: string): boolean {
  return checkGtin(input).ok;
}
