import { describe, expect, it } from "vitest";
import fc from "fast-check";
import Big from "big.js";
import {
  allocateCents,
  applyBp,
  applyPpm,
  billableMinutes,
  computeInvoice,
  DEFAULT_MONEY_SETTINGS,
  divRoundHalfUp,
  formatCents,
  formatHours,
  formatPercent,
  formatQtyThousandths,
  laborFromTime,
  mulDivHalfUp,
  parseDollars,
  parsePercent,
  shopSuppliesCents,
  withMarkup,
  type InvoiceTotals,
  type LineInput,
  type MoneySettings,
} from "@/lib/money";

/** Reference: big.js, an independent arbitrary-precision decimal library, rounding half up (away from zero). */
const bigHalfUp = (a: number, b: number, d: number) =>
  Number(new Big(a).times(b).div(d).round(0, Big.roundHalfUp).toString());

const settings = (over: Partial<MoneySettings> = {}): MoneySettings => ({ ...DEFAULT_MONEY_SETTINGS, ...over });

function totals(lines: LineInput[], s: MoneySettings, opts?: { customerTaxExempt?: boolean }): InvoiceTotals {
  const r = computeInvoice(lines, s, opts);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

const part = (unitCents: number, qty = 1, markupBp?: number): LineInput => ({
  kind: "item",
  category: "part",
  description: "part",
  qtyThousandths: qty * 1000,
  unitCents,
  ...(markupBp === undefined ? {} : { markupBp }),
});

describe("sales-tax rounding: half up to the cent", () => {
  it("$2.50 × 5 % = $0.125 → $0.13 [SSUTA rounding, R.I. Gen. Laws §44-18.1-25; Kan. Stat. 79-3676]", () => {
    expect(applyPpm(250, 50_000)).toBe(13);
    // half-even would give $0.12: the rule we follow is not banker's rounding [big.js roundHalfEven]
    expect(Number(new Big(250).times(50_000).div(1_000_000).round(0, Big.roundHalfEven).toString())).toBe(12);
  });

  it("third decimal 4 rounds down, 5 rounds up [SSUTA rounding, R.I. Gen. Laws §44-18.1-25]", () => {
    expect(applyPpm(249, 50_000)).toBe(12); // 12.45 ¢ → 12 ¢ (third decimal of dollars 4)
    expect(applyPpm(1_000, 72_500)).toBe(73); // $10 × 7.25 % = $0.725 → $0.73
    expect(applyPpm(999, 72_500)).toBe(72); // $9.99 × 7.25 % = $0.7242… → $0.72
  });

  it("property: rounding agrees with big.js ROUND_HALF_UP [big.js cross-check]", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -1e9, max: 1e9 }),
        fc.integer({ min: 0, max: 1_000_000 }),
        fc.constantFrom(1, 3, 60, 100, 1000, 10_000, 1_000_000),
        (a, b, d) => mulDivHalfUp(a, b, d) === bigHalfUp(a, b, d),
      ),
      { numRuns: 500 },
    );
  });

  it("divRoundHalfUp is symmetric around zero and refuses bad divisors", () => {
    expect(divRoundHalfUp(5n, 10n)).toBe(1n);
    expect(divRoundHalfUp(-5n, 10n)).toBe(-1n);
    expect(divRoundHalfUp(4n, 10n)).toBe(0n);
    expect(() => divRoundHalfUp(1n, 0n)).toThrow(RangeError);
    expect(() => mulDivHalfUp(1.5, 2, 3)).toThrow(RangeError);
  });
});

