"use client";

import Link from "next/link";
import { Cloud, CloudCheck, CloudOff, CloudUpload, RefreshCw, TriangleAlert } from "lucide-react";
import { timeAgo } from "@/lib/sync/describe";
import { useLiveSync, useNow, useSyncStatus } from "./use-sync";

/**
 * The small sync status for every bench screen's header (BenchShell's `status` slot): online or not,
 * changes waiting, last synced, a progress bar with counts while syncing, and the needs-attention
 * count. Tapping it opens /bench/sync. It also starts the sync triggers.
 */
export function SyncBadge() {
  const live = useLiveSync();
  const status = useSyncStatus();
  const now = useNow();
  const waiting = status?.waiting ?? 0;
  const attention = status?.needsAttention ?? 0;
  const offline = !live.online || status?.lastError?.code === "offline";
  const p = live.progress;

  let Icon = Cloud;
  let title: string;
  let detail: string;
  let tone = "border-line";
  if (status?.sessionExpired) {
    Icon = TriangleAlert;
    title = "Sign in again";
    detail = waiting ? `${waiting} waiting` : "to sync";
    tone = "border-bad";
  } else if (live.running) {
    Icon = RefreshCw;
    title = "Syncing";
    detail = p?.phase === "pull" ? `${p.pulled} received` : p && p.toPush ? `${p.pushed}/${p.toPush} sent` : "…";
  } else if (offline) {
    Icon = CloudOff;
    title = "Offline";
    detail = waiting ? `${waiting} waiting` : status?.lastSyncAt ? `synced ${timeAgo(status.lastSyncAt, now)}` : "not synced yet";
  } else if (status?.lastError && status.lastError.code !== "not_signed_in") {
    Icon = TriangleAlert;
    title = "Sync problem";
    detail = waiting ? `${waiting} waiting` : "tap to see";
    tone = "border-bad";
  } else if (waiting) {
    Icon = CloudUpload;
    title = `${waiting} waiting`;
    detail = status?.lastSyncAt ? `synced ${timeAgo(status.lastSyncAt, now)}` : "not synced yet";
  } else if (!status?.lastSyncAt) {
    Icon = Cloud;
    title = "Not synced";
    detail = "yet";
  } else {
    Icon = CloudCheck;
    title = "Synced";
    detail = timeAgo(status.lastSyncAt, now);
  }
  const fraction = p ? (p.phase === "pull" ? (p.pulled + p.remaining ? p.pulled / (p.pulled + p.remaining) : 0) : p.toPush ? p.pushed / p.toPush : 0) : 0;

  return (
    <Link
      href="/bench/sync"
      // The service worker answers from the phone's own copy; a prefetch would only cost the first load.
      prefetch={false}
      data-testid="sync-badge"
      data-state={live.running ? "syncing" : offline ? "offline" : waiting ? "waiting" : status?.lastSyncAt ? "synced" : "never"}
      data-last-sync={status?.lastSyncAt ?? ""}
      className={`tap relative flex shrink-0 items-center gap-2 overflow-visible rounded-xl border-2 bg-surface py-1 pl-2.5 ${attention ? "pr-5" : "pr-2.5"} ${tone}`}
    >
      <Icon size={22} aria-hidden strokeWidth={2.2} className={live.running ? "animate-spin" : undefined} />
      {/* The accessible name is the visible text (WCAG 2.5.3 label in name), with a spoken prefix and separators. */}
      <span className="sr-only">Sync: </span>
      <span className="flex flex-col text-left leading-tight">
        <span className="text-sm font-bold">{title}</span>
        <span className="sr-only">, </span>
        <span className="text-xs font-medium text-muted">{detail}</span>
      </span>
      {attention ? <span className="sr-only">, {attention} need{attention === 1 ? "s" : ""} attention</span> : null}
      {attention ? (
        <span aria-hidden className="absolute -right-2 -top-2 grid min-w-6 place-items-center rounded-full bg-bad px-1.5 text-xs font-bold leading-6 text-white dark:text-black">
          {attention}
        </span>
      ) : null}
      {live.running ? (
        <span aria-hidden className="absolute inset-x-2 bottom-0.5 h-1 overflow-hidden rounded bg-surface-2">
          <span className="block h-1 rounded bg-accent transition-[width]" style={{ width: `${Math.round(Math.max(0.08, fraction) * 100)}%` }} />
        </span>
      ) : null}
    </Link>
  );
}
