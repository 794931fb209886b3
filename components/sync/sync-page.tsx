"use client";

import { useState } from "react";
import { useLiveQuery } from "dexie-react-hooks";
import { LogOut, RefreshCw, RotateCcw, Trash } from "lucide-react";
import { BenchShell } from "@/components/bench/bench-shell";
import { Button, ButtonLink } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { signOutAction } from "@/lib/auth/actions";
import { deviceDb, type AttentionEntry, type OutboxEntry } from "@/lib/sync/device-db";
import { describeChange, timeAgo } from "@/lib/sync/describe";
import { attentionEntries, outboxEntries } from "@/lib/sync/read";
import { dismissAttention, retryAttention, RecordError } from "@/lib/sync/record";
import { requestSync } from "@/lib/sync/scheduler";
import { markSignedOut, refetchEverything } from "@/lib/sync/session";
import { SyncBadge } from "./sync-badge";
import { useDeviceSession } from "./use-device-session";
import { useLiveSync, useNow, useSyncStatus } from "./use-sync";

const SIGN_IN_AGAIN = "/sign-in?next=%2Fbench%2Fsync";

/** Ticket numbers by id, for labelling changes. */
function useTicketNumbers(): Map<string, number> {
  return useLiveQuery(async () => new Map((await deviceDb().tickets.toArray()).map((t) => [t.id, t.number])), [], new Map());
}

function ChangeLine({ entry, numbers, now }: { entry: OutboxEntry; numbers: Map<string, number>; now: number }) {
  const n = entry.ticketId ? numbers.get(entry.ticketId) : undefined;
  return (
    <span className="flex flex-col">
      <span className="font-semibold">{describeChange(entry.name, entry.args)}</span>
      <span className="text-sm text-muted">
        {n ? `Ticket #${n} · ` : entry.ticketId ? "A ticket no longer on this phone · " : ""}
        recorded {timeAgo(entry.at, now)}
      </span>
    </span>
  );
}

function AttentionItem({ item, numbers, now }: { item: AttentionEntry; numbers: Map<string, number>; now: number }) {
  const [confirming, setConfirming] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const retry = async () => {
    setProblem(null);
    try {
      await retryAttention(item.mutationId);
      void requestSync();
    } catch (err) {
      setProblem(err instanceof RecordError ? err.message : "Could not send it again.");
    }
  };
  return (
    <li className="flex flex-col gap-3 rounded-xl border-2 border-bad bg-surface p-3" data-testid="attention-item">
      <ChangeLine entry={item} numbers={numbers} now={now} />
      <p className="rounded-lg bg-bad-soft px-3 py-2 text-base">
        <span className="font-bold">The server said: </span>
        {item.reason.message}
        {item.uploadError ? <span className="block text-sm">Photo upload: {item.uploadError}</span> : null}
      </p>
      {problem ? <p role="alert" className="font-semibold text-bad">{problem}</p> : null}
      {confirming ? (
        <div className="flex flex-col gap-2" role="group" aria-label="Confirm dismiss">
          <p className="font-semibold">Dismiss for good? This change will not be sent, and this cannot be undone.</p>
          <div className="grid grid-cols-2 gap-2">
            <Button variant="secondary" size="bench" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
            <Button variant="danger" size="bench" onClick={() => void dismissAttention(item.mutationId)}>
              Dismiss
            </Button>
          </div>
        </div>
      ) : (
        <div className="grid grid-cols-2 gap-2">
          <Button variant="secondary" size="bench" onClick={() => void retry()}>
            <RotateCcw size={20} aria-hidden /> Try again
          </Button>
          <Button variant="ghost" size="bench" onClick={() => setConfirming(true)}>
            <Trash size={20} aria-hidden /> Dismiss…
          </Button>
        </div>
      )}
    </li>
  );
}

