import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PackagePlus } from "lucide-react";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { machineHistory } from "@/lib/counter/history";
import { getShopSettings } from "@/lib/shop/settings";
import { ENGINE_TYPE_LABELS } from "@/lib/tickets/machine";
import { formatTagCode } from "@/lib/trade/tag-code";
import { PageHeader } from "@/components/ui/page-header";
import { ButtonLink } from "@/components/ui/button";
import { PrintPanel } from "@/components/counter/print-panel";
import { GiveStickerForm } from "@/components/counter/ticket-forms";
import { TicketHistoryList } from "@/components/counter/history-list";

export const metadata: Metadata = { title: "Machine history" };

export default async function MachineHistoryPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageUser(`/counter/history/machines/${id}`, "counter", "owner");
  const db = getDb();
  const h = machineHistory(db, id);
  if (!h) notFound();
  const { machine: m } = h;
  const tz = getShopSettings(db).timezone;
  return (
    <>
      <PageHeader
        title={`${m.make} ${m.model}`.trim()}
        subtitle={`${m.kindLabel} · ${ENGINE_TYPE_LABELS[h.engineType]}${m.serial ? ` · s/n ${m.serial}` : ""}`}
        actions={
          <ButtonLink href={`/counter/intake?machine=${m.id}`}>
            <PackagePlus size={20} aria-hidden /> Take it in again
          </ButtonLink>
        }
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <section aria-labelledby="tickets" className="rounded-2xl border border-line bg-surface p-4 md:p-6">
          <h2 id="tickets" className="mb-3 text-xl font-bold">
            Tickets ({h.tickets.length})
          </h2>
          <TicketHistoryList tickets={h.tickets} tz={tz} />
        </section>
        <div className="flex flex-col gap-6">
          <section aria-labelledby="owner" className="rounded-2xl border border-line bg-surface p-4 md:p-6">
            <h2 id="owner" className="mb-2 text-xl font-bold">
              Owner
            </h2>
            {h.owner ? (
              <p>
                <Link href={`/counter/history/customers/${h.owner.id}`} className="font-semibold underline underline-offset-4">
                  {h.owner.firstName} {h.owner.lastName}
                </Link>
                <span className="block text-muted">{[h.owner.phone, h.owner.email].filter(Boolean).join(" · ")}</span>
              </p>
            ) : (
              <p className="text-muted">No customer on file.</p>
            )}
          </section>
          <section aria-labelledby="sticker" className="rounded-2xl border border-line bg-surface p-4 md:p-6">
            <h2 id="sticker" className="mb-2 text-xl font-bold">
              Permanent sticker
            </h2>
            {m.stickerCode ? (
              <div className="flex flex-col gap-3">
                <p className="font-mono text-2xl font-bold">{formatTagCode(m.stickerCode)}</p>
                <p className="text-muted">Scanning it opens the machine&apos;s open ticket, or this history when none is open.</p>
                <PrintPanel href={`/api/labels/machines/${m.id}`} what="sticker" idPrefix="sticker" />
              </div>
            ) : (
              <div className="flex flex-col gap-3">
                <p className="text-muted">A sticker stays on the machine for good; scanning it finds the machine on every visit.</p>
                <GiveStickerForm machineId={m.id} back={`/counter/history/machines/${m.id}`} />
              </div>
            )}
          </section>
        </div>
      </div>
    </>
  );
}
