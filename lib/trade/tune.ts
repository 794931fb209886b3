/**
 * Tune log math: carburettor screw changes in whole eighths of a turn and each screw's net position.
 *
 * - Screws: `low` (low-speed mixture), `high` (high-speed mixture), `idle` (idle speed).
 * - Direction as seen from the screw head: `cw` = clockwise = in, `ccw` = counter-clockwise = out.
 * - Baseline per screw: `{ kind: "seated-then-out", eighths }` (gently seated, then backed out; mixture
 *   screws only) or `{ kind: "as-found" }` (position unknown; we track the change from where it was).
 * - Net position: for a seated baseline, eighths out from seated (never below 0: a seated screw cannot go
 *   further in, so such an entry is refused); for as-found, the change from as-found (+ = out, − = in).
 *
 * What a direction means (mixture: out = richer, in = leaner; idle: clockwise = faster idle) is
 * common practice with no single source; the maker's manual overrides it.
 */
import { err, ok, type Result } from "./result";

export const SCREWS = ["low", "high", "idle"] as const;
export type Screw = (typeof SCREWS)[number];
export type Direction = "cw" | "ccw";
export type TuneEntry = { screw: Screw; direction: Direction; eighths: number };
export type Baseline = { kind: "seated-then-out"; eighths: number } | { kind: "as-found" };
export type ScrewState = { baseline: Baseline; netEighths: number };
export type TuneState = Record<Screw, ScrewState>;

/** Largest single adjustment we accept (10 full turns); bigger is almost surely a typing slip. */
export const MAX_ENTRY_EIGHTHS = 80;

export const SCREW_LABELS: Record<Screw, string> = {
  low: "low-speed mixture screw",
  high: "high-speed mixture screw",
  idle: "idle speed screw",
};
export const SCREW_SHORT: Record<Screw, string> = { low: "L", high: "H", idle: "Idle" };
export const DIRECTION_LABELS: Record<Direction, string> = { cw: "clockwise (in)", ccw: "counter-clockwise (out)" };

/** The basis of every meaning we print. */
export const MEANING_BASIS = "Common practice, no single source: the maker's manual overrides this.";

const FRACTIONS: Record<number, string> = { 1: "⅛", 2: "¼", 3: "⅜", 4: "½", 5: "⅝", 6: "¾", 7: "⅞" };

/** Eighths of a turn as a number with a unicode fraction: 10 → "1 ¼", 1 → "⅛", 16 → "2", 0 → "0". */
export function formatEighths(eighths: number): string {
  if (!Number.isInteger(eighths)) throw new RangeError("eighths must be an integer");
  const sign = eighths < 0 ? "−" : "";
  const abs = Math.abs(eighths);
  const whole = Math.floor(abs / 8);
  const rest = abs % 8;
  const frac = FRACTIONS[rest];
  if (!frac) return `${sign}${whole}`;
  return whole === 0 ? `${sign}${frac}` : `${sign}${whole} ${frac}`;
}

/** "1 ¼ turns", "½ turn", "1 turn", "0 turns". */
export function formatTurnCount(eighths: number): string {
  const abs = Math.abs(eighths);
  const noun = abs > 0 && abs <= 8 ? "turn" : "turns";
  return `${formatEighths(abs)} ${noun}`;
}

/** "1 ¼ turns out" for positive, "½ turn in" for negative, "0 turns" for zero. */
export function formatTurns(eighths: number): string {
  if (eighths === 0) return formatTurnCount(0);
  return `${formatTurnCount(eighths)} ${eighths > 0 ? "out" : "in"}`;
}

const ASCII_OR_UNICODE_FRACTION = /^(?:(\d+)(?:\s+|-))?(?:(\d+)\s*\/\s*(\d+)|([⅛¼⅜½⅝¾⅞]))$/;
const UNICODE_EIGHTHS: Record<string, number> = { "⅛": 1, "¼": 2, "⅜": 3, "½": 4, "⅝": 5, "¾": 6, "⅞": 7 };

/** Parse a number of turns into eighths: "1 1/4" → 10, "1 ¼" → 10, "3/8" → 3, "1.5" → 12, "2" → 16. */
export function parseTurns(text: string): Result<number> {
  const s = text
    .trim()
    .replace(/\s*turns?$/i, "")
    .trim();
  if (s === "") return err("Enter the amount in turns, e.g. 1/8, 1/4 or 1 1/4.");
  let turns: number;
  const dec = /^(\d+(?:\.\d+)?|\.\d+)$/.exec(s);
  const frac = ASCII_OR_UNICODE_FRACTION.exec(s);
  if (dec) {
    turns = Number(dec[1]);
  } else if (frac) {
    const whole = frac[1] ? Number(frac[1]) : 0;
    let part: number;
    if (frac[4]) {
      part = (UNICODE_EIGHTHS[frac[4]] ?? 0) / 8;
    } else {
      const n = Number(frac[2]);
      const d = Number(frac[3]);
      if (d === 0) return err(`"${text}": the bottom of the fraction cannot be 0.`);
      if (frac[1] && n >= d) return err(`"${text}": in a mixed number the fraction must be less than 1.`);
      part = n / d;
    }
    turns = whole + part;
  } else {
    return err(`"${text}" is not an amount of turns. Write it like 1/8, 3/4 or 1 1/4.`);
  }
  const eighths = turns * 8;
  if (Math.abs(eighths - Math.round(eighths)) > 1e-9) {
    return err(`"${text}" is not a whole number of eighths of a turn. Round to the nearest ⅛ turn.`);
  }
  return ok(Math.round(eighths));
}

