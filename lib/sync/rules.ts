/**
 * Checks both sides make before a change is kept (the device to answer at once, the server to decide).
 * Pure; the trade rules themselves live in lib/trade.
 */
import { applyTuneEntry, startTune, type Screw, type TuneState } from "../trade/tune";
import type { TuneEntryRow } from "./protocol";

const byTime = (a: TuneEntryRow, b: TuneEntryRow) => (a.at < b.at ? -1 : a.at > b.at ? 1 : a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

/** Replays a ticket's tune log (in time order) with lib/trade/tune; the first refusal's message, or null. */
export function tuneLogProblem(entries: readonly TuneEntryRow[]): string | null {
  const start = startTune();
  if (!start.ok) return start.message;
  let state: TuneState = start.value;
  for (const e of [...entries].sort(byTime)) {
    if (e.kind === "baseline") {
      const baseline = e.baselineKind === "seated-then-out" ? { kind: "seated-then-out" as const, eighths: e.eighths } : { kind: "as-found" as const };
      const b = startTune({ [e.screw as Screw]: baseline });
      if (!b.ok) return b.message;
      state = { ...state, [e.screw]: b.value[e.screw] };
    } else {
      const r = applyTuneEntry(state, { screw: e.screw, direction: e.direction ?? "cw", eighths: e.eighths });
      if (!r.ok) return r.message;
      state = r.value;
    }
  }
  return null;
}

/** Why adding `next` to a valid tune log would break it, or null. (A log that was already broken is not blamed on `next`.) */
export function tuneEntryProblem(existing: readonly TuneEntryRow[], next: TuneEntryRow): string | null {
  const problem = tuneLogProblem([...existing, next]);
  if (problem && !tuneLogProblem(existing)) return problem;
  return null;
}
