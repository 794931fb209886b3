import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { getShopSettings, saveShopSettings, settingsFormSchema, settingsToForm } from "@/lib/shop/settings";
import { tempDb } from "./helpers/db";

let ctx: ReturnType<typeof tempDb>;
beforeEach(() => (ctx = tempDb()));
afterEach(() => ctx.cleanup());

const form = {
  name: "Test Shop", phone: "555-0100", email: "Shop@Example.com", address: "1 Main St", timezone: "America/Denver",
  laborRate: "$95.50", laborIncrementMinutes: "6", taxRate: "8.875", laborTaxable: "no", taxRounding: "line",
  shopSupplies: "5", shopSuppliesCap: "15", comebackWindowDays: "30",
};

describe("shop settings", () => {
  it("parse the owner's form into cents, ppm and basis points, and round-trip back to the form", () => {
    const parsed = settingsFormSchema.parse(form);
    expect(parsed).toMatchObject({ laborRate: 9550, taxRate: 88_750, shopSupplies: 50_000, shopSuppliesCap: 1500, email: "shop@example.com" });
    saveShopSettings(ctx.db, parsed, null);
    const saved = getShopSettings(ctx.db);
    expect(saved).toMatchObject({ laborRateCentsPerHour: 9550, taxRatePpm: 88_750, shopSuppliesBp: 500, taxRounding: "line", laborTaxable: false });
    expect(settingsToForm(saved)).toMatchObject({ laborRate: "95.50", taxRate: "8.875", shopSupplies: "5", shopSuppliesCap: "15.00" });
  });

  it("name each wrong field with a clear message", () => {
    const r = settingsFormSchema.safeParse({ ...form, laborRate: "ninety", taxRate: "40", timezone: "Mars/Olympus", comebackWindowDays: "-3", email: "nope" });
    expect(r.success).toBe(false);
    const fields = Object.fromEntries(r.error!.issues.map((i) => [i.path.join("."), i.message]));
    expect(fields).toEqual({
      laborRate: "Enter the labor rate in dollars, e.g. 95 or 95.50.",
      taxRate: "The tax rate must be at most 30 %.",
      timezone: "Choose a time zone such as America/Chicago.",
      comebackWindowDays: "Enter the comeback window as a whole number.",
      email: "Enter a valid e-mail address.",
    });
  });
});
