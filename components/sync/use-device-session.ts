"use client";

import { useEffect, useState } from "react";
import type { DeviceUser } from "@/lib/sync/device-db";
import type { SignedInUser } from "@/lib/sync/session";
import { deviceCall } from "@/lib/sync/device-client";
import { requestSyncWhenIdle } from "@/lib/sync/scheduler";
import { useWatched } from "./use-sync";

export type DeviceSession =
  | { kind: "loading" }
  | { kind: "ready"; user: DeviceUser }
  | { kind: "signed-out" }
  /** Someone else signed in while the previous person's changes are still on this phone. */
  | { kind: "blocked"; previous: DeviceUser; current: SignedInUser; waiting: number; needsAttention: number };

/**
 * Who the bench works for. Renders from the device store (so it opens offline), then asks the server
 * who is signed in: the same person → sync (the waiting push goes out after "sign in again"); nobody
 * (401) → the outbox stays and the badge asks to sign in again; someone else → a fresh store, or a
 * warning while the previous person's changes wait.
 */
export function useDeviceSession(): DeviceSession {
  const stored = useWatched("deviceUser") ?? ("loading" as const);
  const [checked, setChecked] = useState<null | "ok" | "no-session" | "offline">(null);
  const [blocked, setBlocked] = useState<Extract<DeviceSession, { kind: "blocked" }> | null>(null);

  useEffect(() => {
    let live = true;
    (async () => {
      let res: Response;
      try {
        res = await fetch("/api/me", { cache: "no-store", credentials: "same-origin" });
      } catch {
        if (live) setChecked("offline");
        return;
      }
      if (res.status === 401) {
        // The session ended: keep everything; the badge asks the tech to sign in again.
        await deviceCall({ type: "session-ended" });
        if (live) setChecked("no-session");
        return;
      }
      if (!res.ok) {
        if (live) setChecked("offline");
        return;
      }
      const { user } = (await res.json()) as { user: SignedInUser };
      const result = await deviceCall({ type: "adopt", user });
      if (!live) return;
      if (result.status === "blocked") {
        setBlocked({ kind: "blocked", previous: result.previous, current: user, waiting: result.waiting, needsAttention: result.needsAttention });
      } else {
        setChecked("ok");
        requestSyncWhenIdle();
      }
    })();
    return () => {
      live = false;
    };
  }, []);

  if (blocked) return blocked;
  if (stored === "loading") return { kind: "loading" };
  if (stored) return { kind: "ready", user: stored };
  return checked === null || checked === "ok" ? { kind: "loading" } : { kind: "signed-out" };
}
