import { ClipboardCheck } from "lucide-react";

/**
 * The bench sheet as synced from the technicians' phones: entries, photos, findings, tune log, labor
 * time, and sync conflicts to resolve. Its tables arrive with the sync engine; until then this section
 * says so. Wire it here (one place) once they are on main.
 */
export function BenchSheetSection({ ticketId, compact = false }: { ticketId: string; compact?: boolean }) {
  if (compact) {
    // Inside a history list: a plain block, not a landmark (there is one per ticket).
    return (
      <div data-bench-sheet={ticketId}>
        <p className="text-base font-semibold">Findings and parts</p>
        <p className="text-muted">No bench work synced yet.</p>
      </div>
    );
  }
  return (
    <section aria-labelledby={`bench-${ticketId}`} className="rounded-2xl border border-line bg-surface p-4 md:p-6" data-bench-sheet={ticketId}>
      <h2 id={`bench-${ticketId}`} className="mb-2 flex items-center gap-2 text-xl font-bold">
        <ClipboardCheck size={22} aria-hidden />
        Bench sheet
      </h2>
      <p className="text-muted">No bench work synced yet.</p>
    </section>
  );
}
