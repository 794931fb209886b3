import type { ReactNode } from "react";
import { AlertTriangle, ClipboardCheck, Clock, Wrench } from "lucide-react";
import { getDb } from "@/db/client";
import { counterBenchSheet } from "@/lib/counter/bench-sheet";
import { GRADE_LABELS, GRADE_ORDER, type BenchSheetView } from "@/lib/counter/bench-sheet-view";
import { STATUS_LABELS, TICKET_STATUSES, type TicketStatus } from "@/lib/tickets/status";
import { formatHours } from "@/lib/money/labor";
import { formatDateTime } from "@/lib/counter/dates";
import { getShopSettings } from "@/lib/shop/settings";
import { ConflictForm } from "./conflict-form";

const statusLabel = (v: unknown) => (TICKET_STATUSES.includes(v as TicketStatus) ? STATUS_LABELS[v as TicketStatus] : String(v));

/** "1.25 h (75 min)" */
const hours = (minutes: number) => `${formatHours(minutes)} h (${minutes} min)`;

const GRADE_STYLE: Record<(typeof GRADE_ORDER)[number], string> = {
  cause: "border-bad bg-bad-soft",
  due_soon: "border-accent bg-accent-soft",
  advisory: "border-line bg-surface-2",
};

function Photo({ sha256, alt }: { sha256: string; alt: string }) {
  return (
    <a href={`/api/photos/${sha256}`} target="_blank" rel="noreferrer" className="block">
      {/* eslint-disable-next-line @next/next/no-img-element -- private photos served by our own API, not optimised */}
      <img src={`/api/photos/${sha256}`} alt={alt} loading="lazy" className="size-24 rounded-xl border border-line object-cover" />
    </a>
  );
}

function Sub({ title, icon, children }: { title: string; icon?: ReactNode; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-2">
      <h3 className="flex items-center gap-2 text-lg font-bold">
        {icon}
        {title}
      </h3>
      {children}
    </div>
  );
}

type When = (iso: string) => string;

function Findings({ view, compact, when }: { view: BenchSheetView; compact: boolean; when: When }) {
  if (!view.findings.length) return <p className="text-muted">No findings graded yet.</p>;
  return (
    <ul className="flex flex-col gap-3">
      {view.findings.map((f) => (
        <li key={f.id} className={`rounded-xl border-l-8 px-4 py-3 ${GRADE_STYLE[f.grade]}`} data-grade={f.grade}>
          <p className="text-sm font-bold uppercase tracking-wide text-ink-2">{GRADE_LABELS[f.grade]}</p>
          <p className="text-lg font-bold">{f.title}</p>
          {f.note ? <p>{f.note}</p> : null}
          {f.suggestedParts.length || f.suggestedLaborMinutes ? (
            <p className="text-ink-2">
              Suggested: {f.suggestedParts.map((p) => `${p.description}${p.partNumber ? ` (${p.partNumber})` : ""} × ${p.qty}`).join(", ")}
              {f.suggestedParts.length && f.suggestedLaborMinutes ? "; " : ""}
              {f.suggestedLaborMinutes ? `${hours(f.suggestedLaborMinutes)} labor` : ""}
            </p>
          ) : null}
          {f.alternatives?.length ? (
            <ul className="mt-1 list-disc pl-5 text-ink-2">
              {f.alternatives.map((a) => (
                <li key={a.label}>
                  Or: {a.label} — {a.parts.map((p) => `${p.description} × ${p.qty}`).join(", ") || "no parts"}, {hours(a.laborMinutes)} labor
                </li>
              ))}
            </ul>
          ) : null}
          {!compact && f.photos.length ? (
            <div className="mt-2 flex flex-wrap gap-2">
              {f.photos.map((p) => (
                <Photo key={p.id} sha256={p.sha256} alt={`Photo for the finding: ${f.title}`} />
              ))}
            </div>
          ) : null}
          {!compact ? <p className="mt-1 text-sm text-muted">{f.byName}, {when(f.at)}</p> : null}
        </li>
      ))}
    </ul>
  );
}

/**
 * The bench sheet as synced from the technicians' phones: conflicts to decide, findings, the sheet's answers,
 * the tune log, labor time, photos, parts and notes. Compact (inside a history list): findings and parts only.
 */
