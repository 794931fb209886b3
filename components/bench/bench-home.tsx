"use client";

import { BenchShell } from "./bench-shell";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";
import { SyncBadge } from "@/components/sync/sync-badge";
import { AskPersistentStorage } from "@/components/pwa/ask-persistent-storage";
import { useDeviceSession } from "@/components/sync/use-device-session";
import { useLiveSync, useSyncStatus } from "@/components/sync/use-sync";
import { TodayList } from "./today-list";

/**
 * Today's work on the bench: the tech's tickets (components/bench/today-list), searchable, each one tap from its
 * ticket screen. It renders from what the device holds (the person who signed in is kept in
 * the device store), never from a server-side session check, so the page also opens with no network.
 */

export function BenchHome() {
  const session = useDeviceSession();
  const status = useSyncStatus();
  const live = useLiveSync();
  // Never synced, no error yet and online: the first sync is on its way (it starts once the screen is drawn).
  // ("Not signed in" is what a round found before this phone knew who signed in: not a reason to stop waiting.)
  const fetching =
    live.running || (status !== undefined && !status.lastSyncAt && (!status.lastError || status.lastError.code === "not_signed_in") && live.online);

  return (
    <BenchShell title="Today's work" status={session.kind === "signed-out" ? undefined : <SyncBadge />}>
      {session.kind === "ready" ? <AskPersistentStorage /> : null}
      {session.kind === "signed-out" ? (
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
          {session.kind === "blocked" ? (
            <Notice tone="bad" title={`${session.previous.name}'s work is still on this phone`}>
              Their changes have not been sent yet, so this phone keeps working for them. Open{" "}
              <a className="font-bold underline" href="/bench/sync">
                Sync
              </a>{" "}
              to sign out, then sign in as {session.previous.name} to send them first.
            </Notice>
          ) : null}
          <p className="text-lg">
            {session.kind === "ready" || session.kind === "blocked" ? (
              <>
                Signed in as <span className="font-bold">{session.kind === "ready" ? session.user.name : session.current.name}</span>
              </>
            ) : (
              // Until the device store answers: the line keeps its height (nothing jumps), the list below says it is loading.
              <span aria-hidden>&nbsp;</span>
            )}
          </p>
          {status?.sessionExpired ? (
            <Notice tone="bad" title="Sign in again to send your changes">
              They are kept on this phone.{" "}
              <a className="font-bold underline" href="/sign-in?next=%2Fbench%2Fsync">
                Sign in again
              </a>
            </Notice>
          ) : null}
          <TodayList fetching={fetching} />
        </div>
      )}
    </BenchShell>
  );
}