function checkBaseline(screw: Screw, b: Baseline): string | undefined {
  if (b.kind === "as-found") return undefined;
  if (b.kind !== "seated-then-out") return `Unknown baseline for the ${SCREW_LABELS[screw]}.`;
  if (screw === "idle") {
    return "The idle speed screw has no seated baseline: it sets the throttle stop. Record it as found.";
  }
  if (!Number.isInteger(b.eighths) || b.eighths < 0 || b.eighths > MAX_ENTRY_EIGHTHS) {
    return `The baseline for the ${SCREW_LABELS[screw]} must be a whole number of eighths of a turn out from seated (0 to ${MAX_ENTRY_EIGHTHS / 8} turns).`;
  }
  return undefined;
}

/** Start a tune log. Screws without a given baseline start "as found". */
export function startTune(baselines: Partial<Record<Screw, Baseline>> = {}): Result<TuneState> {
  const state = {} as TuneState;
  for (const screw of SCREWS) {
    const baseline = baselines[screw] ?? { kind: "as-found" };
    const bad = checkBaseline(screw, baseline);
    if (bad) return err(bad);
    state[screw] = { baseline, netEighths: baseline.kind === "seated-then-out" ? baseline.eighths : 0 };
  }
  return ok(state);
}

/** Signed change of one entry in eighths: out (ccw) is +, in (cw) is −. */
export const entryDelta = (e: TuneEntry): number => (e.direction === "ccw" ? e.eighths : -e.eighths);

/** Apply one entry. Refuses (without changing `state`) an entry that is malformed or would drive a seated screw past seated. */
export function applyTuneEntry(state: TuneState, entry: TuneEntry): Result<TuneState> {
  if (!(SCREWS as readonly string[]).includes(entry.screw)) return err("Choose a screw: low, high or idle.");
  if (entry.direction !== "cw" && entry.direction !== "ccw") {
    return err("Choose a direction: clockwise (in) or counter-clockwise (out).");
  }
  if (!Number.isInteger(entry.eighths) || entry.eighths <= 0) {
    return err("Enter the amount as a whole number of eighths of a turn, at least ⅛.");
  }
  if (entry.eighths > MAX_ENTRY_EIGHTHS) {
    return err(`${formatTurnCount(entry.eighths)} in one step is more than we accept (${MAX_ENTRY_EIGHTHS / 8} turns). Check the amount.`);
  }
  const current = state[entry.screw];
  const net = current.netEighths + entryDelta(entry);
  if (current.baseline.kind === "seated-then-out" && net < 0) {
    const label = SCREW_LABELS[entry.screw];
    const where =
      current.netEighths === 0 ? "is already seated" : `is only ${formatTurnCount(current.netEighths)} out from seated`;
    return err(
      `Refused: the ${label} ${where}, so it cannot go ${formatTurnCount(entry.eighths)} further in. ` +
        "A seated screw stops; forcing it damages the needle and seat. Nothing was changed.",
    );
  }
  return ok({ ...state, [entry.screw]: { ...current, netEighths: net } });
}

/**
 * Apply a whole log. On the first refused entry, returns its 1-based number and message together with
 * the state just before it, so nothing already entered is lost.
 */
export function applyTuneLog(
  baselines: Partial<Record<Screw, Baseline>>,
  entries: readonly TuneEntry[],
): { ok: true; value: TuneState } | { ok: false; message: string; entryNumber: number; state: TuneState | null } {
  const start = startTune(baselines);
  if (!start.ok) return { ok: false, message: start.message, entryNumber: 0, state: null };
  let state = start.value;
  for (const [i, entry] of entries.entries()) {
    const next = applyTuneEntry(state, entry);
    if (!next.ok) return { ok: false, message: `Entry ${i + 1}: ${next.message}`, entryNumber: i + 1, state };
    state = next.value;
  }
  return ok(state);
}

/** "1 ¼ turns out from seated", "¼ turn out from as found", "as found". */
export function describePosition(s: ScrewState): string {
  if (s.baseline.kind === "seated-then-out") {
    return s.netEighths === 0 ? "seated (0 turns out)" : `${formatTurns(s.netEighths)} from seated`;
  }
  return s.netEighths === 0 ? "as found" : `${formatTurns(s.netEighths)} from as found`;
}

export type EntryMeaning = { summary: string; meaning: string; warning?: string; basis: string };

/** What an entry means in words, marked as common practice that the maker's manual overrides. */
export function describeEntry(entry: TuneEntry): EntryMeaning {
  const amount = formatTurnCount(entry.eighths);
  const summary = `${SCREW_SHORT[entry.screw]} screw ${amount} ${DIRECTION_LABELS[entry.direction]}`;
  if (entry.screw === "idle") {
    return {
      summary,
      meaning: entry.direction === "cw" ? "Faster idle (throttle held a little more open)." : "Slower idle.",
      basis: MEANING_BASIS,
    };
  }
  const speed = entry.screw === "low" ? "low-speed" : "high-speed";
  if (entry.direction === "ccw") {
    return { summary, meaning: `Out: richer ${speed} mixture (more fuel).`, basis: MEANING_BASIS };
  }
  return {
    summary,
    meaning: `In: leaner ${speed} mixture (less fuel).`,
    warning:
      entry.screw === "high"
        ? "Too lean at high speed can overheat and score the piston. Never set it leaner than the maker allows."
        : undefined,
    basis: MEANING_BASIS,
  };
}
