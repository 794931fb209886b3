"use client";

import { AlertText } from "@/components/ui/alert-text";
import { useEffect, useRef, useState } from "react";
import { Plus, Trash2, Undo2, X } from "lucide-react";
import { ChoiceChips } from "../choice-chips";
import { PhotoButton } from "../photo-button";
import { PhotoThumbs } from "./photo-thumbs";
import { GRADE_LABELS, GRADE_ORDER } from "@/lib/counter/bench-sheet-view";
import type { FindingRow } from "@/lib/sync/protocol";
import type { PhotoWithBlob } from "@/lib/sync/read";
import { uuid } from "@/lib/sync/ids";
import type { PreparedPhoto } from "@/lib/bench/photo";
import type { RecordInput } from "@/lib/sync/record";
import type { useRecord } from "./use-record";

type Save = ReturnType<typeof useRecord>["save"];
type Grade = (typeof GRADE_ORDER)[number];

const GRADE_OPTIONS = GRADE_ORDER.map((g) => ({ id: g, label: GRADE_LABELS[g] }));
const LABOR_CHIPS = [15, 30, 45, 60, 90, 120] as const;

const inputClass = "tap-bench w-full rounded-2xl border-2 border-line bg-surface px-4 text-lg text-ink focus:border-accent";

type PartDraft = { key: string; description: string; qty: string };
type Draft = {
  stepId: string | null;
  grade: Grade | null;
  title: string;
  note: string;
  photos: Array<PreparedPhoto & { id: string; url: string }>;
  parts: PartDraft[];
  labor: string;
  alternative: { label: string; labor: string; part: string } | null;
};

export const newFindingDraft = (stepId: string | null, title: string): Draft => ({
  stepId,
  grade: null,
  title,
  note: "",
  photos: [],
  parts: [],
  labor: "",
  alternative: null,
});

const wholeMinutes = (s: string): number | null | "bad" => {
  if (s.trim() === "") return null;
  return /^\d{1,4}$/.test(s.trim()) ? Number(s.trim()) : "bad";
};

/**
 * A new finding: grade (why it came in / will fail soon / advisory), a short title, a note, photos, the parts and
 * labor it would take, and optionally another way to fix it (rebuild the part, or replace the assembly). Nothing
 * typed is lost on an error: the draft stays until it is saved or cancelled.
 */