function SignOut({ waiting, attention }: { waiting: number; attention: number }) {
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const live = useLiveSync();
  const held = waiting + attention;
  const signOut = async () => {
    setBusy(true);
    await markSignedOut();
    await signOutAction();
  };
  if (!asking) {
    return (
      <Button variant="secondary" size="bench" onClick={() => (held ? setAsking(true) : void signOut())} disabled={busy || !live.online}>
        <LogOut size={20} aria-hidden /> Sign out of this phone
      </Button>
    );
  }
  return (
    <div className="flex flex-col gap-3" role="alertdialog" aria-labelledby="signout-title">
      <Notice tone="bad" title={<span id="signout-title">{held} change{held === 1 ? "" : "s"} not sent yet</span>}>
        If you sign out now they stay on this phone and go out the next time you sign in here. Nobody else can send
        them. Sync first if you can.
      </Notice>
      <div className="grid grid-cols-2 gap-2">
        <Button size="bench" onClick={() => { setAsking(false); void requestSync(); }}>
          Sync first
        </Button>
        <Button variant="danger" size="bench" disabled={busy || !live.online} onClick={() => void signOut()}>
          Sign out anyway
        </Button>
      </div>
    </div>
  );
}

/** /bench/sync: sync now, progress, what is waiting, what needs attention, sign in again, sign out. */
export function SyncPage() {
  const session = useDeviceSession();
  const live = useLiveSync();
  const status = useSyncStatus();
  const now = useNow(15_000);
  const numbers = useTicketNumbers();
  const outbox = useLiveQuery(() => outboxEntries(), [], []);
  const attention = useLiveQuery(() => attentionEntries(), [], []);
  const waiting = status?.waiting ?? 0;
  const p = live.progress;
  const offline = !live.online;

  return (
    <BenchShell title="Sync" status={<SyncBadge />}>
      <div className="flex flex-col gap-5">
        {session.kind === "blocked" ? (
          <Notice tone="bad" title={`${session.previous.name}'s work is still on this phone`}>
            {session.waiting + session.needsAttention} change{session.waiting + session.needsAttention === 1 ? "" : "s"} recorded by{" "}
            {session.previous.name} have not been sent. Sign out, then sign in as {session.previous.name} to send them first —
            your work and theirs are never mixed.
          </Notice>
        ) : null}
        {session.kind === "signed-out" ? (
          <Notice tone="info" title="Not signed in on this phone">
            Sign in once with a network; after that the bench works here even with no signal.
          </Notice>
        ) : null}

        <section aria-labelledby="sync-now" className="flex flex-col gap-3 rounded-2xl border border-line bg-surface p-4">
          <h2 id="sync-now" className="text-lg font-bold">
            {offline ? "Offline · " : ""}
            {waiting
              ? `${waiting} change${waiting === 1 ? "" : "s"} waiting to go out`
              : attention.length
                ? `Nothing waiting · ${attention.length} need${attention.length === 1 ? "s" : ""} attention`
                : "Everything recorded here is sent"}
          </h2>
          <p className="text-muted">
            {status?.lastSyncAt ? `Last synced ${timeAgo(status.lastSyncAt, now)}` : "Not synced yet"}
            {status?.user ? ` · ${status.user.name}` : ""} · {status?.tickets ?? 0} ticket{status?.tickets === 1 ? "" : "s"} on this phone
          </p>
          {status?.sessionExpired ? (
            <div className="flex flex-col gap-2">
              <Notice tone="bad" title="Your sign-in has expired">
                Your changes are kept on this phone. Sign in again and they go out.
              </Notice>
              <ButtonLink href={SIGN_IN_AGAIN} size="bench">
                Sign in again
              </ButtonLink>
            </div>
          ) : status?.lastError && status.lastError.code !== "offline" ? (
            <Notice tone="bad" title="The last sync did not finish">
              {status.lastError.message}
            </Notice>
          ) : offline && waiting ? (
            <Notice tone="info">Your changes are safe on this phone; they go out when the network is back.</Notice>
          ) : null}
          {live.running ? (
            <div className="flex flex-col gap-1" role="status" aria-live="polite">
              <div className="h-3 overflow-hidden rounded-full bg-surface-2">
                <div
                  className="h-3 rounded-full bg-accent transition-[width]"
                  style={{
                    width: `${Math.round(
                      Math.max(0.05, p ? (p.phase === "pull" ? p.pulled / Math.max(1, p.pulled + p.remaining) : p.pushed / Math.max(1, p.toPush)) : 0) * 100,
                    )}%`,
                  }}
                />
              </div>
              <p className="text-sm font-semibold">
                {!p || p.phase === "idle"
                  ? "Starting…"
                  : p.phase === "pull"
                    ? `Receiving changes: ${p.pulled.toLocaleString()}${p.remaining ? ` (about ${p.remaining.toLocaleString()} to go)` : ""}`
                    : p.phase === "photos"
                      ? `Uploading photos · ${p.pushed} of ${p.toPush} changes sent`
                      : `Sending ${p.pushed} of ${p.toPush} changes`}
              </p>
            </div>
          ) : null}
          <Button
            size="bench"
            variant={status?.sessionExpired ? "secondary" : "primary"}
            onClick={() => void requestSync()}
            disabled={live.running || session.kind !== "ready"}
          >
            <RefreshCw size={22} aria-hidden className={live.running ? "animate-spin" : undefined} />
            {live.running ? "Syncing…" : "Sync now"}
          </Button>
        </section>

        {attention.length ? (
          <section aria-labelledby="attention" className="flex flex-col gap-3">
            <h2 id="attention" className="text-lg font-bold">
              Needs attention ({attention.length})
            </h2>
            <p className="text-muted">The server did not take these changes. Read why, then try again or dismiss.</p>
            <ul className="flex flex-col gap-3">
              {attention.map((a) => (
                <AttentionItem key={a.mutationId} item={a} numbers={numbers} now={now} />
              ))}
            </ul>
          </section>
        ) : null}

        {outbox.length ? (
          <section aria-labelledby="waiting" className="flex flex-col gap-2">
            <h2 id="waiting" className="text-lg font-bold">
              Waiting to send ({outbox.length})
            </h2>
            <ol className="flex flex-col divide-y divide-line rounded-xl border border-line bg-surface">
              {outbox.slice(0, 50).map((e) => (
                <li key={e.seq} className="px-3 py-2" data-testid="outbox-item">
                  <ChangeLine entry={e} numbers={numbers} now={now} />
                </li>
              ))}
            </ol>
            {outbox.length > 50 ? <p className="text-muted">…and {outbox.length - 50} more.</p> : null}
          </section>
        ) : null}

        {session.kind === "ready" ? (
          <details className="rounded-xl border border-line bg-surface px-3 py-2">
            <summary className="tap flex cursor-pointer items-center font-semibold">Something looks wrong?</summary>
            <p className="py-2 text-muted">
              Fetch this phone&apos;s copy of the shop again from the server. Changes waiting here stay and go out first.
            </p>
            <Button
              variant="secondary"
              size="bench"
              className="mb-2 w-full"
              disabled={live.running || offline}
              onClick={() => void refetchEverything().then(() => requestSync())}
            >
              Fetch everything again
            </Button>
          </details>
        ) : null}

        {session.kind === "ready" || session.kind === "blocked" ? (
          <section aria-label="Sign out" className="flex flex-col gap-2 border-t border-line pt-4">
            <SignOut waiting={waiting} attention={status?.needsAttention ?? 0} />
            {offline ? <p className="text-sm text-muted">Signing out needs the network.</p> : null}
          </section>
        ) : (
          <ButtonLink href={SIGN_IN_AGAIN} size="bench">
            Sign in
          </ButtonLink>
        )}
      </div>
    </BenchShell>
  );
}
