"use client";

import { useId, useRef, useState } from "react";
import { ArrowRightLeft } from "lucide-react";
import { OPEN_STATUSES, STATUS_LABELS, type TicketStatus } from "@/lib/tickets/status";
import { formatTagCode } from "@/lib/trade/tag-code";
import { buttonClass } from "@/components/ui/button";
import { ApiError, postJson } from "./api";

export interface TicketRef {
  id: string;
  number: number;
  tagCode: string;
  status: TicketStatus;
}

/** "Move" opens a dialog: pick the next status, add a reason if there is one. */
export function MoveStatusButton({ ticket, onMoved, compact = false }: { ticket: TicketRef; onMoved: () => void; compact?: boolean }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [to, setTo] = useState<TicketStatus | "">("");
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const titleId = useId();
  const choices = OPEN_STATUSES.filter((s) => s !== ticket.status);

  function open() {
    setTo("");
    setReason("");
    setError(null);
    dialog.current?.showModal();
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!to) {
      setError("Choose the new status.");
      return;
    }
    setPending(true);
    setError(null);
    try {
      await postJson(`/api/counter/tickets/${ticket.id}/status`, { from: ticket.status, to, reason });
      dialog.current?.close();
      onMoved();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not move the ticket.");
      if (err instanceof ApiError && err.status === 409) onMoved();
    } finally {
      setPending(false);
    }
  }

  return (
    <>
      <button type="button" onClick={open} className={buttonClass("secondary", "md", compact ? "px-3" : "")} aria-label={`Move #${ticket.number} to another status`}>
        <ArrowRightLeft size={18} aria-hidden />
        Move
      </button>
      <dialog
        ref={dialog}
        aria-labelledby={titleId}
        className="m-auto w-[min(34rem,calc(100vw-2rem))] rounded-2xl border-2 border-line bg-surface p-0 text-ink backdrop:bg-black/50"
      >
        <form onSubmit={submit} className="flex flex-col gap-4 p-5">
          <h2 id={titleId} className="text-xl font-bold">
            Move #{ticket.number} <span className="font-mono">{formatTagCode(ticket.tagCode)}</span>
          </h2>
          <p className="text-muted">
            Now: <span className="font-semibold text-ink">{STATUS_LABELS[ticket.status]}</span>
          </p>
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-2 font-semibold">New status</legend>
            <div className="grid gap-2 sm:grid-cols-2">
              {choices.map((s) => (
                <label key={s} className="tap flex items-center gap-3 rounded-xl border-2 border-line px-3 has-[:checked]:border-accent has-[:checked]:bg-accent-soft">
                  <input type="radio" name="to" value={s} checked={to === s} onChange={() => setTo(s)} className="size-5" />
                  {STATUS_LABELS[s]}
                </label>
              ))}
            </div>
          </fieldset>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${titleId}-reason`} className="font-semibold">
              Reason <span className="font-normal text-muted">(optional, kept in the history)</span>
            </label>
            <input
              id={`${titleId}-reason`}
              value={reason}
              maxLength={300}
              onChange={(e) => setReason(e.target.value)}
              className="tap rounded-xl border-2 border-line bg-surface px-4 text-lg focus:border-accent"
            />
          </div>
          {error ? (
            <p role="alert" className="rounded-xl border-l-8 border-bad bg-bad-soft px-3 py-2 font-semibold">
              {error}
            </p>
          ) : null}
          <div className="flex flex-wrap justify-end gap-3">
            <button type="button" className={buttonClass("ghost")} onClick={() => dialog.current?.close()}>
              Cancel
            </button>
            <button type="submit" className={buttonClass("primary")} disabled={pending}>
              {pending ? "Moving…" : "Move ticket"}
            </button>
          </div>
        </form>
      </dialog>
    </>
  );
}

/** The technician of a ticket, changed in place. */
export function TechSelect({
  ticket,
  techId,
  techs,
  onChanged,
  className = "",
}: {
  ticket: Pick<TicketRef, "id" | "number">;
  techId: string | null;
  techs: Array<{ id: string; name: string }>;
  onChanged: () => void;
  className?: string;
}) {
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [value, setValue] = useState(techId ?? "");
  const [seen, setSeen] = useState(techId);
  if (seen !== techId) {
    setSeen(techId);
    setValue(techId ?? "");
  }
  async function change(next: string) {
    setValue(next);
    setPending(true);
    setError(null);
    try {
      await postJson(`/api/counter/tickets/${ticket.id}/tech`, { techId: next || null });
      onChanged();
    } catch (err) {
      setValue(techId ?? "");
      setError(err instanceof ApiError ? err.message : "Could not assign.");
    } finally {
      setPending(false);
    }
  }
  const known = !techId || techs.some((t) => t.id === techId);
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <select
        aria-label={`Technician for #${ticket.number}`}
        value={value}
        disabled={pending}
        onChange={(e) => change(e.target.value)}
        className="tap w-full min-w-40 rounded-xl border-2 border-line bg-surface px-2 text-base"
      >
        <option value="">Unassigned</option>
        {techs.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name}
          </option>
        ))}
        {!known ? <option value={techId!}>(switched off)</option> : null}
      </select>
      {error ? (
        <p role="alert" className="text-sm font-semibold text-bad">
          {error}
        </p>
      ) : null}
    </div>
  );
}
