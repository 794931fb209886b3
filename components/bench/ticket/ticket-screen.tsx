"use client";

import { startTransition, useEffect, useMemo, useState } from "react";
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { CheckCircle2, Flag, ListChecks, Sun } from "lucide-react";
import { BenchShell } from "../bench-shell";
import { SuggestionCard } from "../suggestion-card";
import { useWakeLock } from "../use-wake-lock";
import { SyncBadge } from "@/components/sync/sync-badge";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";
import { SheetStep, type StepContext } from "./sheet-step";
import { FindingForm, FindingsList, newFindingDraft } from "./findings";
import { LaborTimer, StatusPicker, TicketNotes } from "./ticket-parts";
import { SAVED_EVENT, useRecord, type SavedDetail } from "./use-record";
import { useTicketSheet } from "./use-ticket-sheet";
import { formatTagCode } from "@/lib/trade/tag-code";
import { localIsoDate, promisedLabel } from "@/lib/bench/today";
import { MACHINE_KIND_LABELS } from "@/lib/tickets/machine";
import { CONDITION_LABELS, type ConditionFlag } from "@/lib/tickets/intake";
import { STATUS_LABELS } from "@/lib/tickets/status";
import { INTAKE_PHOTO_STEP } from "@/lib/counter/bench-sheet-view";
import { PhotoThumbs } from "./photo-thumbs";
import type { BenchEntryRow } from "@/lib/sync/protocol";
import type { PhotoWithBlob } from "@/lib/sync/read";

const NONE: never[] = [];

function goToStep(stepId: string) {
  const el = document.getElementById(`step-${stepId}`);
  if (!el) return;
  el.scrollIntoView({ behavior: "smooth", block: "start" });
  el.focus({ preventScroll: true });
}

/** "Saved on this phone" for a moment after each change, announced to screen readers. */
function SavedFlash() {
  const [shown, setShown] = useState<number | null>(null);
  useEffect(() => {
    let t: ReturnType<typeof setTimeout> | undefined;
    const on = (e: Event) => {
      setShown((e as CustomEvent<SavedDetail>).detail.seq);
      clearTimeout(t);
      t = setTimeout(() => setShown(null), 2500);
    };
    window.addEventListener(SAVED_EVENT, on);
    return () => {
      window.removeEventListener(SAVED_EVENT, on);
      clearTimeout(t);
    };
  }, []);
  return (
    <div role="status" aria-live="polite" className="pointer-events-none fixed inset-x-0 top-[4.75rem] z-20 flex justify-center px-4">
      {shown !== null ? (
        <p className="inline-flex items-center gap-2 rounded-full bg-ink px-4 py-2 text-base font-bold text-bg shadow-lg" data-testid="saved-flash">
          <CheckCircle2 aria-hidden /> Saved on this phone
        </p>
      ) : null}
    </div>
  );
}

/**
 * The bench ticket: the machine and complaint, the labor timer, the guided bench sheet (steps with their cautions,
 * suggestions for the next test), findings, the tune log, photos, status and notes. Everything reads and writes the
 * phone's own store, so it works with no network; the sync badge says what is still to be sent.
 */
