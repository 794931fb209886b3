"use client";

import { useEffect, useRef, useState, type ReactNode } from "react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useLiveQuery } from "dexie-react-hooks";
import { CloudDownload, CloudOff, LoaderCircle, RefreshCw, ScanLine, Search } from "lucide-react";
import { BenchShell } from "./bench-shell";
import { LazyTagScanner, ManualTagEntry } from "./scanner";
import { benchTicketHref } from "./today-card";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";
import { SyncBadge } from "@/components/sync/sync-badge";
import { useLiveSync, useNow, useSyncStatus } from "@/components/sync/use-sync";
import { explainTagAnswer, NO_NETWORK_TEXT, type OnlineOutcome } from "@/lib/bench/scan-lookup";
import { machineBySticker, ticketByTag, ticketById } from "@/lib/sync/read";
import { requestSync } from "@/lib/sync/scheduler";
import { timeAgo } from "@/lib/sync/describe";
import { formatTagCode } from "@/lib/trade/tag-code";

/** What this phone holds for a code: its ticket (by repair tag, or by machine sticker → open ticket), or nothing. */
type DeviceFind =
  | { code: string; ticketId: string; number: number }
  | { code: string; ticketId: null; machine: string | null }
  | { code: string; ticketId: null; failed: true };

async function findOnDevice(code: string): Promise<DeviceFind> {
  const byTag = await ticketByTag(code);
  if (byTag) return { code, ticketId: byTag.ticket.id, number: byTag.ticket.number };
  const bySticker = await machineBySticker(code);
  if (bySticker?.openTicket) return { code, ticketId: bySticker.openTicket.id, number: bySticker.openTicket.number };
  return { code, ticketId: null, machine: bySticker ? `${bySticker.machine.make} ${bySticker.machine.model}` : null };
}

type Online =
  | { kind: "idle" }
  | { kind: "asking" }
  | { kind: "answer"; outcome: OnlineOutcome }
  | { kind: "syncing"; outcome: Extract<OnlineOutcome, { kind: "sync-and-open" }> }
  | { kind: "not-arrived"; outcome: Extract<OnlineOutcome, { kind: "sync-and-open" }>; text: string };

async function askServer(code: string): Promise<OnlineOutcome> {
  let res: Response;
  try {
    res = await fetch(`/api/tags/${encodeURIComponent(code)}`, { cache: "no-store", credentials: "same-origin" });
  } catch {
    return explainTagAnswer(code, null);
  }
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // not JSON: explained by the status alone
  }
  return explainTagAnswer(code, { status: res.status, body });
}

/**
 * Scan a tag: the camera scanner (loaded on this screen only) with typing as the fallback. A read code is looked up
 * on this phone (repair tag, then a machine's permanent sticker) and its ticket opens at once. A code the phone does
 * not hold says so, and while online the shop's server can be asked what it is; an open ticket there is brought to
 * the phone by a sync and then opened. The lookup is live: a sync that brings the ticket in opens it too.
 */
