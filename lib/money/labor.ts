/**
 * Labor charges from time on the job (integer minutes) or at a flat rate.
 *
 * Billable minutes: the worked minutes rounded to the shop's increment (e.g. 6 min = a tenth of an hour),
 * either up to the next increment ("up", the usual shop rule) or to the nearest, ties up ("nearest"),
 * then raised to a minimum charge if the shop has one. Amount = billable minutes × hourly rate ÷ 60,
 * rounded half up to the cent (exact for any increment that divides the hour into whole cents).
 */
import { err, ok, type Result } from "../trade/result";
import { mulDivHalfUp } from "./rounding";

export type LaborRounding = "up" | "nearest" | "none";

export type LaborTimeInput = {
  minutes: number;
  rateCentsPerHour: number;
  /** Rounding increment in minutes (1–60). Default 6 (a tenth of an hour). */
  incrementMinutes?: number;
  rounding?: LaborRounding;
  /** Minimum billable minutes when any time was worked (e.g. 30). Default none. */
  minimumMinutes?: number;
};

export function billableMinutes(
  minutes: number,
  incrementMinutes = 6,
  rounding: LaborRounding = "up",
  minimumMinutes = 0,
): number {
  if (!Number.isSafeInteger(minutes) || minutes < 0) throw new RangeError("minutes must be a whole number ≥ 0");
  if (!Number.isInteger(incrementMinutes) || incrementMinutes < 1 || incrementMinutes > 60) {
    throw new RangeError("incrementMinutes must be a whole number from 1 to 60");
  }
  if (minutes === 0) return 0;
  let billed = minutes;
  if (rounding === "up") billed = Math.ceil(minutes / incrementMinutes) * incrementMinutes;
  else if (rounding === "nearest") billed = Math.floor((2 * minutes + incrementMinutes) / (2 * incrementMinutes)) * incrementMinutes;
  return Math.max(billed, minimumMinutes);
}

/** Hours as shown on an invoice: 90 → "1.5", 6 → "0.1", 10 → "0.17" (two decimals at most, half up). */
export function formatHours(minutes: number): string {
  const hundredths = mulDivHalfUp(minutes, 100, 60);
  const whole = Math.floor(hundredths / 100);
  const frac = hundredths % 100;
  if (frac === 0) return String(whole);
  return `${whole}.${String(frac).padStart(2, "0").replace(/0$/, "")}`;
}

export type LaborCharge = { billableMinutes: number; amountCents: number };

export function laborFromTime(input: LaborTimeInput): Result<LaborCharge> {
  const { minutes, rateCentsPerHour } = input;
  const inc = input.incrementMinutes ?? 6;
  const min = input.minimumMinutes ?? 0;
  if (!Number.isSafeInteger(minutes) || minutes < 0) return err("Labor time must be a whole number of minutes, 0 or more.");
  if (!Number.isSafeInteger(rateCentsPerHour) || rateCentsPerHour < 0) {
    return err("The labor rate must be a whole number of cents per hour, 0 or more.");
  }
  if (!Number.isInteger(inc) || inc < 1 || inc > 60) return err("The rounding increment must be 1 to 60 minutes.");
  if (!Number.isInteger(min) || min < 0) return err("The minimum charge time must be a whole number of minutes, 0 or more.");
  const billed = billableMinutes(minutes, inc, input.rounding ?? "up", min);
  return ok({ billableMinutes: billed, amountCents: mulDivHalfUp(billed, rateCentsPerHour, 60) });
}