export function TicketScreen() {
  // The page is prerendered once for every ticket (no query then): read the id only after hydration, so the
  // server's HTML and the first client render agree ("Opening the ticket…").
  const params = useSearchParams();
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => {
    setHydrated(true);
  }, []);
  const id = hydrated ? params.get("id") : undefined;
  const data = useTicketSheet(id ?? null);
  const { save } = useRecord();
  const wake = useWakeLock(Boolean(data));
  const [draft, setDraft] = useState<ReturnType<typeof newFindingDraft> | null>(null);
  // The first screenful shows at once; the rest of a long sheet is drawn right after, without holding up the first.
  const [allSections, setAllSections] = useState(false);
  const ready = Boolean(data);
  useEffect(() => {
    if (!ready) return;
    const t = setTimeout(() => startTransition(() => setAllSections(true)), 0);
    return () => clearTimeout(t);
  }, [ready]);

  const ticketId = data?.card.ticket.id;
  const procedure = data?.sheet.procedure;
  const ctx: StepContext | null = useMemo(
    () =>
      ticketId && procedure
        ? { ticketId, procedure, save, disabled: false, onAddFinding: (stepId, title) => setDraft((d) => d ?? newFindingDraft(stepId, title)) }
        : null,
    [ticketId, procedure, save],
  );
  const byStep = useMemo(() => {
    const history = new Map<string, BenchEntryRow[]>();
    for (const e of data?.entries.history ?? []) history.set(e.stepId, [...(history.get(e.stepId) ?? []), e]);
    const photos = new Map<string, PhotoWithBlob[]>();
    for (const p of data?.photos ?? []) if (p.stepId && !p.findingId) photos.set(p.stepId, [...(photos.get(p.stepId) ?? []), p]);
    return { history, photos };
  }, [data?.entries.history, data?.photos]);
  const tune = useMemo(
    () => (data ? { log: data.tuneLog, waiting: data.tune.filter((t) => data.waiting.has(t.id)).length } : undefined),
    [data],
  );

  // Before hydration, and while the phone's store is read.
  if (id === undefined || data === undefined) {
    return (
      <BenchShell title="Ticket">
        <p className="text-lg" role="status">
          Opening the ticket…
        </p>
      </BenchShell>
    );
  }
  if (!id) {
    return (
      <BenchShell title="Ticket">
        <Notice tone="bad" title="No ticket chosen">
          Open a ticket from today&apos;s work or scan its tag.
        </Notice>
      </BenchShell>
    );
  }
  if (data === null) {
    return (
      <BenchShell title="Ticket" status={<SyncBadge />}>
        <div className="flex flex-col gap-4">
          <Notice tone="bad" title="This ticket is not on this phone">
            It may have been closed at the counter, or this phone has not synced since it was taken in. Sync, then scan the tag again.
          </Notice>
          <Link href="/bench/sync" prefetch={false} className={buttonClass("primary", "bench")}>
            Open sync
          </Link>
          <Link href="/bench" prefetch={false} className={buttonClass("secondary", "bench")}>
            Today&apos;s work
          </Link>
        </div>
      </BenchShell>
    );
  }

  const { card, sheet } = data;
  const { ticket, machine, customer } = card;
  const latest = data.entries.latest;
  const nextOpen = sheet.open[0];
  const intakePhotos = data.photos.filter((p) => p.stepId === INTAKE_PHOTO_STEP);
  let n = 0;
  // Cautions in full where a hazard first comes up on the sheet; later steps with the same hazard show titles only.
  const seenHazards = new Set<string>();
  const fullCautionsAt = new Set<string>();
  if (procedure) {
    for (const s of procedure.sections.flatMap((x) => x.steps)) {
      if (!sheet.visible.has(s.id) || !s.hazards) continue;
      if (s.hazards.some((h) => !seenHazards.has(h))) fullCautionsAt.add(s.id);
      s.hazards.forEach((h) => seenHazards.add(h));
    }
  }

  return (
    <BenchShell title={`#${ticket.number} ${machine ? `${machine.make} ${machine.model}` : ""}`.trim()} status={<SyncBadge />}>
      <div className="flex flex-col gap-6" data-testid="bench-ticket" data-ticket={ticket.id}>
        <section aria-label="Machine and complaint" className="flex flex-col gap-2 rounded-2xl bg-surface-2 p-4">
          <p className="text-sm font-bold uppercase tracking-wider text-ink-2">
            Tag <span className="font-mono text-base text-ink">{formatTagCode(ticket.tagCode)}</span> · {STATUS_LABELS[ticket.status]}
          </p>
          {machine ? (
            <p className="text-lg font-bold">
              {MACHINE_KIND_LABELS[machine.kind]} · {machine.make} {machine.model}
              {machine.displacementCc ? ` · ${machine.displacementCc} cc` : ""}
              {machine.serial ? <span className="block text-base font-normal text-ink-2">Serial {machine.serial}</span> : null}
            </p>
          ) : null}
          {customer ? <p className="text-base">For {customer.firstName} {customer.lastName}</p> : null}
          <p className="text-lg">
            <span className="font-bold">Complaint: </span>
            {ticket.complaint || "—"}
          </p>
          {ticket.intakeCondition.flags.length || ticket.intakeCondition.note ? (
            <p className="text-base">
              <span className="font-bold">At intake: </span>
              {[...ticket.intakeCondition.flags.map((f) => CONDITION_LABELS[f as ConditionFlag] ?? f), ticket.intakeCondition.note].filter(Boolean).join("; ")}
            </p>
          ) : null}
          {ticket.accessories ? <p className="text-base">Left with it: {ticket.accessories}</p> : null}
          {ticket.promisedDate ? (
            <p className={"text-base font-semibold " + (promisedLabel(ticket.promisedDate, localIsoDate(new Date()))?.overdue ? "text-bad" : "")}>
              {promisedLabel(ticket.promisedDate, localIsoDate(new Date()))?.text ?? `Promised ${ticket.promisedDate}`}
            </p>
          ) : null}
          <PhotoThumbs photos={intakePhotos} label="Intake" />
        </section>

        <LaborTimer ticketId={ticket.id} rows={data.labor} userId={data.user?.id ?? null} save={save} disabled={false} />

        {procedure && ctx ? (
          <>
            <section aria-label="Progress" className="flex flex-col gap-3">
              <p className="flex items-center gap-2 text-lg font-bold">
                <ListChecks aria-hidden /> {procedure.title}: {sheet.answered} of {sheet.total} done
              </p>
              {nextOpen ? (
                <button type="button" onClick={() => goToStep(nextOpen)} className={buttonClass("secondary", "bench", "justify-start")}>
                  Next step: {procedure.sections.flatMap((s) => s.steps).find((s) => s.id === nextOpen)?.title}
                </button>
              ) : (
                <p className="font-semibold text-ok">Every step is done.</p>
              )}
              {wake.supported ? (
                <p className="flex items-center gap-2 text-sm text-ink-2">
                  <Sun aria-hidden size={16} /> {wake.active ? "Screen stays on while this sheet is open." : "Screen may dim (the browser did not keep it on)."}
                </p>
              ) : null}
            </section>

            {sheet.suggestions.length ? (
              <section aria-label="Suggestions" className="flex flex-col gap-3">
                {sheet.suggestions.map((s) => (
                  <SuggestionCard key={s.ruleId} suggestion={s} onGo={goToStep} />
                ))}
              </section>
            ) : null}

            {procedure.sections.slice(0, allSections ? undefined : 2).map((section) => {
              const steps = section.steps.filter((s) => sheet.visible.has(s.id));
              if (steps.length === 0) return null;
              return (
                <section key={section.id} aria-labelledby={`sec-${section.id}`} className="flex flex-col gap-4">
                  <h2 id={`sec-${section.id}`} className="text-2xl font-black">
                    {section.title}
                  </h2>
                  {steps.map((step) => (
                    <SheetStep
                      key={step.id}
                      step={step}
                      index={++n}
                      latest={latest[step.id]}
                      history={byStep.history.get(step.id) ?? NONE}
                      photos={byStep.photos.get(step.id) ?? NONE}
                      ctx={ctx}
                      fullCautions={fullCautionsAt.has(step.id)}
                      notSent={latest[step.id] ? data.waiting.has(latest[step.id]!.id) : false}
                      tune={step.kind === "tune" ? tune : undefined}
                    />
                  ))}
                </section>
              );
            })}
          </>
        ) : (
          <Notice tone="info" title="No bench sheet for this machine">
            Record what you find as findings, notes and photos below.
          </Notice>
        )}

        <section aria-labelledby="findings-h" className="flex flex-col gap-4">
          <h2 id="findings-h" className="text-2xl font-black">
            Findings
          </h2>
          <FindingsList findings={data.findings} photos={data.photos} save={save} ticketId={ticket.id} waiting={data.waiting} disabled={false} />
          {draft ? (
            <FindingForm ticketId={ticket.id} draft={draft} setDraft={setDraft} save={save} onDone={() => setDraft(null)} />
          ) : (
            <button type="button" onClick={() => setDraft(newFindingDraft(null, ""))} className={buttonClass("primary", "bench")}>
              <Flag aria-hidden /> Add finding
            </button>
          )}
        </section>

        <section aria-labelledby="status-h" className="flex flex-col gap-4">
          <h2 id="status-h" className="text-2xl font-black">
            Status and notes
          </h2>
          <StatusPicker ticket={ticket} save={save} disabled={false} />
          <TicketNotes ticketId={ticket.id} notes={data.notes} save={save} disabled={false} waiting={data.waiting} />
        </section>
      </div>
      <SavedFlash />
    </BenchShell>
  );
}