export function ScanScreen() {
  const router = useRouter();
  const [code, setCode] = useState<string | null>(null);
  const [round, setRound] = useState(0);
  const [online, setOnline] = useState<Online>({ kind: "idle" });
  const manualRef = useRef<HTMLInputElement>(null);
  const live = useLiveSync();
  const status = useSyncStatus();
  const now = useNow();

  // Read again after each sync too (see components/bench/today-list.tsx): a sync that brings the ticket opens it.
  const synced = status ? `${status.tickets}:${status.lastSyncAt ?? ""}:${status.cursor}` : "";
  const found = useLiveQuery(() => (code ? findOnDevice(code).catch((): DeviceFind => ({ code, ticketId: null, failed: true })) : null), [code, synced]);
  const current = found && found.code === code ? found : undefined;
  const openId = current?.ticketId ?? null;

  useEffect(() => {
    if (openId) router.replace(benchTicketHref(openId));
  }, [openId, router]);

  const read = (c: string) => {
    setOnline({ kind: "idle" });
    setCode(c);
  };
  const again = () => {
    setCode(null);
    setOnline({ kind: "idle" });
    setRound((n) => n + 1);
  };

  const lookOnline = async (c: string) => {
    setOnline({ kind: "asking" });
    const outcome = await askServer(c);
    setOnline({ kind: "answer", outcome });
  };

  const syncAndOpen = async (outcome: Extract<OnlineOutcome, { kind: "sync-and-open" }>) => {
    setOnline({ kind: "syncing", outcome });
    const result = await requestSync();
    const card = await ticketById(outcome.ticketId);
    if (card) {
      router.replace(benchTicketHref(card.ticket.id));
      return;
    }
    const text =
      result === null
        ? "Another window is syncing right now. Try again in a moment."
        : !result.ok
          ? result.error.message
          : "The sync finished, but the ticket did not come to this phone. Ask the counter to check it.";
    setOnline({ kind: "not-arrived", outcome, text });
  };

  const tag = code ? formatTagCode(code) : "";

  return (
    <BenchShell title="Scan tag" status={<SyncBadge />}>
      <div className="flex flex-col gap-6">
        {code ? (
          <section aria-label="Scanned tag" className="flex flex-col gap-4">
            <div className="rounded-2xl border-2 border-ok bg-ok-soft px-4 py-4">
              <p className="text-base font-semibold">Tag</p>
              <p className="font-mono text-5xl font-black tracking-widest" data-testid="tag-code">
                {tag}
              </p>
            </div>
            <div aria-live="polite" className="flex flex-col gap-4">
              {current === undefined ? (
                <LookupStatus>Looking up…</LookupStatus>
              ) : "failed" in current ? (
                <Notice tone="bad" title="This phone's store could not be read">
                  Reload the app. If it keeps happening, ask the counter to open the ticket.
                </Notice>
              ) : current.ticketId !== null ? (
                <LookupStatus>Opening ticket #{current.number}…</LookupStatus>
              ) : (
                <div className="flex flex-col gap-4" data-testid="not-on-phone">
                  <div className="rounded-2xl border-2 border-line bg-surface px-4 py-4">
                    <h2 className="text-2xl font-bold leading-tight">Tag {tag} is not on this phone</h2>
                    <p className="mt-2 text-lg">
                      {current.machine
                        ? `It is the sticker of the ${current.machine}, which has no open ticket on this phone.`
                        : "It may be a ticket the counter took in after this phone last synced."}{" "}
                      <span className="text-ink-2">
                        Last synced: {status?.lastSyncAt ? timeAgo(status.lastSyncAt, now) : "never"}.
                      </span>
                    </p>
                  </div>
                  {live.online ? (
                    <OnlinePart
                      state={online}
                      running={live.running}
                      onLook={() => void lookOnline(code)}
                      onSyncAndOpen={(o) => void syncAndOpen(o)}
                    />
                  ) : (
                    <div role="status" className="flex items-start gap-3 rounded-2xl border-l-8 border-bad bg-bad-soft px-4 py-3 text-lg font-semibold">
                      <CloudOff aria-hidden size={26} className="mt-0.5 shrink-0" />
                      {NO_NETWORK_TEXT}
                    </div>
                  )}
                  <p className="text-base text-ink-2">
                    A sync brings the shop&apos;s newest tickets to this phone:{" "}
                    <Link href="/bench/sync" prefetch={false} className="font-bold text-ink underline">
                      open Sync
                    </Link>
                    .
                  </p>
                </div>
              )}
            </div>
            <button type="button" onClick={again} className={buttonClass("secondary", "bench", "rounded-2xl font-bold")}>
              <ScanLine aria-hidden size={24} /> Scan another tag
            </button>
          </section>
        ) : (
          <>
            <LazyTagScanner key={round} onCode={read} onTypeInstead={() => manualRef.current?.focus()} />
            <ManualTagEntry onCode={read} inputRef={manualRef} />
          </>
        )}
      </div>
    </BenchShell>
  );
}

function LookupStatus({ children }: { children: ReactNode }) {
  return (
    <div role="status" className="flex items-center gap-3 rounded-2xl bg-surface-2 px-4 py-4 text-lg font-semibold" data-testid="ticket-lookup">
      <LoaderCircle aria-hidden size={26} className="animate-spin" />
      {children}
    </div>
  );
}

function OnlinePart({
  state,
  running,
  onLook,
  onSyncAndOpen,
}: {
  state: Online;
  running: boolean;
  onLook: () => void;
  onSyncAndOpen: (o: Extract<OnlineOutcome, { kind: "sync-and-open" }>) => void;
}) {
  if (state.kind === "idle" || state.kind === "asking") {
    return (
      <button type="button" onClick={onLook} disabled={state.kind === "asking"} className={buttonClass("primary", "bench", "rounded-2xl font-bold")}>
        {state.kind === "asking" ? <LoaderCircle aria-hidden size={24} className="animate-spin" /> : <Search aria-hidden size={24} />}
        {state.kind === "asking" ? "Looking it up online…" : "Look it up online"}
      </button>
    );
  }
  const outcome = state.outcome;
  return (
    <div className="flex flex-col gap-3" data-testid="online-answer">
      <Notice tone={outcome.kind === "failed" || outcome.kind === "sign-in" ? "bad" : "info"} title={outcome.title}>
        {outcome.text}
        {state.kind === "not-arrived" ? <p className="mt-2 font-semibold">{state.text}</p> : null}
      </Notice>
      {outcome.kind === "sync-and-open" ? (
        <button
          type="button"
          onClick={() => onSyncAndOpen(outcome)}
          disabled={state.kind === "syncing"}
          className={buttonClass("primary", "bench", "rounded-2xl font-bold")}
        >
          {state.kind === "syncing" ? <RefreshCw aria-hidden size={24} className="animate-spin" /> : <CloudDownload aria-hidden size={24} />}
          {state.kind === "syncing" ? (running ? "Syncing…" : "Opening…") : "Sync now and open"}
        </button>
      ) : outcome.kind === "sign-in" ? (
        <a href={`/sign-in?next=${encodeURIComponent("/bench/scan")}`} className={buttonClass("primary", "bench", "rounded-2xl font-bold")}>
          Sign in again
        </a>
      ) : outcome.kind === "failed" ? (
        <button type="button" onClick={onLook} className={buttonClass("secondary", "bench", "rounded-2xl font-bold")}>
          <Search aria-hidden size={24} /> Try again
        </button>
      ) : null}
    </div>
  );
}
