"use client";

import { AlertText } from "@/components/ui/alert-text";
import { useEffect, useState } from "react";
import { Pause, Play } from "lucide-react";
import { ChoiceChips } from "../choice-chips";
import { formatClock, laborTotal } from "@/lib/bench/sheet";
import { BENCH_STATUSES, type LaborEntryRow, type TicketNoteRow, type TicketRow } from "@/lib/sync/protocol";
import { STATUS_LABELS } from "@/lib/tickets/status";
import type { useRecord } from "./use-record";

type Save = ReturnType<typeof useRecord>["save"];

function useTick(on: boolean, ms = 1000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    setNow(Date.now());
    if (!on) return;
    const t = setInterval(() => setNow(Date.now()), ms);
    return () => clearInterval(t);
  }, [on, ms]);
  return now;
}

/**
 * The labor timer of a ticket: start, pause, start again. Stored as start and end times on the phone, so it keeps
 * counting through a reload, a closed tab or no network; the total is every stretch of work summed.
 */
export function LaborTimer({ ticketId, rows, userId, save, disabled }: { ticketId: string; rows: readonly LaborEntryRow[]; userId: string | null; save: Save; disabled: boolean }) {
  const running = rows.some((r) => r.endedAt === null && r.userId === userId);
  const now = useTick(running);
  const total = laborTotal(rows, userId, now);
  const [error, setError] = useState<string | null>(null);
  return (
    <section aria-label="Labor timer" className="flex items-center justify-between gap-3 rounded-2xl border-2 border-line bg-surface p-3">
      <div>
        <p className="text-sm font-bold uppercase tracking-wider text-ink-2">{total.running ? "Timer running" : rows.length ? "Timer paused" : "Labor"}</p>
        <p className="text-3xl font-black tabular-nums" data-testid="labor-clock">
          {formatClock(total.seconds)}
        </p>
        <p className="text-sm text-ink-2" data-testid="labor-minutes">
          {total.minutes} min on this ticket
        </p>
        <AlertText message={error} />
      </div>
      {total.running ? (
        <button
          type="button"
          disabled={disabled}
          onClick={async () => {
            const r = await save("labor.stopped", { id: total.running!.id });
            setError(r.ok ? null : r.message);
          }}
          className="tap-bench inline-flex min-w-32 items-center justify-center gap-2 rounded-2xl border-2 border-ink bg-surface-2 px-5 text-lg font-bold disabled:opacity-50"
        >
          <Pause aria-hidden /> Pause
        </button>
      ) : (
        <button
          type="button"
          disabled={disabled}
          onClick={async () => {
            const r = await save("labor.started", { ticketId });
            setError(r.ok ? null : r.message);
          }}
          className="tap-bench inline-flex min-w-32 items-center justify-center gap-2 rounded-2xl bg-ok px-5 text-lg font-bold text-white disabled:opacity-50 dark:text-black"
        >
          <Play aria-hidden /> {rows.length ? "Resume" : "Start timer"}
        </button>
      )}
    </section>
  );
}

/** The statuses a bench may set (handing back is done at the counter). */
export function StatusPicker({ ticket, save, disabled }: { ticket: TicketRow; save: Save; disabled: boolean }) {
  const [error, setError] = useState<string | null>(null);
  const options = BENCH_STATUSES.map((s) => ({ id: s, label: STATUS_LABELS[s] }));
  const benchSettable = (BENCH_STATUSES as readonly string[]).includes(ticket.status);
  return (
    <div className="flex flex-col gap-2">
      {!benchSettable ? <p className="text-base">Now: {STATUS_LABELS[ticket.status]}</p> : null}
      <ChoiceChips
        label="Status"
        mode="single"
        options={options}
        value={benchSettable ? [ticket.status] : []}
        disabled={disabled}
        error={error ?? undefined}
        onChange={async (v) => {
          const status = v[0] as (typeof BENCH_STATUSES)[number] | undefined;
          if (!status) return;
          const r = await save("ticket.status_changed", { ticketId: ticket.id, status });
          setError(r.ok ? null : r.message);
        }}
      />
    </div>
  );
}

const timeOf = (iso: string) => new Date(iso).toLocaleString([], { weekday: "short", hour: "numeric", minute: "2-digit" });

/** Notes on the ticket (added, never edited: a correction is another note). */
export function TicketNotes({ ticketId, notes, save, disabled, waiting }: { ticketId: string; notes: readonly TicketNoteRow[]; save: Save; disabled: boolean; waiting: Set<string> }) {
  const [text, setText] = useState("");
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      {notes.length ? (
        <ul className="flex flex-col gap-2">
          {notes.map((n) => (
            <li key={n.id} className="rounded-xl bg-surface-2 px-3 py-2">
              <p className="whitespace-pre-wrap text-base">{n.text}</p>
              <p className="text-sm text-ink-2">
                {timeOf(n.at)}
                {waiting.has(n.id) ? " · not sent yet" : ""}
              </p>
            </li>
          ))}
        </ul>
      ) : null}
      <label htmlFor="ticket-note" className="text-lg font-bold">
        Add a note
      </label>
      <textarea id="ticket-note" rows={3} maxLength={4000} value={text} onChange={(e) => setText(e.target.value)} className="rounded-2xl border-2 border-line bg-surface px-4 py-3 text-lg" />
      <AlertText message={error} />
      <button
        type="button"
        disabled={disabled || text.trim() === ""}
        onClick={async () => {
          const r = await save("ticket.note_added", { ticketId, text: text.trim() });
          if (r.ok) setText("");
          setError(r.ok ? null : r.message);
        }}
        className="tap-bench self-start rounded-2xl bg-accent px-6 text-lg font-bold text-accent-ink disabled:opacity-50"
      >
        Save note
      </button>
    </div>
  );
}