export function FindingForm({
  ticketId,
  draft,
  setDraft,
  save,
  onDone,
}: {
  ticketId: string;
  draft: Draft;
  setDraft: (d: Draft) => void;
  save: Save;
  onDone: () => void;
}) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const ref = useRef<HTMLElement>(null);
  useEffect(() => {
    // Braces: scrollIntoView returns a promise in newer browsers, and an effect may only return a cleanup.
    void ref.current?.scrollIntoView({ block: "start" });
  }, []);
  const set = (patch: Partial<Draft>) => setDraft({ ...draft, ...patch });

  const submit = async () => {
    const e: Record<string, string> = {};
    if (!draft.grade) e.grade = "Choose a grade.";
    if (draft.title.trim() === "") e.title = "Give the finding a short title.";
    const labor = wholeMinutes(draft.labor);
    if (labor === "bad") e.labor = "Labor is whole minutes, e.g. 30.";
    const parts = draft.parts.filter((p) => p.description.trim() !== "" || p.qty.trim() !== "1");
    parts.forEach((p) => {
      if (p.description.trim() === "") e[`part-${p.key}`] = "Say what the part is, or take the line off.";
      else if (!/^\d{1,3}$/.test(p.qty.trim()) || Number(p.qty) < 1) e[`part-${p.key}`] = "Quantity is a whole number, 1 or more.";
    });
    let alternatives: { label: string; parts: { description: string; qty: number }[]; laborMinutes: number }[] | undefined;
    if (draft.alternative) {
      const altLabor = wholeMinutes(draft.alternative.labor);
      if (draft.alternative.label.trim() === "") e.altLabel = "Name the other way, e.g. Replace the carburetor.";
      if (altLabor === "bad") e.altLabor = "Labor is whole minutes, e.g. 20.";
      alternatives = [
        {
          label: draft.alternative.label.trim(),
          parts: draft.alternative.part.trim() ? [{ description: draft.alternative.part.trim(), qty: 1 }] : [],
          laborMinutes: typeof altLabor === "number" ? altLabor : 0,
        },
      ];
    }
    setErrors(e);
    if (Object.keys(e).length) {
      setMessage("Some fields need attention; nothing was saved yet.");
      return;
    }
    setBusy(true);
    const findingId = uuid();
    const r = await save("finding.added", {
      id: findingId,
      ticketId,
      ...(draft.stepId ? { stepId: draft.stepId } : {}),
      grade: draft.grade as Grade,
      title: draft.title.trim(),
      note: draft.note.trim(),
      photoIds: draft.photos.map((p) => p.id),
      suggestedParts: parts.map((p) => ({ description: p.description.trim(), qty: Number(p.qty) })),
      ...(typeof labor === "number" ? { suggestedLaborMinutes: labor } : {}),
      ...(alternatives ? { alternatives } : {}),
    });
    if (!r.ok) {
      setBusy(false);
      setErrors(r.fields ?? {});
      setMessage(r.message);
      return;
    }
    for (const p of draft.photos) {
      const pr = await save(
        "photo.attached",
        { id: p.id, ticketId, sha256: p.sha256, mime: "image/jpeg", bytes: p.bytes, width: p.width, height: p.height, findingId, ...(draft.stepId ? { stepId: draft.stepId } : {}) },
        { blob: p.blob },
      );
      if (!pr.ok) setMessage(`The finding is saved, but a photo was not: ${pr.message}`);
    }
    for (const p of draft.photos) URL.revokeObjectURL(p.url);
    setBusy(false);
    onDone();
  };

  return (
    <section ref={ref} aria-label="New finding" className="scroll-mt-20 flex flex-col gap-4 rounded-2xl border-4 border-accent bg-surface p-4">
      <h3 className="text-xl font-bold">New finding</h3>
      <ChoiceChips label="Grade" mode="single" options={GRADE_OPTIONS} value={draft.grade ? [draft.grade] : []} onChange={(v) => set({ grade: (v[0] as Grade) ?? null })} error={errors.grade} />
      <div className="flex flex-col gap-1">
        <label htmlFor="finding-title" className="text-lg font-bold">
          Title
        </label>
        <input id="finding-title" className={inputClass} value={draft.title} maxLength={160} onChange={(e) => set({ title: e.target.value })} aria-invalid={errors.title ? true : undefined} />
        {errors.title ? <p className="font-semibold text-bad">{errors.title}</p> : null}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="finding-note" className="text-lg font-bold">
          Note
        </label>
        <textarea id="finding-note" rows={3} maxLength={2000} className="rounded-2xl border-2 border-line bg-surface px-4 py-3 text-lg" value={draft.note} onChange={(e) => set({ note: e.target.value })} />
      </div>
      <div className="flex flex-col gap-2">
        <p className="text-lg font-bold">Photos</p>
        {draft.photos.length ? (
          <ul className="flex flex-wrap gap-3">
            {draft.photos.map((p, i) => (
              <li key={p.id} className="flex flex-col items-center gap-2">
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img src={p.url} alt={`New finding, photo ${i + 1}`} className="h-24 w-24 rounded-xl border-2 border-line object-cover" />
                <button
                  type="button"
                  aria-label={`Leave out photo ${i + 1}`}
                  onClick={() => {
                    URL.revokeObjectURL(p.url);
                    set({ photos: draft.photos.filter((x) => x.id !== p.id) });
                  }}
                  className="tap-bench inline-flex items-center justify-center gap-1 rounded-2xl border-2 border-line bg-surface px-3 text-base font-bold"
                >
                  <X aria-hidden size={20} /> Leave out
                </button>
              </li>
            ))}
          </ul>
        ) : null}
        <PhotoButton label={draft.photos.length ? "Take another photo" : "Take photo of the part"} onPhoto={(p) => set({ photos: [...draft.photos, { ...p, id: uuid(), url: URL.createObjectURL(p.blob) }] })} />
      </div>
      <fieldset className="flex flex-col gap-2">
        <legend className="text-lg font-bold">Parts it needs</legend>
        {draft.parts.map((p, i) => (
          <div key={p.key} className="flex flex-col gap-1">
            <div className="flex gap-2">
              <input aria-label={`Part ${i + 1}`} placeholder="e.g. Fuel line 3/32 in ID" className={inputClass} value={p.description} maxLength={200} onChange={(e) => set({ parts: draft.parts.map((x) => (x.key === p.key ? { ...x, description: e.target.value } : x)) })} />
              <input aria-label={`Quantity of part ${i + 1}`} inputMode="numeric" className={inputClass + " w-20 shrink-0 text-center"} value={p.qty} onChange={(e) => set({ parts: draft.parts.map((x) => (x.key === p.key ? { ...x, qty: e.target.value } : x)) })} />
              <button type="button" aria-label={`Take part ${i + 1} off`} onClick={() => set({ parts: draft.parts.filter((x) => x.key !== p.key) })} className="tap-bench shrink-0 rounded-2xl border-2 border-line">
                <Trash2 aria-hidden className="mx-auto" />
              </button>
            </div>
            {errors[`part-${p.key}`] ? <p className="font-semibold text-bad">{errors[`part-${p.key}`]}</p> : null}
          </div>
        ))}
        <button type="button" onClick={() => set({ parts: [...draft.parts, { key: uuid(), description: "", qty: "1" }] })} className="tap-bench inline-flex items-center gap-2 self-start rounded-2xl border-2 border-line px-4 text-base font-bold">
          <Plus aria-hidden size={20} /> Add a part
        </button>
      </fieldset>
      <fieldset className="flex flex-col gap-2">
        <legend className="text-lg font-bold">Labor it needs (minutes)</legend>
        <div className="flex flex-wrap gap-2">
          {LABOR_CHIPS.map((m) => (
            <button key={m} type="button" aria-pressed={draft.labor === String(m)} onClick={() => set({ labor: String(m) })} className={"tap-bench rounded-2xl border-2 px-4 text-lg font-bold " + (draft.labor === String(m) ? "border-accent bg-accent text-accent-ink" : "border-line bg-surface")}>
              {m}
            </button>
          ))}
        </div>
        <input aria-label="Labor minutes" inputMode="numeric" className={inputClass + " w-32"} value={draft.labor} onChange={(e) => set({ labor: e.target.value })} aria-invalid={errors.labor ? true : undefined} />
        {errors.labor ? <p className="font-semibold text-bad">{errors.labor}</p> : null}
      </fieldset>
      {draft.alternative ? (
        <fieldset className="flex flex-col gap-2 rounded-2xl border-2 border-dashed border-line p-3">
          <legend className="px-1 text-lg font-bold">Another way to fix it</legend>
          <input aria-label="Name of the other way" placeholder="e.g. Replace the carburetor assembly" className={inputClass} value={draft.alternative.label} maxLength={120} onChange={(e) => set({ alternative: { ...draft.alternative!, label: e.target.value } })} />
          {errors.altLabel ? <p className="font-semibold text-bad">{errors.altLabel}</p> : null}
          <input aria-label="Part for the other way" placeholder="Part, e.g. Carburetor assembly" className={inputClass} value={draft.alternative.part} maxLength={200} onChange={(e) => set({ alternative: { ...draft.alternative!, part: e.target.value } })} />
          <input aria-label="Labor minutes for the other way" inputMode="numeric" placeholder="Minutes" className={inputClass + " w-32"} value={draft.alternative.labor} onChange={(e) => set({ alternative: { ...draft.alternative!, labor: e.target.value } })} />
          {errors.altLabor ? <p className="font-semibold text-bad">{errors.altLabor}</p> : null}
          <button type="button" onClick={() => set({ alternative: null })} className="tap-bench self-start rounded-2xl px-3 text-base font-semibold underline">
            No other way
          </button>
        </fieldset>
      ) : (
        <button type="button" onClick={() => set({ alternative: { label: "", labor: "", part: "" } })} className="tap-bench inline-flex items-center gap-2 self-start rounded-2xl border-2 border-line px-4 text-base font-bold">
          <Plus aria-hidden size={20} /> Offer another way (e.g. replace the assembly)
        </button>
      )}
      <AlertText message={message} boxed />
      <div className="sticky bottom-[4.5rem] z-[5] -mx-4 flex gap-3 border-t-2 border-line bg-surface px-4 py-3">
        <button type="button" disabled={busy} onClick={() => void submit()} className="tap-bench flex-1 rounded-2xl bg-accent px-5 text-lg font-bold text-accent-ink disabled:opacity-50">
          Save finding
        </button>
        <button type="button" disabled={busy} onClick={onDone} className="tap-bench rounded-2xl border-2 border-line bg-surface px-5 text-lg font-bold">
          Cancel
        </button>
      </div>
    </section>
  );
}