export function BenchSheetSection({ ticketId, compact = false }: { ticketId: string; compact?: boolean }) {
  const db = getDb();
  const { view, conflicts } = counterBenchSheet(db, ticketId);
  const tz = getShopSettings(db).timezone;
  const when: When = (iso) => formatDateTime(tz, new Date(iso));

  if (compact) {
    // Inside a history list: a plain block, not a landmark (there is one per ticket).
    return (
      <div data-bench-sheet={ticketId} className="flex flex-col gap-2">
        <p className="text-base font-semibold">Findings and parts</p>
        {view.isEmpty ? <p className="text-muted">No bench work synced.</p> : <Findings view={view} compact when={when} />}
        {view.parts.length ? (
          <p className="text-ink-2">Parts: {view.parts.map((p) => `${p.description} × ${p.qty}`).join(", ")}</p>
        ) : null}
      </div>
    );
  }

  return (
    <section aria-labelledby={`bench-${ticketId}`} className="flex flex-col gap-6 rounded-2xl border border-line bg-surface p-4 md:p-6" data-bench-sheet={ticketId}>
      <div>
        <h2 id={`bench-${ticketId}`} className="flex items-center gap-2 text-xl font-bold">
          <ClipboardCheck size={22} aria-hidden />
          Bench sheet
        </h2>
        <p className="text-muted">
          {view.isEmpty ? "No bench work synced yet." : `As synced from the bench${view.procedureTitle ? ` · ${view.procedureTitle}` : ""}.`}
        </p>
      </div>

      {conflicts.length ? (
        <Sub title="Decide: the bench and the counter disagree" icon={<AlertTriangle size={20} aria-hidden className="text-bad" />}>
          <ul className="flex flex-col gap-3">
            {conflicts.map((c) => (
              <li key={c.id} className="rounded-xl border-2 border-bad px-4 py-3" data-testid="sync-conflict">
                <p>
                  {c.userName} moved the {c.field} to <strong>{statusLabel(c.deviceValue)}</strong> on the bench, but it had already been
                  changed here to <strong>{statusLabel(c.serverValue)}</strong>, which stands for now.
                </p>
                <p className="mb-2 text-sm text-muted">{when(c.createdAt.toISOString())}</p>
                <ConflictForm ticketId={ticketId} conflictId={c.id} deviceLabel={statusLabel(c.deviceValue)} serverLabel={statusLabel(c.serverValue)} />
              </li>
            ))}
          </ul>
        </Sub>
      ) : null}

      {view.isEmpty ? null : (
        <>
          <Sub title="Findings">
            <Findings view={view} compact={false} when={when} />
          </Sub>

          {view.entries.length ? (
            <Sub title="Checks">
              <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[minmax(10rem,max-content)_1fr]">
                {view.entries.map((e) => (
                  <div key={e.stepId} className="contents" data-step={e.stepId}>
                    <dt className="text-muted">{e.title}</dt>
                    <dd className="font-medium">
                      {e.answer}
                      {e.note ? <span className="block font-normal text-ink-2">{e.note}</span> : null}
                      {e.history.length ? (
                        <details className="font-normal">
                          <summary className="cursor-pointer text-sm text-muted underline">
                            {e.history.length} earlier {e.history.length === 1 ? "answer" : "answers"}
                          </summary>
                          <ul className="text-sm text-ink-2">
                            {e.history.map((h) => (
                              <li key={h.at}>
                                {h.voided ? <s>{h.answer}</s> : h.answer} — {h.by}, {when(h.at)}
                                {h.voided ? ` (undone${h.voidReason ? `: ${h.voidReason}` : ""})` : ""}
                              </li>
                            ))}
                          </ul>
                        </details>
                      ) : null}
                    </dd>
                  </div>
                ))}
              </dl>
            </Sub>
          ) : null}

          {view.tune.length || view.tuneProblem ? (
            <Sub title="Tune log" icon={<Wrench size={20} aria-hidden />}>
              <ul>
                {view.tune.map((t) => (
                  <li key={t.screw}>
                    <span className="font-semibold">{t.label}:</span> {t.position}
                  </li>
                ))}
              </ul>
              {view.tuneProblem ? <p className="text-bad">{view.tuneProblem}</p> : null}
            </Sub>
          ) : null}

          <Sub title="Labor" icon={<Clock size={20} aria-hidden />}>
            <p>
              {hours(view.laborMinutes)} on the bench{view.laborRunning ? " (timer running)" : ""}
            </p>
          </Sub>

          {view.photos.length ? (
            <Sub title="Photos">
              <div className="flex flex-wrap gap-2">
                {view.photos.map((p) => (
                  <Photo key={p.id} sha256={p.sha256} alt={p.caption ?? `Bench photo, ${when(p.at)}`} />
                ))}
              </div>
            </Sub>
          ) : null}

          {view.parts.length ? (
            <Sub title="Parts used">
              <ul className="list-disc pl-5">
                {view.parts.map((p) => (
                  <li key={p.id}>
                    {p.description}
                    {p.partNumber ? ` (${p.partNumber})` : ""} × {p.qty}
                  </li>
                ))}
              </ul>
            </Sub>
          ) : null}

          {view.notes.length ? (
            <Sub title="Notes from the bench">
              <ul className="flex flex-col gap-2">
                {view.notes.map((n) => (
                  <li key={n.id}>
                    {n.text} <span className="text-sm text-muted">— {n.byName}, {when(n.at)}</span>
                  </li>
                ))}
              </ul>
            </Sub>
          ) : null}
        </>
      )}
    </section>
  );
}
