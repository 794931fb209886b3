/**
 * Calendar dates and wall-clock times in the shop's time zone (IANA names such as "America/Chicago").
 * Dates travel as "YYYY-MM-DD" strings; instants as epoch milliseconds. Pure: no framework, no database.
 */
import { err, ok, type Result } from "../trade/result";

export const DAY_MS = 86_400_000;

function parts(tz: string, at: number): Record<string, number> {
  const fmt = new Intl.DateTimeFormat("en-US", {
    timeZone: tz,
    hourCycle: "h23",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    second: "2-digit",
  });
  const out: Record<string, number> = {};
  for (const p of fmt.formatToParts(at)) if (p.type !== "literal") out[p.type] = Number(p.value);
  return out;
}

const pad = (n: number, w = 2) => String(n).padStart(w, "0");

/** The calendar date of an instant in a time zone: "2026-12-01". */
export function dateIn(tz: string, at: number | Date): string {
  const p = parts(tz, +at);
  return `${pad(p.year!, 4)}-${pad(p.month!)}-${pad(p.day!)}`;
}

/** The wall-clock time of an instant in a time zone: "14:05". */
export function timeIn(tz: string, at: number | Date): string {
  const p = parts(tz, +at);
  return `${pad(p.hour!)}:${pad(p.minute!)}`;
}

/** True for a real Gregorian calendar date written YYYY-MM-DD (so 2026-02-30 is false). */
export function isCalendarDate(s: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(s);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const t = new Date(Date.UTC(y, mo - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === mo - 1 && t.getUTCDate() === d;
}

/** Whole days from date a to date b (both YYYY-MM-DD): "2026-12-01" → "2026-12-03" is 2. */
export function daysBetween(a: string, b: string): number {
  const ms = (s: string) => Date.UTC(Number(s.slice(0, 4)), Number(s.slice(5, 7)) - 1, Number(s.slice(8, 10)));
  return Math.round((ms(b) - ms(a)) / DAY_MS);
}

/** date + n days, as YYYY-MM-DD. */
export function addDays(date: string, n: number): string {
  const t = Date.UTC(Number(date.slice(0, 4)), Number(date.slice(5, 7)) - 1, Number(date.slice(8, 10))) + n * DAY_MS;
  return new Date(t).toISOString().slice(0, 10);
}

/** Offset of the zone from UTC at an instant, in milliseconds (Chicago in winter: −6 h). */
function offsetAt(tz: string, at: number): number {
  const p = parts(tz, at);
  const asUtc = Date.UTC(p.year!, p.month! - 1, p.day!, p.hour!, p.minute!, p.second!);
  return asUtc - Math.floor(at / 1000) * 1000;
}

/**
 * The instant a wall-clock date and time in a zone stands for. A time that does not exist (the hour the
 * clocks skip in spring) is refused; a time that happens twice (the hour repeated in autumn) takes the first.
 */
export function zonedTimeToInstant(date: string, time: string, tz: string): Result<number> {
  if (!isCalendarDate(date)) return err("Enter a real date, e.g. 2026-12-01.");
  const m = /^(\d{2}):(\d{2})$/.exec(time);
  if (!m || Number(m[1]) > 23 || Number(m[2]) > 59) return err("Enter the time as hours and minutes, e.g. 14:30.");
  const wall = Date.UTC(Number(date.slice(0, 4)), Number(date.slice(5, 7)) - 1, Number(date.slice(8, 10)), Number(m[1]), Number(m[2]));
  // Try the offsets in force a day either side; keep the candidates that read back as the same wall time.
  const candidates = [offsetAt(tz, wall - DAY_MS), offsetAt(tz, wall + DAY_MS), offsetAt(tz, wall)]
    .map((off) => wall - off)
    .filter((at) => dateIn(tz, at) === date && timeIn(tz, at) === time)
    .sort((a, b) => a - b);
  if (candidates.length === 0) return err("That time does not exist on that day (the clocks were put forward). Check the time.");
  return ok(candidates[0]!);
}

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const WEEKDAYS = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"];

/** "2026-12-01" → "Tue 1 Dec 2026" (no locale data needed, so server and browser agree). */
export function formatDate(date: string, opts: { weekday?: boolean; year?: boolean } = {}): string {
  if (!isCalendarDate(date)) return date;
  const [y, m, d] = [Number(date.slice(0, 4)), Number(date.slice(5, 7)), Number(date.slice(8, 10))];
  const wd = WEEKDAYS[new Date(Date.UTC(y, m - 1, d)).getUTCDay()];
  return `${opts.weekday === false ? "" : `${wd} `}${d} ${MONTHS[m - 1]}${opts.year === false ? "" : ` ${y}`}`;
}

/** An instant as "Tue 1 Dec 2026, 14:05" in the zone. */
export function formatDateTime(tz: string, at: number | Date): string {
  return `${formatDate(dateIn(tz, at))}, ${timeIn(tz, at)}`;
}
