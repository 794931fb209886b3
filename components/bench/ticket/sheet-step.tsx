"use client";

import { memo, useState, type ReactNode } from "react";
import { CheckCircle2, CloudUpload, Flag, Undo2 } from "lucide-react";
import { ChoiceChips } from "../choice-chips";
import { PassFail } from "../pass-fail";
import { ReadingInput } from "../reading-input";
import { HazardNote } from "../hazard-note";
import { PhotoButton } from "../photo-button";
import { PhotoThumbs } from "./photo-thumbs";
import { TunePanel } from "./tune-panel";
import { PartsStepInput } from "./parts-step";
import type { Procedure, Step } from "@/lib/procedures/model";
import { checkStepValue, type StepValue } from "@/lib/procedures/values";
import { describeStepValue } from "@/lib/procedures/describe";
import type { BenchEntryRow } from "@/lib/sync/protocol";
import type { PhotoWithBlob } from "@/lib/sync/read";
import type { TuneLog } from "@/lib/bench/sheet";
import type { SaveOutcome, useRecord } from "./use-record";

type Save = ReturnType<typeof useRecord>["save"];

/** What every step shares; stable while the ticket is open, so a step re-renders only when its own rows change. */
export interface StepContext {
  ticketId: string;
  procedure: Procedure;
  save: Save;
  disabled: boolean;
  onAddFinding: (stepId: string, title: string) => void;
}

export interface StepProps {
  step: Step;
  index: number;
  latest: BenchEntryRow | undefined;
  history: readonly BenchEntryRow[];
  photos: readonly PhotoWithBlob[];
  ctx: StepContext;
  /** Show the cautions in full (the first step of the sheet with these hazards); elsewhere titles only, one tap away. */
  fullCautions: boolean;
  /** The latest answer has not reached the server yet. */
  notSent: boolean;
  /** For a tune step: the replayed log and how many of its entries wait to be sent. */
  tune?: { log: TuneLog; waiting: number };
}

const sameRows = <T extends { id: string }>(a: readonly T[], b: readonly T[]) => a.length === b.length && a.every((x, i) => x.id === b[i]!.id);

/** A step re-renders only when its own rows, its place or its cautions change (the sheet re-reads on every save). */
export const SheetStep = memo(SheetStepView, (a, b) =>
  a.step === b.step &&
  a.index === b.index &&
  a.ctx === b.ctx &&
  a.fullCautions === b.fullCautions &&
  a.notSent === b.notSent &&
  a.latest?.id === b.latest?.id &&
  a.latest?.voidedAt === b.latest?.voidedAt &&
  sameRows(a.history, b.history) &&
  a.history.every((e, i) => e.voidedAt === b.history[i]!.voidedAt) &&
  sameRows(a.photos, b.photos) &&
  a.photos.every((p, i) => p.blob === b.photos[i]!.blob) &&
  a.tune === b.tune,
);

const timeOf = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: "numeric", minute: "2-digit" });

/**
 * One step of the bench sheet: its cautions (from the registry), the input for its kind, what was recorded and
 * when, an undo (a void entry, so the history keeps it), and "add a finding" from here.
 */
