import { STATUS_LABELS, type TicketStatus } from "@/lib/tickets/status";

const TONES: Record<TicketStatus, string> = {
  taken_in: "bg-surface-2 text-ink border-line",
  on_bench: "bg-accent-soft text-ink border-accent",
  awaiting_ok: "bg-surface text-ink border-accent border-dashed",
  awaiting_parts: "bg-surface text-ink border-ink-2 border-dashed",
  in_repair: "bg-accent-soft text-ink border-accent",
  ready: "bg-ok-soft text-ink border-ok",
  handed_back: "bg-surface-2 text-muted border-line",
  returned_unrepaired: "bg-surface-2 text-muted border-line",
};

/** A ticket's status in words, never by colour alone. */
export function StatusBadge({ status }: { status: TicketStatus }) {
  return (
    <span className={`inline-flex items-center rounded-lg border-2 px-2 py-0.5 text-sm font-semibold whitespace-nowrap ${TONES[status]}`}>
      {STATUS_LABELS[status]}
    </span>
  );
}
