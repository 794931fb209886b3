import { eq } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "../../db/client";
import { shopSettings } from "../../db/schema";
import { audit } from "../audit/log";
import { formatCents, parseDollars, parsePercent } from "../money/format";

export type ShopSettings = typeof shopSettings.$inferSelect;

const SETTINGS_ID = 1;

/** The shop's settings row; created with defaults on first read. */
export function getShopSettings(db: Db): ShopSettings {
  const row = db.select().from(shopSettings).where(eq(shopSettings.id, SETTINGS_ID)).get();
  if (row) return row;
  db.insert(shopSettings).values({ id: SETTINGS_ID, name: "My shop" }).onConflictDoNothing().run();
  return db.select().from(shopSettings).where(eq(shopSettings.id, SETTINGS_ID)).get()!;
}

/** Dollars as typed -> integer cents (lib/money does the parsing). */
const dollars = (label: string) =>
  z.string().transform((text, ctx) => {
    const r = parseDollars(text);
    if (!r.ok) ctx.addIssue({ code: "custom", message: `Enter ${label} in dollars, e.g. 95 or 95.50.` });
    else if (r.value < 0) ctx.addIssue({ code: "custom", message: `${cap(label)} cannot be negative.` });
    else return r.value;
    return z.NEVER;
  });

/** A percentage as typed -> parts per million (lib/money does the parsing). */
const percent = (label: string, max: number) =>
  z.string().transform((text, ctx) => {
    const r = parsePercent(text, 1_000_000);
    if (!r.ok) ctx.addIssue({ code: "custom", message: `Enter ${label} as a percentage, e.g. 8.25.` });
    else if (r.value > max * 10_000) ctx.addIssue({ code: "custom", message: `${cap(label)} must be at most ${max} %.` });
    else return r.value;
    return z.NEVER;
  });

const cap = (s: string) => s[0]!.toUpperCase() + s.slice(1);

const intIn = (label: string, min: number, max: number) =>
  z
    .string()
    .trim()
    .regex(/^\d+$/, `Enter ${label} as a whole number.`)
    .transform(Number)
    .refine((n) => n >= min && n <= max, `${cap(label)} must be from ${min} to ${max}.`);

export const settingsFormSchema = z.object({
  name: z.string().trim().min(1, "Enter the shop's name.").max(100),
  phone: z.string().trim().max(40),
  email: z.union([z.literal(""), z.string().trim().toLowerCase().email("Enter a valid e-mail address.")]),
  address: z.string().trim().max(300),
  timezone: z.string().trim().refine(isTimeZone, "Choose a time zone such as America/Chicago."),
  laborRate: dollars("the labor rate"),
  laborIncrementMinutes: intIn("the billing increment", 1, 60),
  taxRate: percent("the tax rate", 30),
  laborTaxable: z.enum(["yes", "no"]).transform((v) => v === "yes"),
  taxRounding: z.enum(["line", "invoice"]),
  shopSupplies: percent("shop supplies", 25),
  shopSuppliesCap: dollars("the shop-supplies cap"),
  comebackWindowDays: intIn("the comeback window", 0, 365),
});

function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

export type SettingsInput = z.output<typeof settingsFormSchema>;

/** Saves settings already parsed by settingsFormSchema. */
export function saveShopSettings(db: Db, v: SettingsInput, actorId: string | null): void {
  getShopSettings(db);
  db.transaction((tx) => {
    tx.update(shopSettings)
      .set({
        name: v.name,
        phone: v.phone,
        email: v.email,
        address: v.address,
        timezone: v.timezone,
        laborRateCentsPerHour: v.laborRate,
        laborIncrementMinutes: v.laborIncrementMinutes,
        taxRatePpm: v.taxRate,
        laborTaxable: v.laborTaxable,
        taxRounding: v.taxRounding,
        shopSuppliesBp: Math.round(v.shopSupplies / 100),
        shopSuppliesCapCents: v.shopSuppliesCap,
        comebackWindowDays: v.comebackWindowDays,
        updatedAt: new Date(),
      })
      .where(eq(shopSettings.id, SETTINGS_ID))
      .run();
    audit(tx, { actorId, action: "settings.updated", entity: "shop", entityId: String(SETTINGS_ID) });
  });
}

/** Settings as the form's text fields. */
export function settingsToForm(s: ShopSettings): Record<string, string> {
  const money = (c: number) => formatCents(c).replace("$", "").replace(/,/g, "");
  const pct = (ppm: number) => String(ppm / 10_000);
  return {
    name: s.name,
    phone: s.phone,
    email: s.email,
    address: s.address,
    timezone: s.timezone,
    laborRate: money(s.laborRateCentsPerHour),
    laborIncrementMinutes: String(s.laborIncrementMinutes),
    taxRate: pct(s.taxRatePpm),
    laborTaxable: s.laborTaxable ? "yes" : "no",
    taxRounding: s.taxRounding,
    shopSupplies: pct(s.shopSuppliesBp * 100),
    shopSuppliesCap: money(s.shopSuppliesCapCents),
    comebackWindowDays: String(s.comebackWindowDays),
  };
}
