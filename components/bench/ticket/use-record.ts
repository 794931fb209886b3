"use client";

import { useCallback } from "react";
import { record, RecordError, type RecordInput, type Recorded, type RecordOptions } from "@/lib/sync/record";
import type { MutationName } from "@/lib/sync/protocol";
import { requestSync } from "@/lib/sync/scheduler";

/** Fired on `window` once a change is on the phone (its Dexie transaction committed); the device benchmark listens. */
export const SAVED_EVENT = "benchwright:saved";
export type SavedDetail = { name: MutationName; seq: number; at: number };

let syncTimer: ReturnType<typeof setTimeout> | undefined;
/** A few seconds after the last tap, send what is waiting (when there is a network; the scheduler retries otherwise). */
function syncSoon() {
  if (syncTimer) clearTimeout(syncTimer);
  syncTimer = setTimeout(() => {
    if (navigator.onLine) void requestSync().catch(() => undefined);
  }, 4000);
}

export type SaveOutcome = { ok: true; recorded: Recorded } | { ok: false; message: string; fields?: Record<string, string> };

/**
 * Records one change on the phone with `record()` and reports the outcome. The caller shows "saved" only for an
 * `ok` outcome, which comes after the transaction committed; a refusal comes back with its message and the
 * caller keeps what was typed. A few seconds after the last save, a sync is asked for when there is a network.
 */
export function useRecord() {
  // No "busy" state here: a re-render of the sheet between the tap and the commit would only delay the save.
  const save = useCallback(async <N extends MutationName>(name: N, input: RecordInput<N>, options?: RecordOptions): Promise<SaveOutcome> => {
    try {
      const recorded = await record(name, input, options);
      window.dispatchEvent(new CustomEvent<SavedDetail>(SAVED_EVENT, { detail: { name, seq: recorded.seq, at: performance.now() } }));
      syncSoon();
      return { ok: true, recorded };
    } catch (e) {
      if (e instanceof RecordError) return { ok: false, message: e.message, fields: e.fields };
      const message = e instanceof Error && e.name === "QuotaExceededError" ? "The phone is out of storage: nothing was saved. Free some space and try again." : "Could not save on this phone. Nothing was changed; try again.";
      return { ok: false, message };
    }
  }, []);
  return { save };
}
