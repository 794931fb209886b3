/**
 * Estimate / invoice totals in integer cents that always add up.
 *
 * Lines
 * - item: qty in integer thousandths (2 parts = 2000, 1.5 qt = 1500) × unit price in cents. A markup in
 *   basis points is applied to the unit price first and rounded half up to the cent, so the printed unit
 *   price is what is multiplied; the line amount is then qty × unit ÷ 1000, rounded half up once.
 * - labor-time: minutes rounded to the shop's increment (see labor.ts) × hourly rate ÷ 60, half up.
 * - labor-flat: a flat charge.
 * - shop supplies: a percentage (bp) of labor, or of parts and labor, capped at `capCents`; added as
 *   its own "supplies" line when above 0.
 *
 * Tax: one rate in parts per million; which categories are taxable is a shop setting (labor is taxed in
 * some places and not in others, so it is never a constant). Rounding half up to the cent, either per
 * line (sum of rounded line taxes) or per invoice (the taxable subtotal taxed once, then spread over the
 * taxable lines by largest remainder so the line taxes still add up to the invoice tax).
 *
 * Invariants (property-tested): subtotal = Σ line amounts; each category total = Σ its lines;
 * tax = Σ line taxes; total = subtotal + tax.
 */
import { err, ok, type Result } from "../trade/result";
import { laborFromTime, formatHours, type LaborRounding } from "./labor";
import { allocateCents, applyBp, applyPpm, BP_PER_UNIT, mulDivHalfUp, PPM_PER_UNIT, withMarkup } from "./rounding";

export const LINE_CATEGORIES = ["part", "labor", "fee", "supplies"] as const;
export type LineCategory = (typeof LINE_CATEGORIES)[number];

/** Largest unit price and quantity accepted, so every product stays an exact safe integer. */
export const MAX_UNIT_CENTS = 1_000_000_000; // $10 million
export const MAX_QTY_THOUSANDTHS = 1_000_000_000; // one million units

type Common = { description: string; /** this line is never taxed (e.g. resale) */ taxExempt?: boolean };
export type ItemLineInput = Common & {
  kind: "item";
  category: "part" | "labor" | "fee";
  qtyThousandths: number;
  unitCents: number;
  markupBp?: number;
};
export type LaborTimeLineInput = Common & {
  kind: "labor-time";
  minutes: number;
  rateCentsPerHour: number;
  incrementMinutes?: number;
  rounding?: LaborRounding;
  minimumMinutes?: number;
};
export type LaborFlatLineInput = Common & { kind: "labor-flat"; flatCents: number };
export type LineInput = ItemLineInput | LaborTimeLineInput | LaborFlatLineInput;

export type ShopSuppliesSetting = {
  rateBp: number;
  capCents: number;
  basis: "labor" | "parts-and-labor";
  description?: string;
};

export type MoneySettings = {
  taxRatePpm: number;
  taxable: Record<LineCategory, boolean>;
  taxRounding: "per-line" | "per-invoice";
  shopSupplies?: ShopSuppliesSetting | null;
};

/** Starting point only: the owner sets the rate and what is taxable for their place. */
export const DEFAULT_MONEY_SETTINGS: MoneySettings = {
  taxRatePpm: 0,
  taxable: { part: true, labor: false, fee: false, supplies: true },
  taxRounding: "per-line",
  shopSupplies: null,
};

export type PricedLine = {
  /** Index in the input, or -1 for the computed shop-supplies line. */
  index: number;
  category: LineCategory;
  description: string;
  /** "2", "1.5", "1.5 h", "" for a flat charge. */
  quantityText: string;
  /** Unit price after markup (cents per unit or per hour); null for flat and percentage lines. */
  unitCents: number | null;
  amountCents: number;
  taxable: boolean;
  taxCents: number;
};

export type InvoiceTotals = {
  lines: PricedLine[];
  byCategory: Record<LineCategory, number>;
  subtotalCents: number;
  taxableCents: number;
  taxCents: number;
  totalCents: number;
  taxRounding: MoneySettings["taxRounding"];
};

const isWhole = (v: unknown, min: number, max: number): v is number =>
  typeof v === "number" && Number.isSafeInteger(v) && v >= min && v <= max;

/** Quantity in thousandths as text: 1500 → "1.5", 2000 → "2", 1 → "0.001". */
export function formatQtyThousandths(q: number): string {
  const whole = Math.floor(q / 1000);
  const frac = q % 1000;
  return frac === 0 ? String(whole) : `${whole}.${String(frac).padStart(3, "0").replace(/0+$/, "")}`;
}

type Unpriced = Omit<PricedLine, "taxable" | "taxCents"> & { taxExempt: boolean };