describe("markup, labor and shop supplies", () => {
  it("markup in basis points on the unit price [arithmetic, big.js cross-check]", () => {
    expect(withMarkup(1000, 3500)).toBe(1350);
    expect(withMarkup(333, 3500)).toBe(bigHalfUp(333, 13_500, 10_000)); // 449.55 → 450
    expect(withMarkup(333, 3500)).toBe(450);
    expect(applyBp(30_000, 1000)).toBe(3000);
  });

  it("billable minutes: up to the next increment, or to the nearest with ties up [common practice, no single source]", () => {
    expect(billableMinutes(43, 6, "up")).toBe(48);
    expect(billableMinutes(42, 6, "up")).toBe(42);
    expect(billableMinutes(43, 6, "nearest")).toBe(42);
    expect(billableMinutes(45, 6, "nearest")).toBe(48); // 7.5 increments → 8
    expect(billableMinutes(7, 15, "up", 30)).toBe(30); // minimum charge
    expect(billableMinutes(0, 6, "up", 30)).toBe(0); // no time worked, nothing billed
    expect(billableMinutes(47, 6, "none")).toBe(47);
  });

  it("labor amount = billable minutes × rate ÷ 60, half up [arithmetic, big.js cross-check]", () => {
    const r = laborFromTime({ minutes: 43, rateCentsPerHour: 9_000, incrementMinutes: 6 });
    expect(r).toEqual({ ok: true, value: { billableMinutes: 48, amountCents: 7_200 } }); // 0.8 h × $90
    const odd = laborFromTime({ minutes: 10, rateCentsPerHour: 10_000, incrementMinutes: 1 });
    expect(odd.ok && odd.value.amountCents).toBe(bigHalfUp(10, 10_000, 60)); // 1666.67 → 1667
    expect(formatHours(90)).toBe("1.5");
    expect(formatHours(6)).toBe("0.1");
    expect(formatHours(10)).toBe("0.17");
    expect(laborFromTime({ minutes: -1, rateCentsPerHour: 9_000 }).ok).toBe(false);
    expect(laborFromTime({ minutes: 10, rateCentsPerHour: 9_000, incrementMinutes: 0 }).ok).toBe(false);
  });

  it("shop supplies: a percentage with a cap", () => {
    const s = { rateBp: 1000, capCents: 2_500, basis: "labor" as const };
    expect(shopSuppliesCents(12_000, s)).toBe(1_200);
    expect(shopSuppliesCents(30_000, s)).toBe(2_500);
    expect(shopSuppliesCents(1_005, { ...s, rateBp: 500 })).toBe(50); // 50.25 → 50
  });
});

