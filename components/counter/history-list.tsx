import Link from "next/link";
import { RotateCcw } from "lucide-react";
import type { HistoryTicket } from "@/lib/counter/history";
import { formatDateTime } from "@/lib/counter/dates";
import { formatTagCode } from "@/lib/trade/tag-code";
import { StatusBadge } from "./status-badge";
import { BenchSheetSection } from "./bench-sheet-section";

/** A machine's tickets, newest first, each with its hand-back and comeback marks. */
export function TicketHistoryList({ tickets, tz }: { tickets: HistoryTicket[]; tz: string }) {
  if (!tickets.length) return <p className="text-muted">No tickets yet.</p>;
  return (
    <ol className="flex flex-col gap-3">
      {tickets.map((t) => (
        <li key={t.id} className="rounded-xl border border-line p-4">
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <Link href={`/counter/tickets/${t.id}`} className="font-mono text-xl font-bold underline-offset-4 hover:underline">
              {formatTagCode(t.tagCode)}
            </Link>
            <span className="text-muted">#{t.number}</span>
            <StatusBadge status={t.status} />
            {t.comebackOf ? (
              <span className="inline-flex items-center gap-1 rounded-md border border-ink-2 px-1.5 text-sm font-bold">
                <RotateCcw size={14} aria-hidden /> Comeback of #{t.comebackOf.number}
              </span>
            ) : null}
          </div>
          <p className="mt-1">{t.complaint}</p>
          <p className="mt-1 text-sm text-muted">
            Taken in {formatDateTime(tz, t.createdAt)}
            {t.techName ? ` · ${t.techName}` : ""}
            {t.handBack ? ` · ${t.handBack.outcome === "returned_unrepaired" ? "returned unrepaired" : "handed back"} to ${t.handBack.collectedBy}, ${formatDateTime(tz, t.handBack.collectedAt)}` : ""}
            {t.retiredCodes.length ? ` · earlier tags ${t.retiredCodes.map(formatTagCode).join(", ")}` : ""}
          </p>
          <div className="mt-2">
            <BenchSheetSection ticketId={t.id} compact />
          </div>
        </li>
      ))}
    </ol>
  );
}