function SheetStepView({ step, index, latest, history, photos, ctx, fullCautions, notSent, tune }: StepProps) {
  const [error, setError] = useState<string | null>(null);
  const [showHistory, setShowHistory] = useState(false);
  const value = latest?.value as StepValue | undefined;
  const answered = latest !== undefined || (step.kind === "photo" && photos.length > 0) || (step.kind === "tune" && (tune?.log.baselined.size ?? 0) > 0);

  const done = (r: SaveOutcome) => {
    setError(r.ok ? null : r.message);
    return r.ok;
  };

  const recordValue = async (v: StepValue) => {
    const checked = checkStepValue(step, v);
    if (!checked.ok) return done({ ok: false, message: checked.message });
    return done(
      await ctx.save("bench.entry.recorded", {
        ticketId: ctx.ticketId,
        procedureId: ctx.procedure.id,
        procedureVersion: ctx.procedure.version,
        stepId: step.id,
        value: checked.value,
      }),
    );
  };

  const undo = async () => {
    if (!latest) return;
    done(await ctx.save("bench.entry.voided", { id: latest.id, reason: "Undone on the bench" }));
  };

  let input: ReactNode = null;
  switch (step.kind) {
    case "choice":
      input = (
        <ChoiceChips
          label={step.title}
          hint={step.help}
          mode={step.mode}
          options={step.options}
          value={value?.kind === "choice" ? value.selected : []}
          disabled={ctx.disabled}
          error={error ?? undefined}
          onChange={(selected) => {
            if (selected.length === 0) {
              setError("Pick at least one answer, or use Undo to take the last answer back.");
              return;
            }
            void recordValue({ kind: "choice", selected });
          }}
        />
      );
      break;
    case "pass-fail":
      input = (
        <PassFail
          label={step.title}
          hint={step.help}
          value={value?.kind === "pass-fail" ? value.pass : null}
          passLabel={step.passLabel}
          failLabel={step.failLabel}
          disabled={ctx.disabled}
          onChange={(pass) => void recordValue({ kind: "pass-fail", pass })}
        />
      );
      break;
    case "reading":
      input = (
        <ReadingInput
          key={latest?.id ?? "new"}
          label={step.title}
          hint={step.help}
          spec={step.reading}
          initial={value?.kind === "reading" ? { value: value.value, unit: value.unit as never } : undefined}
          onRecord={(r) => void recordValue({ kind: "reading", value: r.value, unit: r.unit })}
        />
      );
      break;
    case "note":
      input = <NoteInput key={latest?.id ?? "new"} step={step} initial={value?.kind === "note" ? value.text : ""} onSave={(text) => recordValue({ kind: "note", text })} disabled={ctx.disabled} />;
      break;
    case "photo":
      input = (
        <div className="flex flex-col gap-3">
          <StepTitle step={step} />
          <PhotoThumbs photos={photos} label={step.title} />
          <PhotoButton
            disabled={ctx.disabled || photos.length >= (step.maxPhotos ?? 6)}
            label={photos.length ? "Take another photo" : "Take photo"}
            onPhoto={async (p) => {
              done(
                await ctx.save(
                  "photo.attached",
                  { ticketId: ctx.ticketId, sha256: p.sha256, mime: "image/jpeg", bytes: p.bytes, width: p.width, height: p.height, stepId: step.id },
                  { blob: p.blob },
                ),
              );
            }}
          />
        </div>
      );
      break;
    case "tune":
      input = (
        <div className="flex flex-col gap-3">
          <StepTitle step={step} />
          {tune ? <TunePanel screws={step.screws} ticketId={ctx.ticketId} log={tune.log} save={ctx.save} disabled={ctx.disabled} waiting={tune.waiting} /> : null}
        </div>
      );
      break;
    case "parts":
      input = (
        <PartsStepInput
          step={step}
          value={value?.kind === "parts" ? value : { kind: "parts", items: [] }}
          disabled={ctx.disabled}
          onChange={(v) => recordValue(v)}
          error={error}
        />
      );
      break;
  }

  const hazards = step.hazards ?? [];
  const showsOwnError = step.kind === "choice" || step.kind === "parts";
  const earlier = history.filter((e) => e !== latest);

  return (
    <article
      id={`step-${step.id}`}
      tabIndex={-1}
      aria-label={`Step ${index}: ${step.title}`}
      data-step={step.id}
      data-answered={answered ? "yes" : "no"}
      // Steps off the screen are not laid out or painted until scrolled near (content-visibility), so a tap's
      // re-render and focus change cost the few steps in view, not the whole sheet.
      className={
        "scroll-mt-20 rounded-2xl border-2 bg-surface p-4 [contain-intrinsic-size:auto_22rem] [content-visibility:auto] focus:outline-3 focus:outline-accent " +
        (answered ? "border-ok" : "border-line")
      }
    >
      <p className="mb-2 flex items-center gap-2 text-sm font-bold uppercase tracking-wider text-ink-2">
        <span>Step {index}</span>
        {answered ? (
          <span className="inline-flex items-center gap-1 text-ok">
            <CheckCircle2 aria-hidden size={16} /> done
          </span>
        ) : step.optional ? (
          <span>optional</span>
        ) : null}
      </p>
      {hazards.length ? (
        <div className="mb-4">
          <HazardNote kinds={hazards} compact={answered || !fullCautions} />
        </div>
      ) : null}
      {input}
      {error && !showsOwnError ? (
        <p role="alert" className="mt-3 rounded-xl border-l-8 border-bad bg-bad-soft px-3 py-2 font-semibold">
          {error}
        </p>
      ) : null}
      {latest ? (
        <div className="mt-4 flex flex-col gap-3 border-t border-line pt-3">
          <p className="text-base" data-testid={`saved-${step.id}`}>
            <span className="font-bold">Recorded:</span> {describeStepValue(step, latest.value)}{" "}
            <span className="text-ink-2">· {timeOf(latest.at)}</span>{" "}
            {notSent ? (
              <span className="inline-flex items-center gap-1 font-semibold text-ink-2">
                <CloudUpload aria-hidden size={16} /> not sent yet
              </span>
            ) : null}
          </p>
        </div>
      ) : null}
      <div className="mt-3 flex flex-wrap gap-3">
        {latest ? (
          <button
            type="button"
            disabled={ctx.disabled}
            onClick={() => void undo()}
            className="tap-bench inline-flex items-center gap-2 rounded-2xl border-2 border-line bg-surface px-4 text-base font-bold active:bg-surface-2 disabled:opacity-50"
          >
            <Undo2 aria-hidden size={20} /> Undo {step.kind === "reading" ? "reading" : "answer"}
          </button>
        ) : null}
        <button
          type="button"
          disabled={ctx.disabled}
          onClick={() => ctx.onAddFinding(step.id, step.title)}
          className="tap-bench inline-flex items-center gap-2 rounded-2xl border-2 border-line bg-surface px-4 text-base font-bold active:bg-surface-2 disabled:opacity-50"
        >
          <Flag aria-hidden size={20} /> Add finding
        </button>
        {earlier.length ? (
          <button
            type="button"
            aria-expanded={showHistory}
            onClick={() => setShowHistory((s) => !s)}
            className="tap-bench inline-flex items-center rounded-2xl px-3 text-base font-semibold underline"
          >
            {showHistory ? "Hide" : "Show"} earlier answers ({earlier.length})
          </button>
        ) : null}
      </div>
      {showHistory && earlier.length ? (
        <ol className="mt-3 flex flex-col gap-1 text-base" aria-label={`Earlier answers to ${step.title}`}>
          {[...earlier].reverse().map((e) => (
            <li key={e.id} className={e.voidedAt ? "text-ink-2 line-through" : ""}>
              {describeStepValue(step, e.value)} · {timeOf(e.at)}
              {e.voidedAt ? <span className="sr-only"> (undone)</span> : null}
            </li>
          ))}
        </ol>
      ) : null}
    </article>
  );
}

function StepTitle({ step }: { step: Step }) {
  return (
    <div>
      <h3 className="text-lg font-bold">{step.title}</h3>
      {step.help ? <p className="text-base text-ink-2">{step.help}</p> : null}
    </div>
  );
}

function NoteInput({ step, initial, onSave, disabled }: { step: Extract<Step, { kind: "note" }>; initial: string; onSave: (text: string) => Promise<boolean>; disabled: boolean }) {
  const [text, setText] = useState(initial);
  const id = `note-${step.id}`;
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={id} className="text-lg font-bold">
        {step.title}
      </label>
      {step.help ? <p className="text-base text-ink-2">{step.help}</p> : null}
      <textarea
        id={id}
        value={text}
        rows={3}
        maxLength={4000}
        placeholder={step.placeholder}
        onChange={(e) => setText(e.target.value)}
        className="rounded-2xl border-2 border-line bg-surface px-4 py-3 text-lg"
      />
      <button
        type="button"
        disabled={disabled || text.trim() === "" || text === initial}
        onClick={() => void onSave(text)}
        className="tap-bench self-start rounded-2xl bg-accent px-6 text-lg font-bold text-accent-ink disabled:opacity-50"
      >
        Save note
      </button>
    </div>
  );
}
