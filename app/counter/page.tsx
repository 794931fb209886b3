import type { Metadata } from "next";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { listOpenTickets } from "@/lib/tickets/queries";
import { STATUS_LABELS } from "@/lib/tickets/status";
import { MACHINE_KIND_LABELS } from "@/lib/tickets/machine";
import { formatTagCode } from "@/lib/trade/tag-code";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Queue" };

export default async function QueuePage() {
  await requirePageUser("/counter", "counter", "owner");
  const rows = listOpenTickets(getDb());
  return (
    <>
      <PageHeader title="Queue" subtitle={`${rows.length} machines in the shop`} />
      {/* Focusable, so the table scrolls sideways from the keyboard too (axe: scrollable-region-focusable). */}
      <div role="region" aria-label="Machines in the shop" tabIndex={0} className="overflow-x-auto rounded-2xl border border-line bg-surface">
        <table className="w-full text-left">
          <thead className="bg-surface-2 text-sm uppercase tracking-wide text-muted">
            <tr>
              <th scope="col" className="px-4 py-3">Ticket</th>
              <th scope="col" className="px-4 py-3">Tag</th>
              <th scope="col" className="px-4 py-3">Customer</th>
              <th scope="col" className="px-4 py-3">Machine</th>
              <th scope="col" className="px-4 py-3">Status</th>
              <th scope="col" className="px-4 py-3">Tech</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((t) => (
              <tr key={t.id} className="border-t border-line">
                <td className="px-4 py-3 font-semibold">#{t.number}</td>
                <td className="px-4 py-3 font-mono">{formatTagCode(t.tagCode)}</td>
                <td className="px-4 py-3">{t.customerLastName}, {t.customerFirstName}</td>
                <td className="px-4 py-3">
                  {t.machineMake} {t.machineModel}
                  <span className="block text-sm text-muted">{MACHINE_KIND_LABELS[t.machineKind]}</span>
                </td>
                <td className="px-4 py-3">{STATUS_LABELS[t.status]}</td>
                <td className="px-4 py-3">{t.techName ?? "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
