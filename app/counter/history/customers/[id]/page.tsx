import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PackagePlus } from "lucide-react";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { customerHistory } from "@/lib/counter/history";
import { getShopSettings } from "@/lib/shop/settings";
import { CONTACT_LABELS } from "@/lib/tickets/intake";
import { PageHeader } from "@/components/ui/page-header";
import { ButtonLink } from "@/components/ui/button";
import { TicketHistoryList } from "@/components/counter/history-list";

export const metadata: Metadata = { title: "Customer history" };

export default async function CustomerHistoryPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageUser(`/counter/history/customers/${id}`, "counter", "owner");
  const db = getDb();
  const h = customerHistory(db, id);
  if (!h) notFound();
  const c = h.customer;
  const tz = getShopSettings(db).timezone;
  return (
    <>
      <PageHeader
        title={`${c.firstName} ${c.lastName}`.trim()}
        subtitle={`${[c.phone, c.email].filter(Boolean).join(" · ")} · reach by ${CONTACT_LABELS[c.contactPreference].toLowerCase()}${c.emailConsent ? " · agrees to e-mail" : ""}`}
        actions={
          <ButtonLink href={`/counter/intake?customer=${c.id}`}>
            <PackagePlus size={20} aria-hidden /> Take in a machine for them
          </ButtonLink>
        }
      />
      {h.machines.length ? (
        <div className="flex flex-col gap-6">
          {h.machines.map(({ machine: m, tickets }) => (
            <section key={m.id} aria-labelledby={`m-${m.id}`} className="rounded-2xl border border-line bg-surface p-4 md:p-6">
              <h2 id={`m-${m.id}`} className="mb-3 text-xl font-bold">
                <Link href={`/counter/history/machines/${m.id}`} className="underline-offset-4 hover:underline">
                  {m.make} {m.model}
                </Link>{" "}
                <span className="text-base font-normal text-muted">
                  · {m.kindLabel}
                  {m.serial ? ` · s/n ${m.serial}` : ""}
                </span>
              </h2>
              <TicketHistoryList tickets={tickets} tz={tz} />
            </section>
          ))}
        </div>
      ) : (
        <p className="text-muted">No machines on file yet.</p>
      )}
    </>
  );
}
