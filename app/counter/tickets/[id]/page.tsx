import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import type { ReactNode } from "react";
import { CheckCircle2, History, RotateCcw } from "lucide-react";
import { getDb } from "@/db/client";
import { requirePageUser } from "@/lib/auth/guard";
import { listTechs } from "@/lib/counter/people";
import { ticketDetail } from "@/lib/counter/ticket-detail";
import { dateIn, daysBetween, formatDate, formatDateTime, timeIn } from "@/lib/counter/dates";
import { describeEntry } from "@/lib/counter/history-words";
import { getShopSettings } from "@/lib/shop/settings";
import { complaintLabel, conditionLabel, CONTACT_LABELS } from "@/lib/tickets/intake";
import { ENGINE_TYPE_LABELS, MACHINE_KIND_LABELS } from "@/lib/tickets/machine";
import { isOpenStatus } from "@/lib/tickets/status";
import { formatCents } from "@/lib/money/format";
import { formatTagCode } from "@/lib/trade/tag-code";
import { Notice } from "@/components/ui/notice";
import { StatusBadge } from "@/components/counter/status-badge";
import { PrintPanel } from "@/components/counter/print-panel";
import { BenchSheetSection } from "@/components/counter/bench-sheet-section";
import { IntakePhotoStrip } from "@/components/counter/intake-photo-strip";
import { GiveStickerForm, HandBackForm, ReplaceTagForm, TicketControls } from "@/components/counter/ticket-forms";

export const metadata: Metadata = { title: "Ticket" };

