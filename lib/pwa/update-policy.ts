/**
 * When a waiting new version of the app may take over (pure: no browser, no framework).
 *
 * Taking over restarts the page. Work recorded on the device is in the device store and survives that, but
 * until the shop has it a new version must not be forced on it, and whatever is typed on screen and not yet
 * saved would be lost. So an update applies by itself only when the outbox is empty and nothing is being typed;
 * otherwise it waits, and the tech can still choose to update after a clear warning.
 */
export interface UpdateSituation {
  /** A new version is installed and waiting. */
  waiting: boolean;
  /** Outbox entries the shop has not acknowledged yet; null when the device store could not be read. */
  pendingChanges: number | null;
  /** Something is being typed on screen and is not saved yet (a half-filled sheet or form). */
  editing: boolean;
  /** The tech asked to update now (the "Update now" button). */
  requested: boolean;
  /** The tech confirmed the warning. */
  confirmed: boolean;
}

export type UpdateDecision =
  | { action: "none" }
  | { action: "apply" }
  | { action: "wait"; reasons: UpdateHold[] }
  | { action: "confirm"; reasons: UpdateHold[] };

export type UpdateHold = "unsynced-changes" | "editing" | "store-unreadable";

export function holdsOn(s: Pick<UpdateSituation, "pendingChanges" | "editing">): UpdateHold[] {
  const reasons: UpdateHold[] = [];
  if (s.pendingChanges === null) reasons.push("store-unreadable");
  else if (s.pendingChanges > 0) reasons.push("unsynced-changes");
  if (s.editing) reasons.push("editing");
  return reasons;
}

export function decideUpdate(s: UpdateSituation): UpdateDecision {
  if (!s.waiting) return { action: "none" };
  const reasons = holdsOn(s);
  if (reasons.length === 0) return { action: "apply" };
  if (s.requested && s.confirmed) return { action: "apply" };
  return s.requested ? { action: "confirm", reasons } : { action: "wait", reasons };
}

/** The warning the tech reads before updating with work not yet at the shop. */
export function updateWarning(reasons: UpdateHold[], pendingChanges: number | null): string[] {
  const lines: string[] = [];
  if (reasons.includes("unsynced-changes") && pendingChanges) {
    const what = pendingChanges === 1 ? "1 change" : `${pendingChanges} changes`;
    lines.push(
      `${what} on this phone ${pendingChanges === 1 ? "has" : "have"} not reached the shop yet. ` +
        "They stay saved on this phone and are sent at the next sync, but syncing first is safer.",
    );
  }
  if (reasons.includes("store-unreadable")) {
    lines.push("This phone's saved work could not be checked just now. Sync first if you can.");
  }
  if (reasons.includes("editing")) {
    lines.push("The app restarts to update: anything typed on this screen and not saved yet will be lost.");
  }
  return lines;
}
