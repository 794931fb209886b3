"use client";

import Link from "next/link";
import { CalendarClock, ChevronRight, CloudUpload } from "lucide-react";
import type { TicketCard } from "@/lib/sync/read";
import { notSyncedLabel, promisedLabel } from "@/lib/bench/today";
import { MACHINE_KIND_LABELS } from "@/lib/tickets/machine";
import { STATUS_LABELS } from "@/lib/tickets/status";
import { formatTagCode } from "@/lib/trade/tag-code";

/** The bench ticket screen's address for a ticket (one static, precached page reads `?id=`). */
export const benchTicketHref = (ticketId: string) => `/bench/ticket?id=${encodeURIComponent(ticketId)}`;

/** One ticket in today's work: the whole card is one big link to the ticket. */
export function TodayCard({ card, today }: { card: TicketCard; today: string }) {
  const { ticket, machine, customer, waiting } = card;
  const promised = ticket.promisedDate ? promisedLabel(ticket.promisedDate, today) : null;
  const machineName = machine ? `${machine.make} ${machine.model}`.trim() : "Machine not on this phone";
  return (
    <Link
      href={benchTicketHref(ticket.id)}
      // No prefetching: the service worker answers the ticket screen from the phone's own copy.
      prefetch={false}
      data-testid="today-card"
      data-ticket-number={ticket.number}
      className="tap-bench flex items-stretch gap-2 rounded-2xl border-2 border-line bg-surface px-4 py-3 text-ink active:border-accent active:bg-accent-soft"
    >
      <span className="flex min-w-0 flex-1 flex-col gap-1">
        <span className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
          <span className="text-2xl font-black">#{ticket.number}</span>
          <span className="font-mono text-lg font-bold tracking-wider text-ink-2">{formatTagCode(ticket.tagCode)}</span>
        </span>
        <span className="text-xl font-bold leading-snug">
          {machineName}
          {machine ? <span className="font-semibold text-ink-2"> · {MACHINE_KIND_LABELS[machine.kind]}</span> : null}
        </span>
        {customer ? <span className="text-lg text-ink-2">{customer.lastName}</span> : null}
        {ticket.complaint ? <span className="line-clamp-2 text-lg leading-snug">{ticket.complaint}</span> : null}
        <span className="mt-1 flex flex-wrap gap-2">
          <span data-testid="ticket-status" className="inline-flex items-center rounded-lg border-2 border-line px-2 py-0.5 text-base font-bold">
            {STATUS_LABELS[ticket.status]}
          </span>
          {promised ? (
            <span
              className={
                "inline-flex items-center gap-1.5 rounded-lg px-2 py-1 text-base font-bold " +
                (promised.overdue ? "bg-bad-soft text-bad" : promised.today ? "bg-accent-soft" : "bg-surface-2")
              }
            >
              <CalendarClock aria-hidden size={20} />
              {promised.text}
            </span>
          ) : null}
          {waiting > 0 ? (
            <span data-testid="not-synced" className="inline-flex items-center gap-1.5 rounded-lg border-2 border-bad px-2 py-0.5 text-base font-bold">
              <CloudUpload aria-hidden size={20} />
              {notSyncedLabel(waiting)}
            </span>
          ) : null}
        </span>
      </span>
      <ChevronRight aria-hidden size={28} className="shrink-0 self-center text-muted" />
    </Link>
  );
}