/** The ticket's findings, grouped by grade; each can be regraded, withdrawn (and put back) and given more photos. */
export function FindingsList({
  findings,
  photos,
  save,
  ticketId,
  waiting,
  disabled,
}: {
  findings: readonly FindingRow[];
  photos: readonly PhotoWithBlob[];
  save: Save;
  ticketId: string;
  waiting: Set<string>;
  disabled: boolean;
}) {
  const [error, setError] = useState<string | null>(null);
  if (findings.length === 0) return <p className="text-base text-ink-2">No findings yet. Add one from any step, or here.</p>;
  const sorted = [...findings].sort((a, b) => Number(a.withdrawn) - Number(b.withdrawn) || GRADE_ORDER.indexOf(a.grade) - GRADE_ORDER.indexOf(b.grade) || a.at.localeCompare(b.at));
  const change = async (args: RecordInput<"finding.changed">) => {
    const r = await save("finding.changed", args);
    setError(r.ok ? null : r.message);
  };
  return (
    <div className="flex flex-col gap-3">
      <AlertText message={error} />
      {sorted.map((f) => {
        const own = photos.filter((p) => p.findingId === f.id || f.photoIds.includes(p.id));
        return (
          <article key={f.id} aria-label={`Finding: ${f.title}`} className={"flex flex-col gap-3 rounded-2xl border-2 p-4 " + (f.withdrawn ? "border-line opacity-70" : f.grade === "cause" ? "border-bad" : f.grade === "due_soon" ? "border-warning" : "border-line")}>
            <p className="text-sm font-black uppercase tracking-wider">
              {GRADE_LABELS[f.grade]}
              {f.withdrawn ? " · withdrawn" : ""}
              {waiting.has(f.id) ? " · not sent yet" : ""}
            </p>
            <h3 className={"text-xl font-bold " + (f.withdrawn ? "line-through" : "")}>{f.title}</h3>
            {f.note ? <p className="text-base">{f.note}</p> : null}
            <PhotoThumbs photos={own} label={f.title} />
            {f.suggestedParts.length || f.suggestedLaborMinutes ? (
              <p className="text-base">
                <span className="font-bold">Needs: </span>
                {[...f.suggestedParts.map((p) => `${p.description} × ${p.qty}`), ...(f.suggestedLaborMinutes ? [`${f.suggestedLaborMinutes} min labor`] : [])].join(", ")}
              </p>
            ) : null}
            {f.alternatives?.map((a) => (
              <p key={a.label} className="text-base">
                <span className="font-bold">Or: </span>
                {a.label}
                {a.parts.length ? ` — ${a.parts.map((p) => p.description).join(", ")}` : ""}
                {a.laborMinutes ? `, ${a.laborMinutes} min` : ""}
              </p>
            ))}
            {!f.withdrawn ? (
              <>
                <ChoiceChips label="Grade" mode="single" options={GRADE_OPTIONS} value={[f.grade]} disabled={disabled} onChange={(v) => v[0] && v[0] !== f.grade && void change({ id: f.id, grade: v[0] as Grade })} />
                <div className="flex flex-wrap gap-3">
                  <PhotoButton
                    label="Add photo"
                    disabled={disabled}
                    onPhoto={async (p) => {
                      const r = await save("photo.attached", { ticketId, sha256: p.sha256, mime: "image/jpeg", bytes: p.bytes, width: p.width, height: p.height, findingId: f.id, ...(f.stepId ? { stepId: f.stepId } : {}) }, { blob: p.blob });
                      setError(r.ok ? null : r.message);
                    }}
                  />
                  <button type="button" disabled={disabled} onClick={() => void change({ id: f.id, withdrawn: true })} className="tap-bench inline-flex items-center gap-2 rounded-2xl border-2 border-line px-4 text-base font-bold disabled:opacity-50">
                    <Undo2 aria-hidden size={20} /> Withdraw
                  </button>
                </div>
              </>
            ) : (
              <button type="button" disabled={disabled} onClick={() => void change({ id: f.id, withdrawn: false })} className="tap-bench self-start rounded-2xl border-2 border-line px-4 text-base font-bold disabled:opacity-50">
                Put it back
              </button>
            )}
          </article>
        );
      })}
    </div>
  );
}
