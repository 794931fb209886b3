"use client";

import { useEffect, useState } from "react";
import { BenchShell } from "./bench-shell";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";
import { AskPersistentStorage } from "@/components/pwa/ask-persistent-storage";

interface DeviceUser {
  id: string;
  name: string;
  email: string;
  role: string;
}

const KEY = "benchwright.deviceUser";

/**
 * Today's work on the bench. It renders from what the device holds, never from a server-side session
 * check, so the page also opens with no network.
 */
export function BenchHome() {
  const [user, setUser] = useState<DeviceUser | null>(null);
  const [state, setState] = useState<"loading" | "ready" | "signed-out">("loading");
  const [signedInHere, setSignedInHere] = useState(false);

  useEffect(() => {
    const stored = localStorage.getItem(KEY);
    if (stored) {
      setUser(JSON.parse(stored) as DeviceUser);
      setState("ready");
    }
    fetch("/api/me", { cache: "no-store" })
      .then(async (res) => {
        if (res.status === 401) {
          setState(stored ? "ready" : "signed-out");
          return;
        }
        if (!res.ok) return;
        const body = (await res.json()) as { user: DeviceUser };
        localStorage.setItem(KEY, JSON.stringify(body.user));
        setUser(body.user);
        setSignedInHere(true);
        setState("ready");
      })
      .catch(() => setState(stored ? "ready" : "signed-out"));
  }, []);

  return (
    <BenchShell title="Today's work">
      {signedInHere ? <AskPersistentStorage /> : null}
      {state === "signed-out" ? (
        <div className="flex flex-col gap-4">
          <Notice tone="info" title="Not signed in on this phone">
            Sign in once with a network; after that the bench opens here even with no signal.
          </Notice>
          <a href="/sign-in?next=/bench" className={buttonClass("primary", "bench")}>
            Sign in
          </a>
        </div>
      ) : (
        <div className="flex flex-col gap-4">
          <p className="text-lg">
            {user ? (
              <>
                Signed in as <span className="font-bold">{user.name}</span>
              </>
            ) : (
              "Loading…"
            )}
          </p>
          <Notice tone="info" title="No tickets on this phone yet">
            Tickets assigned to you appear here after the first sync.
          </Notice>
        </div>
      )}
    </BenchShell>
  );
}