function priceLine(line: LineInput, index: number): Result<Unpriced> {
  const n = `Line ${index + 1}`;
  if (typeof line.description !== "string") return err(`${n}: add a description.`);
  const taxExempt = line.taxExempt === true;
  switch (line.kind) {
    case "item": {
      if (!(["part", "labor", "fee"] as const).includes(line.category)) return err(`${n}: choose part, labor or fee.`);
      if (!isWhole(line.qtyThousandths, 1, MAX_QTY_THOUSANDTHS)) {
        return err(`${n}: the quantity must be more than 0 with at most 3 decimals.`);
      }
      if (!isWhole(line.unitCents, 0, MAX_UNIT_CENTS)) return err(`${n}: the unit price must be whole cents, 0 or more.`);
      const markup = line.markupBp ?? 0;
      if (!isWhole(markup, -BP_PER_UNIT, 100 * BP_PER_UNIT)) {
        return err(`${n}: the markup must be a whole number of basis points from −100 % to 10 000 %.`);
      }
      const unit = withMarkup(line.unitCents, markup);
      return ok({
        index,
        category: line.category,
        description: line.description,
        quantityText: formatQtyThousandths(line.qtyThousandths),
        unitCents: unit,
        amountCents: mulDivHalfUp(line.qtyThousandths, unit, 1000),
        taxExempt,
      });
    }
    case "labor-time": {
      if (!isWhole(line.rateCentsPerHour, 0, MAX_UNIT_CENTS)) {
        return err(`${n}: the labor rate must be whole cents per hour, 0 or more.`);
      }
      const r = laborFromTime(line);
      if (!r.ok) return err(`${n}: ${r.message}`);
      return ok({
        index,
        category: "labor",
        description: line.description,
        quantityText: `${formatHours(r.value.billableMinutes)} h`,
        unitCents: line.rateCentsPerHour,
        amountCents: r.value.amountCents,
        taxExempt,
      });
    }
    case "labor-flat": {
      if (!isWhole(line.flatCents, 0, MAX_UNIT_CENTS)) return err(`${n}: the flat rate must be whole cents, 0 or more.`);
      return ok({
        index,
        category: "labor",
        description: line.description,
        quantityText: "",
        unitCents: null,
        amountCents: line.flatCents,
        taxExempt,
      });
    }
    default:
      return err(`${n}: unknown kind of line.`);
  }
}

function checkSettings(s: MoneySettings): string | undefined {
  if (!isWhole(s.taxRatePpm, 0, PPM_PER_UNIT)) return "The tax rate must be from 0 % to 100 % (whole parts per million).";
  if (s.taxRounding !== "per-line" && s.taxRounding !== "per-invoice") return "Choose tax rounding per line or per invoice.";
  for (const c of LINE_CATEGORIES) if (typeof s.taxable?.[c] !== "boolean") return `Say whether ${c} lines are taxable.`;
  const sup = s.shopSupplies;
  if (sup) {
    if (!isWhole(sup.rateBp, 0, BP_PER_UNIT)) return "The shop-supplies rate must be from 0 % to 100 % (whole basis points).";
    if (!isWhole(sup.capCents, 0, MAX_UNIT_CENTS)) return "The shop-supplies cap must be whole cents, 0 or more.";
    if (sup.basis !== "labor" && sup.basis !== "parts-and-labor") return "Choose what shop supplies are a percentage of.";
  }
  return undefined;
}

/** Shop-supplies charge: rate × base, rounded half up, capped. */
export function shopSuppliesCents(baseCents: number, setting: ShopSuppliesSetting): number {
  return Math.min(applyBp(baseCents, setting.rateBp), setting.capCents);
}

export function computeInvoice(
  lines: readonly LineInput[],
  settings: MoneySettings,
  opts: { customerTaxExempt?: boolean } = {},
): Result<InvoiceTotals> {
  const badSettings = checkSettings(settings);
  if (badSettings) return err(badSettings);
  const priced: Unpriced[] = [];
  for (const [i, line] of lines.entries()) {
    const r = priceLine(line, i);
    if (!r.ok) return r;
    priced.push(r.value);
  }
  const sum = (cat: LineCategory) => priced.filter((l) => l.category === cat).reduce((s, l) => s + l.amountCents, 0);
  const sup = settings.shopSupplies;
  if (sup) {
    const base = sup.basis === "labor" ? sum("labor") : sum("labor") + sum("part");
    const amount = shopSuppliesCents(base, sup);
    if (amount > 0) {
      priced.push({
        index: -1,
        category: "supplies",
        description: sup.description ?? "Shop supplies",
        quantityText: "",
        unitCents: null,
        amountCents: amount,
        taxExempt: false,
      });
    }
  }

  const exempt = opts.customerTaxExempt === true;
  const withTaxFlag = priced.map(({ taxExempt, ...l }) => ({
    ...l,
    taxable: !exempt && !taxExempt && settings.taxable[l.category] && settings.taxRatePpm > 0,
  }));
  const taxableCents = withTaxFlag.filter((l) => l.taxable).reduce((s, l) => s + l.amountCents, 0);

  let out: PricedLine[];
  if (settings.taxRounding === "per-line") {
    out = withTaxFlag.map((l) => ({ ...l, taxCents: l.taxable ? applyPpm(l.amountCents, settings.taxRatePpm) : 0 }));
  } else {
    const invoiceTax = applyPpm(taxableCents, settings.taxRatePpm);
    const weights = withTaxFlag.map((l) => (l.taxable ? l.amountCents : 0));
    const shares = weights.some((w) => w > 0) ? allocateCents(invoiceTax, weights) : weights.map(() => 0);
    out = withTaxFlag.map((l, i) => ({ ...l, taxCents: shares[i] ?? 0 }));
  }

  const byCategory = { part: 0, labor: 0, fee: 0, supplies: 0 } as Record<LineCategory, number>;
  for (const l of out) byCategory[l.category] += l.amountCents;
  const subtotalCents = out.reduce((s, l) => s + l.amountCents, 0);
  const taxCents = out.reduce((s, l) => s + l.taxCents, 0);
  return ok({
    lines: out,
    byCategory,
    subtotalCents,
    taxableCents,
    taxCents,
    totalCents: subtotalCents + taxCents,
    taxRounding: settings.taxRounding,
  });
}