function Card({ title, children, id }: { title: string; children: ReactNode; id: string }) {
  return (
    <section aria-labelledby={id} className="rounded-2xl border border-line bg-surface p-4 md:p-6">
      <h2 id={id} className="mb-3 text-xl font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Facts({ items }: { items: Array<[string, ReactNode]> }) {
  return (
    <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-[max-content_1fr]">
      {items.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-muted">{k}</dt>
          <dd className="min-w-0 font-medium break-words">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

export default async function TicketPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { id } = await params;
  await requirePageUser(`/counter/tickets/${id}`, "counter", "owner");
  const sp = await searchParams;
  const db = getDb();
  const d = ticketDetail(db, id);
  if (!d) notFound();
  const { ticket: t, customer: c, machine: m } = d;
  const tz = getShopSettings(db).timezone;
  const open = isOpenStatus(t.status);
  const today = dateIn(tz, Date.now());
  const overdue = open && t.promisedDate !== null && t.promisedDate < today;
  const labelHref = `/api/labels/tickets/${t.id}`;
  const comebackDays = d.comebackOf?.closedAt ? daysBetween(dateIn(tz, d.comebackOf.closedAt), dateIn(tz, t.createdAt)) : null;

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-3">
        <p className="text-muted">
          <Link href="/counter" className="underline underline-offset-4">
            Queue
          </Link>{" "}
          / Ticket #{t.number}
        </p>
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
          <h1 className="font-mono text-4xl font-bold tracking-tight md:text-5xl" aria-label={`Tag ${formatTagCode(t.tagCode)}, ticket ${t.number}`}>
            {formatTagCode(t.tagCode)}
          </h1>
          <span className="text-2xl font-semibold text-muted">#{t.number}</span>
          <StatusBadge status={t.status} />
          {overdue ? <span className="rounded-lg bg-bad-soft px-2 py-0.5 font-bold text-bad">Overdue</span> : null}
        </div>
        <p className="text-lg">
          <span className="font-semibold">
            {c.firstName} {c.lastName}
          </span>{" "}
          · {m.make} {m.model} <span className="text-muted">({MACHINE_KIND_LABELS[m.kind].toLowerCase()})</span> · {daysBetween(dateIn(tz, t.createdAt), open ? today : dateIn(tz, t.closedAt ?? t.createdAt))} days in the
          shop
        </p>
        {d.comebackOf ? (
          <p className="flex items-center gap-2 rounded-xl border-2 border-ink-2 px-3 py-2 font-semibold">
            <RotateCcw size={20} aria-hidden />
            Comeback: back {comebackDays === null ? "soon" : `${comebackDays} day${comebackDays === 1 ? "" : "s"}`} after{" "}
            <Link href={`/counter/tickets/${d.comebackOf.id}`} className="underline underline-offset-4">
              #{d.comebackOf.number}
            </Link>{" "}
            was handed back.
          </p>
        ) : null}
        {d.cameBackAs.length ? (
          <p className="text-muted">
            Came back as a comeback:{" "}
            {d.cameBackAs.map((x, i) => (
              <span key={x.id}>
                {i ? ", " : ""}
                <Link href={`/counter/tickets/${x.id}`} className="underline underline-offset-4">
                  #{x.number}
                </Link>
              </span>
            ))}
          </p>
        ) : null}
        {open ? <TicketControls ticket={{ id: t.id, number: t.number, tagCode: t.tagCode, status: t.status }} techId={t.assignedTechId} techs={listTechs(db)} /> : null}
      </header>

      {typeof sp.replaced === "string" ? (
        <Notice tone="info" title={`Tag ${formatTagCode(sp.replaced)} was replaced.`}>
          This ticket&apos;s tag is now <span className="font-mono font-bold">{formatTagCode(t.tagCode)}</span>.
        </Notice>
      ) : null}
      {sp.taken === "1" ? (
        <Notice tone="ok" title={`Taken in as #${t.number}. Print the tag and fix it to the machine.`}>
          The tag code is <span className="font-mono font-bold">{formatTagCode(t.tagCode)}</span>.
        </Notice>
      ) : null}

      <div className="grid gap-6 xl:grid-cols-[1fr_24rem]">
        <div className="flex flex-col gap-6">
          <Card id="sec-tag" title="Tag">
            <div className="flex flex-col gap-4">
              <PrintPanel href={labelHref} what="tag" idPrefix="tag" />
              {d.retiredTags.length ? (
                <p className="text-muted">
                  Replaced tags (they answer &ldquo;replaced&rdquo; when scanned):{" "}
                  {d.retiredTags.map((r) => `${formatTagCode(r.code)}${r.reason ? ` (${r.reason})` : ""}`).join(", ")}
                </p>
              ) : null}
              <details className="rounded-xl border border-line px-4 py-2">
                <summary className="tap flex cursor-pointer items-center font-semibold">Tag came off or cannot be read?</summary>
                <div className="py-3">
                  <ReplaceTagForm ticketId={t.id} />
                </div>
              </details>
            </div>
          </Card>

          <Card id="sec-intake" title="Intake">
            <Facts
              items={[
                [
                  "Complaint",
                  <span key="c">
                    {(t.complaintTags as string[]).map((k) => (
                      <span key={k} className="mr-2 mb-1 inline-block rounded-lg bg-surface-2 px-2 py-0.5">
                        {complaintLabel(k)}
                      </span>
                    ))}
                    {t.complaint ? <span className="block">{t.complaint}</span> : null}
                  </span>,
                ],
                [
                  "Condition",
                  t.intakeCondition.flags.length || t.intakeCondition.note ? (
                    <span key="cond">
                      {t.intakeCondition.flags.map(conditionLabel).join(", ")}
                      {t.intakeCondition.note ? <span className="block">{t.intakeCondition.note}</span> : null}
                    </span>
                  ) : (
                    "Nothing noted"
                  ),
                ],
                ["Left with it", t.accessories || "Nothing"],
                ["Promised for", t.promisedDate ? formatDate(t.promisedDate) : "No date promised"],
                ["Call before going over", t.approvalLimitCents === null ? "No limit given" : formatCents(t.approvalLimitCents)],
                ["Taken in", `${formatDateTime(tz, t.createdAt)}${d.createdByName ? ` by ${d.createdByName}` : ""}`],
                ["Technician", d.techName ?? "Not assigned"],
              ]}
            />
            <IntakePhotoStrip ticketId={t.id} />
          </Card>

          <BenchSheetSection ticketId={t.id} />

          {open ? (
            <Card id="sec-handback" title="Hand-back">
              {t.status === "ready" ? (
                <HandBackForm ticketId={t.id} defaults={{ collectedBy: `${c.firstName} ${c.lastName}`.trim(), date: today, time: timeIn(tz, Date.now()), ready: true }} />
              ) : (
                <details className="rounded-xl border border-line px-4 py-2">
                  <summary className="tap flex cursor-pointer items-center font-semibold">Hand it back before it is marked ready</summary>
                  <div className="py-3">
                    <HandBackForm ticketId={t.id} defaults={{ collectedBy: `${c.firstName} ${c.lastName}`.trim(), date: today, time: timeIn(tz, Date.now()), ready: false }} />
                  </div>
                </details>
              )}
            </Card>
          ) : d.handBack ? (
            <Card id="sec-handback" title="Hand-back">
              <p className="flex items-center gap-2 text-lg">
                <CheckCircle2 size={22} aria-hidden className="text-ok" />
                {d.handBack.outcome === "returned_unrepaired" ? "Returned unrepaired" : "Handed back"} to <span className="font-semibold">{d.handBack.collectedBy}</span> on{" "}
                {formatDateTime(tz, d.handBack.collectedAt)}.
              </p>
              {d.handBack.note ? <p className="mt-2">{d.handBack.note}</p> : null}
            </Card>
          ) : null}
        </div>

        <div className="flex flex-col gap-6">
          <Card id="sec-customer" title="Customer">
            <Facts
              items={[
                ["Name", `${c.firstName} ${c.lastName}`.trim()],
                ["Phone", c.phone || "—"],
                ["E-mail", c.email ? <span className="break-all">{c.email}</span> : "—"],
                ["Reach by", CONTACT_LABELS[c.contactPreference]],
                ["E-mail consent", c.emailConsent ? "Yes" : "No"],
              ]}
            />
            <p className="mt-3">
              <Link href={`/counter/history/customers/${c.id}`} className="underline underline-offset-4">
                Customer history
              </Link>
            </p>
          </Card>
          <Card id="sec-machine" title="Machine">
            <Facts
              items={[
                ["Machine", `${m.make} ${m.model}`.trim()],
                ["Kind", MACHINE_KIND_LABELS[m.kind]],
                ["Engine", ENGINE_TYPE_LABELS[m.engineType]],
                ["Serial", m.serial || "—"],
                ["Sticker", m.stickerCode ? <span className="font-mono font-bold">{formatTagCode(m.stickerCode)}</span> : "None"],
              ]}
            />
            <div className="mt-4 flex flex-col gap-3">
              {m.stickerCode ? <PrintPanel href={`/api/labels/machines/${m.id}`} what="sticker" idPrefix="sticker" /> : <GiveStickerForm machineId={m.id} back={`/counter/tickets/${t.id}`} />}
              <Link href={`/counter/history/machines/${m.id}`} className="flex items-center gap-2 underline underline-offset-4">
                <History size={18} aria-hidden /> Machine history
              </Link>
            </div>
          </Card>
          <Card id="sec-history" title="Status history">
            <ol className="flex flex-col gap-3">
              {d.history.map((e, i) => {
                const { what, why } = describeEntry(e);
                return (
                  <li key={i} className="border-l-4 border-accent pl-3">
                    <p className="font-semibold">{what}</p>
                    {why ? <p>&ldquo;{why}&rdquo;</p> : null}
                    <p className="text-sm text-muted">
                      {formatDateTime(tz, e.at)}
                      {e.actorName ? ` · ${e.actorName}` : ""}
                    </p>
                  </li>
                );
              })}
            </ol>
          </Card>
        </div>
      </div>
    </div>
  );
}
