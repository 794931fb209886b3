import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { Search } from "lucide-react";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { historySearch } from "@/lib/counter/history";
import { resolveTag } from "@/lib/counter/tags";
import { AppError } from "@/lib/http/errors";
import { checkTagCode, formatTagCode } from "@/lib/trade/tag-code";
import { PageHeader } from "@/components/ui/page-header";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";

export const metadata: Metadata = { title: "History" };

/** Where a scanned or typed code leads: a ticket's page, or for a sticker its open ticket or the machine's history. */
function destination(code: string): string | null {
  try {
    const r = resolveTag(getDb(), code);
    if (r.kind === "ticket") return `/counter/tickets/${r.ticketId}`;
    if (r.kind === "replaced") return `/counter/tickets/${r.ticketId}?replaced=${encodeURIComponent(code)}`;
    return r.openTicketId ? `/counter/tickets/${r.openTicketId}` : `/counter/history/machines/${r.machineId}`;
  } catch (err) {
    if (err instanceof AppError) return null;
    throw err;
  }
}

export default async function HistoryPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageUser("/counter/history", "counter", "owner");
  const sp = await searchParams;
  const q = typeof sp.q === "string" ? sp.q.trim().slice(0, 100) : "";
  const asCode = q ? checkTagCode(q) : null;
  if (asCode?.ok) {
    const to = destination(asCode.value);
    if (to) redirect(to);
  }
  const found = q.length >= 2 ? historySearch(getDb(), q) : null;
  return (
    <>
      <PageHeader title="History" subtitle="Every machine's and customer's earlier tickets. Scan or type a tag, a serial or a name." />
      <form method="get" className="mb-6 flex flex-wrap items-end gap-3" role="search">
        <div className="flex min-w-64 flex-1 flex-col gap-1">
          <label htmlFor="history-q" className="font-semibold">
            Tag, sticker, serial, name, phone or e-mail
          </label>
          <div className="relative">
            <Search size={20} aria-hidden className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-muted" />
            <input id="history-q" name="q" type="search" defaultValue={q} autoFocus autoComplete="off" className="tap w-full rounded-xl border-2 border-line bg-surface pr-3 pl-10 text-lg focus:border-accent" />
          </div>
        </div>
        <button type="submit" className={buttonClass("primary")}>
          Look up
        </button>
      </form>

      {asCode?.ok ? <Notice tone="bad">No ticket or machine carries the tag {formatTagCode(asCode.value)}.</Notice> : null}
      {found ? (
        <div className="grid gap-6 lg:grid-cols-2">
          <section aria-labelledby="found-machines" className="rounded-2xl border border-line bg-surface p-4 md:p-6">
            <h2 id="found-machines" className="mb-3 text-xl font-bold">
              Machines
            </h2>
            {found.machines.length ? (
              <ul className="flex flex-col gap-2">
                {found.machines.map((m) => (
                  <li key={m.id}>
                    <Link href={`/counter/history/machines/${m.id}`} className="tap block rounded-xl border-2 border-line px-4 py-2 hover:border-accent">
                      <span className="font-bold">
                        {m.make} {m.model}
                      </span>{" "}
                      <span className="text-muted">
                        · {m.kindLabel}
                        {m.serial ? ` · s/n ${m.serial}` : ""}
                        {m.customerName ? ` · ${m.customerName}` : ""}
                      </span>
                      {m.openTickets.length ? <span className="ml-2 text-sm font-semibold">in the shop now</span> : null}
                    </Link>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-muted">No machine matches.</p>
            )}
          </section>
          <section aria-labelledby="found-customers" className="rounded-2xl border border-line bg-surface p-4 md:p-6">
            <h2 id="found-customers" className="mb-3 text-xl font-bold">
              Customers
            </h2>
            {found.customers.length ? (
              <ul className="flex flex-col gap-2">
                {found.customers.map((c) => (
                  <li key={c.id}>
                    <Link href={`/counter/history/customers/${c.id}`} className="tap block rounded-xl border-2 border-line px-4 py-2 hover:border-accent">
                      <span className="font-bold">{c.lastName}</span>
                      {c.firstName ? `, ${c.firstName}` : ""}
                      <span className="text-muted"> · {[c.phone, c.email].filter(Boolean).join(" · ")}</span>
                    </Link>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="text-muted">No customer matches.</p>
            )}
          </section>
        </div>
      ) : q ? (
        <p className="text-muted">Type at least two characters.</p>
      ) : null}
    </>
  );
}