describe("invoice totals", () => {
  const taxed = (over: Partial<MoneySettings> = {}) =>
    settings({ taxRatePpm: 50_000, taxable: { part: true, labor: false, fee: false, supplies: true }, ...over });

  it("per line vs per invoice rounding, both allowed [SSUTA rounding, R.I. Gen. Laws §44-18.1-25]", () => {
    const lines = [part(250), part(250), part(250)];
    const perLine = totals(lines, taxed({ taxRounding: "per-line" }));
    expect(perLine.taxCents).toBe(39); // 3 × $0.13
    const perInvoice = totals(lines, taxed({ taxRounding: "per-invoice" }));
    expect(perInvoice.taxCents).toBe(38); // $7.50 × 5 % = $0.375 → $0.38
    expect(perInvoice.lines.map((l) => l.taxCents).reduce((a, b) => a + b)).toBe(38); // spread so lines still add up
  });

  it("labor is taxed only when the shop setting says so", () => {
    const lines: LineInput[] = [part(2_000), { kind: "labor-flat", description: "Carb clean", flatCents: 6_000 }];
    expect(totals(lines, taxed()).taxCents).toBe(100); // only the part: $20 × 5 %
    const laborTaxed = taxed({ taxable: { part: true, labor: true, fee: false, supplies: true } });
    expect(totals(lines, laborTaxed).taxCents).toBe(400); // $80 × 5 %
    expect(totals(lines, laborTaxed, { customerTaxExempt: true }).taxCents).toBe(0);
  });

  it("a worked invoice adds up to the cent", () => {
    const t = totals(
      [
        part(1_299, 2, 3_000), // $12.99 × 1.30 = $16.887 → $16.89 each, 2 → $33.78
        { kind: "labor-time", description: "Diagnose", minutes: 43, rateCentsPerHour: 9_000 }, // 48 min → $72.00
        { kind: "item", category: "fee", description: "Disposal", qtyThousandths: 1_000, unitCents: 500 },
      ],
      taxed({ shopSupplies: { rateBp: 1000, capCents: 2_500, basis: "labor" } }),
    );
    expect(t.lines.map((l) => [l.category, l.unitCents, l.amountCents, l.taxCents])).toEqual([
      ["part", 1_689, 3_378, 169], // $33.78 × 5 % = 1.689 → $1.69
      ["labor", 9_000, 7_200, 0],
      ["fee", 500, 500, 0],
      ["supplies", null, 720, 36], // 10 % of labor, $7.20 × 5 % = 0.36
    ]);
    expect(t.lines[1]?.quantityText).toBe("0.8 h");
    expect(t.byCategory).toEqual({ part: 3_378, labor: 7_200, fee: 500, supplies: 720 });
    expect(t.subtotalCents).toBe(11_798);
    expect(t.taxableCents).toBe(4_098);
    expect(t.taxCents).toBe(205);
    expect(t.totalCents).toBe(12_003);
    expect(formatCents(t.totalCents)).toBe("$120.03");
  });

  it("refuses bad lines and settings with a message naming the line", () => {
    const bad = computeInvoice([part(100), { ...part(100), qtyThousandths: 0 } as LineInput], settings());
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toMatch(/^Line 2:/);
    expect(computeInvoice([{ ...part(100), unitCents: 1.5 } as LineInput], settings()).ok).toBe(false);
    expect(computeInvoice([part(100)], settings({ taxRatePpm: -1 })).ok).toBe(false);
    expect(computeInvoice([part(100)], settings({ shopSupplies: { rateBp: 20_000, capCents: 0, basis: "labor" } })).ok).toBe(false);
  });

  it("property: lines always add up to the totals, and each tax matches big.js [big.js cross-check]", () => {
    const line: fc.Arbitrary<LineInput> = fc.oneof(
      fc.record({
        kind: fc.constant("item" as const),
        category: fc.constantFrom("part" as const, "labor" as const, "fee" as const),
        description: fc.constant("x"),
        qtyThousandths: fc.integer({ min: 1, max: 50_000 }),
        unitCents: fc.integer({ min: 0, max: 500_000 }),
        markupBp: fc.integer({ min: 0, max: 20_000 }),
        taxExempt: fc.boolean(),
      }),
      fc.record({
        kind: fc.constant("labor-time" as const),
        description: fc.constant("t"),
        minutes: fc.integer({ min: 0, max: 1_000 }),
        rateCentsPerHour: fc.integer({ min: 0, max: 30_000 }),
        incrementMinutes: fc.constantFrom(1, 6, 10, 15),
        rounding: fc.constantFrom("up" as const, "nearest" as const, "none" as const),
      }),
      fc.record({ kind: fc.constant("labor-flat" as const), description: fc.constant("f"), flatCents: fc.integer({ min: 0, max: 100_000 }) }),
    );
    const setting: fc.Arbitrary<MoneySettings> = fc.record({
      taxRatePpm: fc.integer({ min: 0, max: 150_000 }),
      taxable: fc.record({ part: fc.boolean(), labor: fc.boolean(), fee: fc.boolean(), supplies: fc.boolean() }),
      taxRounding: fc.constantFrom("per-line" as const, "per-invoice" as const),
      shopSupplies: fc.option(
        fc.record({
          rateBp: fc.integer({ min: 0, max: 2_000 }),
          capCents: fc.integer({ min: 0, max: 5_000 }),
          basis: fc.constantFrom("labor" as const, "parts-and-labor" as const),
        }),
        { nil: null },
      ),
    });
    fc.assert(
      fc.property(fc.array(line, { maxLength: 12 }), setting, (lines, s) => {
        const t = totals(lines, s);
        const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);
        expect(sum(t.lines.map((l) => l.amountCents))).toBe(t.subtotalCents);
        expect(sum(t.lines.map((l) => l.taxCents))).toBe(t.taxCents);
        expect(t.totalCents).toBe(t.subtotalCents + t.taxCents);
        expect(sum(Object.values(t.byCategory))).toBe(t.subtotalCents);
        expect(sum(t.lines.filter((l) => l.taxable).map((l) => l.amountCents))).toBe(t.taxableCents);
        for (const l of t.lines) {
          expect(Number.isSafeInteger(l.amountCents) && Number.isSafeInteger(l.taxCents)).toBe(true);
          if (!l.taxable) expect(l.taxCents).toBe(0);
          else if (s.taxRounding === "per-line") expect(l.taxCents).toBe(bigHalfUp(l.amountCents, s.taxRatePpm, 1_000_000));
        }
        if (s.taxRounding === "per-invoice") expect(t.taxCents).toBe(bigHalfUp(t.taxableCents, s.taxRatePpm, 1_000_000));
        if (s.shopSupplies) expect(t.byCategory.supplies).toBeLessThanOrEqual(s.shopSupplies.capCents);
        // item lines: amount = qty × printed unit price, half up (big.js)
        for (const l of t.lines) {
          const input = l.index >= 0 ? lines[l.index] : undefined;
          if (input?.kind === "item" && l.unitCents !== null) {
            expect(l.unitCents).toBe(bigHalfUp(input.unitCents, 10_000 + (input.markupBp ?? 0), 10_000));
            expect(l.amountCents).toBe(bigHalfUp(input.qtyThousandths, l.unitCents, 1_000));
          }
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe("allocating cents", () => {
  it("property: parts add up exactly and each is within a cent of its exact share", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -1_000_000, max: 1_000_000 }),
        fc.array(fc.integer({ min: 0, max: 100_000 }), { minLength: 1, maxLength: 20 }),
        (total, weights) => {
          const parts = allocateCents(total, weights);
          const W = weights.reduce((a, b) => a + b, 0);
          if (parts.reduce((a, b) => a + b, 0) !== total) return false;
          if (W === 0) return parts[0] === total;
          return parts.every((p, i) => Math.abs(p - (total * (weights[i] ?? 0)) / W) < 1);
        },
      ),
    );
  });
});

describe("formatting and entry", () => {
  it("formatCents matches Intl en-US currency formatting [ECMA-402 Intl.NumberFormat cross-check]", () => {
    const intl = new Intl.NumberFormat("en-US", { style: "currency", currency: "USD" });
    expect(formatCents(123_456)).toBe("$1,234.56");
    expect(formatCents(-5)).toBe("-$0.05");
    expect(formatCents(0)).toBe("$0.00");
    fc.assert(fc.property(fc.integer({ min: -1e12, max: 1e12 }), (c) => formatCents(c) === intl.format(c / 100)));
    expect(() => formatCents(1.5)).toThrow(RangeError);
  });

  it("parseDollars reads typed amounts into cents, refusing fractions of a cent", () => {
    expect(parseDollars("12")).toEqual({ ok: true, value: 1_200 });
    expect(parseDollars("12.5")).toEqual({ ok: true, value: 1_250 });
    expect(parseDollars("$1,234.56")).toEqual({ ok: true, value: 123_456 });
    expect(parseDollars("-3.10")).toEqual({ ok: true, value: -310 });
    expect(parseDollars(".99")).toEqual({ ok: true, value: 99 });
    for (const bad of ["", "abc", "1.234", "1,23", "$", "12..5"]) expect(parseDollars(bad).ok, bad).toBe(false);
    fc.assert(fc.property(fc.integer({ min: -1e12, max: 1e12 }), (c) => {
      const r = parseDollars(formatCents(c));
      return r.ok && r.value === c;
    }));
  });

  it("percent entry at basis-point and ppm scale", () => {
    expect(parsePercent("8.875", 1_000_000)).toEqual({ ok: true, value: 88_750 });
    expect(parsePercent("7.25 %", 10_000)).toEqual({ ok: true, value: 725 });
    expect(parsePercent("35", 10_000)).toEqual({ ok: true, value: 3_500 });
    expect(parsePercent("8.875", 10_000).ok).toBe(false); // basis points cannot hold 3 decimals
    expect(parsePercent("abc", 10_000).ok).toBe(false);
    expect(formatPercent(88_750, 1_000_000)).toBe("8.875 %");
    expect(formatPercent(725, 10_000)).toBe("7.25 %");
    expect(formatPercent(500, 10_000)).toBe("5 %");
    expect(formatQtyThousandths(1_500)).toBe("1.5");
    expect(formatQtyThousandths(2_000)).toBe("2");
  });
});
