"use client";

import { useEffect, useState } from "react";

export type WakeLockState = { supported: boolean; active: boolean; error?: string };

/**
 * Keep the screen awake while `enabled` (the bench sheet is open), where the browser has the Screen Wake Lock API.
 * The browser drops the lock when the page is hidden; it is asked for again when the page is visible again.
 */
export function useWakeLock(enabled = true): WakeLockState {
  const [state, setState] = useState<WakeLockState>({ supported: false, active: false });

  useEffect(() => {
    if (!enabled) return;
    if (typeof navigator === "undefined" || !("wakeLock" in navigator)) {
      setState({ supported: false, active: false });
      return;
    }
    let sentinel: WakeLockSentinel | null = null;
    let cancelled = false;

    const request = async () => {
      if (document.visibilityState !== "visible" || (sentinel && !sentinel.released)) return;
      try {
        const s = await navigator.wakeLock.request("screen");
        if (cancelled) {
          void s.release();
          return;
        }
        sentinel = s;
        s.addEventListener("release", () => {
          if (!cancelled) setState((prev) => ({ ...prev, active: false }));
        });
        setState({ supported: true, active: true });
      } catch (e) {
        if (!cancelled) {
          setState({ supported: true, active: false, error: e instanceof Error ? e.message : "The screen may dim." });
        }
      }
    };
    const onVisible = () => {
      if (document.visibilityState === "visible") void request();
    };
    void request();
    document.addEventListener("visibilitychange", onVisible);
    return () => {
      cancelled = true;
      document.removeEventListener("visibilitychange", onVisible);
      void sentinel?.release().catch(() => undefined);
    };
  }, [enabled]);

  return state;
}
