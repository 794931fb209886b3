import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { gtin, mod37_2 } from "cdigit";
import {
  checkGtin,
  checkTagCode,
  formatTagCode,
  generateTagCode,
  gs1CheckDigit,
  isValidGtin,
  isValidTagCode,
  MOD37_2_CHARSET,
  mod37_2CheckChar,
  mod37_2IsValid,
  normalizeTagCode,
  TAG_ALPHABET,
  TAG_CODE_LENGTH,
  TAG_EXCLUDED,
} from "@/lib/trade/tag-code";

/** Small deterministic PRNG (mulberry32) so the sampled codes are the same on every run. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const sampleCodes = (n: number, seed = 7) => {
  const rnd = seeded(seed);
  return Array.from({ length: n }, () => generateTagCode(rnd));
};

describe("ISO/IEC 7064 MOD 37-2 check character", () => {
  it("matches the published examples", () => {
    // [ISO/IEC 7064 MOD 37-2 example as quoted by python-stdnum's mod_37_2 doc; standard text not read]
    expect(mod37_2CheckChar("G123489654321")).toBe("Y");
    // [python-stdnum test_iso7064 doctest] the same digits with 8 and 9 swapped → H
    expect(mod37_2CheckChar("G123498654321")).toBe("H");
    // [ISO/IEC 7064 via cdigit] cdigit's own example: "12CD" → "6"
    expect(mod37_2CheckChar("12CD")).toBe("6");
    expect(mod37_2IsValid("G123489654321Y")).toBe(true);
    expect(mod37_2IsValid("G123489654321H")).toBe(false);
  });

  it("property: agrees with cdigit's independent mod37_2 on random 0-9A-Z strings [ISO/IEC 7064 via cdigit]", () => {
    const chars = fc.constantFrom(...MOD37_2_CHARSET.slice(0, 36).split(""));
    fc.assert(
      fc.property(fc.array(chars, { minLength: 1, maxLength: 20 }).map((a) => a.join("")), (data) => {
        const ours = mod37_2CheckChar(data);
        return ours === mod37_2.compute(data) && mod37_2IsValid(data + ours) && mod37_2.validate(data + ours);
      }),
      { numRuns: 500 },
    );
  });

  it("property: validity agrees with cdigit on arbitrary protected strings [ISO/IEC 7064 via cdigit]", () => {
    const chars = fc.constantFrom(...MOD37_2_CHARSET.slice(0, 36).split(""));
    const check = fc.constantFrom(...MOD37_2_CHARSET.split(""));
    fc.assert(
      fc.property(fc.array(chars, { minLength: 1, maxLength: 10 }).map((a) => a.join("")), check, (data, c) =>
        mod37_2IsValid(data + c) === mod37_2.validate(data + c),
      ),
      { numRuns: 500 },
    );
  });

  it("algebra: every substitution and every neighbour swap changes the checksum, at every position of a 7-character code", () => {
    // [ISO/IEC 7064 design] modulus 37 is prime and weights 2^k mod 37 are never 0, and 2^(k+1) − 2^k = 2^k ≠ 0.
    // Checked here exhaustively over all value pairs (0–36) and all positions k = 0…6.
    for (let k = 0; k < TAG_CODE_LENGTH; k++) {
      const w = 2 ** k % 37;
      const w1 = 2 ** (k + 1) % 37;
      for (let a = 0; a < 37; a++) {
        for (let b = 0; b < 37; b++) {
          if (a === b) continue;
          expect(((a - b) * w) % 37 !== 0).toBe(true); // substitution
          expect(((a - b) * (w1 - w)) % 37 !== 0).toBe(true); // adjacent transposition
        }
      }
    }
  });
});

describe("tag codes", () => {
  const codes = sampleCodes(400);

  it("use only the unambiguous alphabet, including the check character", () => {
    expect(TAG_ALPHABET).toHaveLength(24);
    for (const ch of TAG_EXCLUDED) expect(TAG_ALPHABET).not.toContain(ch);
    expect(new Set(TAG_ALPHABET).size).toBe(24);
    for (const c of codes) {
      expect(c).toMatch(new RegExp(`^[${TAG_ALPHABET}]{7}$`));
      expect(isValidTagCode(c)).toBe(true);
      expect(mod37_2.validate(c)).toBe(true); // [ISO/IEC 7064 via cdigit]
    }
    // every alphabet character turns up somewhere in the sample, in data and in check positions
    expect(new Set(codes.join("")).size).toBe(24);
    expect(new Set(codes.map((c) => c.slice(-1))).size).toBe(24);
  });

  it("every single-character substitution of the sample is detected (exhaustive over the sample) [ISO/IEC 7064 MOD 37-2]", () => {
    let tried = 0;
    const undetected: string[] = [];
    for (const code of codes) {
      for (let i = 0; i < code.length; i++) {
        for (const ch of MOD37_2_CHARSET) {
          if (ch === code[i]) continue;
          const typo = code.slice(0, i) + ch + code.slice(i + 1);
          tried++;
          if (mod37_2IsValid(typo) || isValidTagCode(typo)) undetected.push(typo);
        }
      }
    }
    expect(tried).toBe(400 * 7 * 36);
    expect(undetected).toEqual([]);
  });

  it("every adjacent transposition of the sample is detected (exhaustive over the sample) [ISO/IEC 7064 MOD 37-2]", () => {
    let tried = 0;
    for (const code of codes) {
      for (let i = 0; i + 1 < code.length; i++) {
        if (code[i] === code[i + 1]) continue;
        const swapped = code.slice(0, i) + code[i + 1] + code[i] + code.slice(i + 2);
        tried++;
        expect(isValidTagCode(swapped), swapped).toBe(false);
        expect(mod37_2.validate(swapped)).toBe(false); // [ISO/IEC 7064 via cdigit]
      }
    }
    expect(tried).toBeGreaterThan(400 * 5);
  });

  it("property: any generated code survives case, spaces and dashes, and formats as XXX-XXXX", () => {
    fc.assert(
      fc.property(fc.integer(), (seed) => {
        const code = generateTagCode(seeded(seed));
        const shown = formatTagCode(code);
        return (
          /^[A-Z0-9]{3}-[A-Z0-9]{4}$/.test(shown) &&
          isValidTagCode(shown) &&
          isValidTagCode(` ${shown.toLowerCase()} `) &&
          isValidTagCode(`${code.slice(0, 2)} ${code.slice(2, 5)}–${code.slice(5)}`) &&
          normalizeTagCode(shown) === code
        );
      }),
      { numRuns: 300 },
    );
  });

  it("gives clear messages", () => {
    const code = codes.find((c) => c[0] !== c[1]) as string;
    const r1 = checkTagCode("");
    expect(!r1.ok && r1.message).toMatch(/Enter the tag code/);
    const r2 = checkTagCode(code.slice(0, 6));
    expect(!r2.ok && r2.message).toMatch(/7 characters; this has 6/);
    const r3 = checkTagCode(`O${code.slice(1)}`);
    expect(!r3.ok && r3.message).toMatch(/Character 1 \("O"\) is not used/);
    const swapped = code.slice(1, 2) + code.slice(0, 1) + code.slice(2);
    const r4 = checkTagCode(swapped);
    expect(!r4.ok && r4.message).toMatch(/does not check out/);
    expect(checkTagCode(formatTagCode(code.toLowerCase()))).toEqual({ ok: true, value: code });
  });

  it("generation uses the platform's crypto by default and rejects a broken random source", () => {
    const a = generateTagCode();
    expect(isValidTagCode(a)).toBe(true);
    expect(() => generateTagCode(() => 1)).toThrow(RangeError);
    // a constant source yields the same data every time: either that one code is acceptable or it gives up
    const constant = () => 0;
    const data = TAG_ALPHABET[0]!.repeat(6);
    if (TAG_ALPHABET.includes(mod37_2CheckChar(data))) expect(generateTagCode(constant)).toBe(data + mod37_2CheckChar(data));
    else expect(() => generateTagCode(constant)).toThrow(/not random/);
  });
});

describe("GS1 mod-10 check digits", () => {
  it.each([
    ["629104150021", "3"],
    ["03600024145", "7"],
    ["730001100001", "7"],
    ["890400021003", "7"],
  ])("%s → %s [GS1 GenSpec 7.9.1; gs1.org manual check-digit example]", (data, check) => {
    expect(gs1CheckDigit(data)).toBe(check);
    expect(gtin.compute(data)).toBe(check); // [GS1 via cdigit]
    expect(isValidGtin(data + check)).toBe(true);
  });

  it("property: agrees with cdigit's gtin for GTIN-8/12/13/14 data [GS1 via cdigit]", () => {
    fc.assert(
      fc.property(fc.constantFrom(7, 11, 12, 13), fc.array(fc.integer({ min: 0, max: 9 }), { minLength: 13, maxLength: 13 }), (len, ds) => {
        const data = ds.slice(0, len).join("");
        const ours = gs1CheckDigit(data);
        return ours === gtin.compute(data) && isValidGtin(data + ours) === gtin.validate(data + ours);
      }),
      { numRuns: 400 },
    );
  });

  it("every single-digit error in the worked examples is detected [GS1 GenSpec 7.9.1]", () => {
    for (const full of ["6291041500213", "036000241457", "7300011000017", "8904000210037"]) {
      for (let i = 0; i < full.length; i++) {
        for (let d = 0; d <= 9; d++) {
          if (String(d) === full[i]) continue;
          expect(isValidGtin(full.slice(0, i) + d + full.slice(i + 1))).toBe(false);
        }
      }
    }
  });

  it("refuses wrong lengths and non-digits with messages", () => {
    expect(checkGtin("12345")).toMatchObject({ ok: false });
    expect(checkGtin("03600024145X")).toMatchObject({ ok: false });
    const r = checkGtin("036000241458");
    expect(!r.ok && r.message).toMatch(/check digit does not match/);
    expect(checkGtin("0 36000 24145 7")).toEqual({ ok: true, value: "036000241457" });
    expect(() => gs1CheckDigit("12a")).toThrow(RangeError);
  });
});
