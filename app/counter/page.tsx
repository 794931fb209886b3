import type { Metadata } from "next";
import { Printer, PackagePlus } from "lucide-react";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { openTicketsTakenInToday, queuePage, queueQuerySchema } from "@/lib/counter/queue";
import { getShopSettings } from "@/lib/shop/settings";
import { PageHeader } from "@/components/ui/page-header";
import { ButtonLink } from "@/components/ui/button";
import { QueueBoard, type BoardParams } from "@/components/counter/queue-board";

export const metadata: Metadata = { title: "Queue" };

export default async function QueuePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageUser("/counter", "counter", "owner");
  const raw = Object.fromEntries(Object.entries(await searchParams).filter((e): e is [string, string] => typeof e[1] === "string"));
  const parsed = queueQuerySchema.safeParse({ ...raw, pageSize: "25" });
  const query = parsed.success ? parsed.data : queueQuerySchema.parse({ pageSize: "25" });
  const db = getDb();
  const tz = getShopSettings(db).timezone;
  const initial = queuePage(db, query);
  const initialParams: BoardParams = {
    status: query.status,
    tech: query.tech,
    overdue: query.overdue || undefined,
    q: query.q || undefined,
    sort: query.sort,
    dir: query.dir,
    page: initial.page,
  };

  const today = openTicketsTakenInToday(db);

  return (
    <>
      <PageHeader
        title="Queue"
        subtitle="Open tickets, refreshed every few seconds as the bench syncs."
        actions={
          <>
            <ButtonLink href="/counter/intake">
              <PackagePlus size={20} aria-hidden /> Take in a machine
            </ButtonLink>
            {today.length ? (
              <a
                href={`/api/labels/sheet?layout=sheet-letter&tickets=${today.map((t) => t.id).join(",")}`}
                target="_blank"
                rel="noopener"
                className="tap inline-flex items-center gap-2 rounded-xl border-2 border-line bg-surface px-4 font-semibold hover:border-accent"
              >
                <Printer size={20} aria-hidden /> Today&apos;s {today.length} tag{today.length === 1 ? "" : "s"} (sheet)
              </a>
            ) : null}
          </>
        }
      />
      <QueueBoard initial={initial} initialParams={initialParams} timezone={tz} />
    </>
  );
}
