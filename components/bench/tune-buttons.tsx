"use client";

import { useState } from "react";
import {
  applyTuneEntry,
  describeEntry,
  describePosition,
  SCREW_LABELS,
  SCREW_SHORT,
  type Direction,
  type Screw,
  type TuneEntry,
  type TuneState,
} from "@/lib/trade/tune";

const capitalize = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);

const STEPS = [
  { eighths: 1, label: "⅛" },
  { eighths: 2, label: "¼" },
  { eighths: 4, label: "½" },
] as const;

const ROWS: { direction: Direction; word: string; sub: string }[] = [
  { direction: "cw", word: "In", sub: "clockwise" },
  { direction: "ccw", word: "Out", sub: "counter-clockwise" },
];

/**
 * Tune buttons: ⅛ ¼ ½ turn in or out for each screw, with the running net position. Display only: every
 * number and meaning comes from lib/trade/tune. An entry the math refuses (a seated screw turned further in)
 * is shown with its reason and never handed up; the state the caller holds stays as it was.
 */
export function TuneButtons({
  screws,
  state,
  onEntry,
  disabled,
}: {
  screws: readonly Screw[];
  state: TuneState;
  onEntry: (entry: TuneEntry, next: TuneState) => void;
  disabled?: boolean;
}) {
  const [last, setLast] = useState<{ screw: Screw; entry?: TuneEntry; refused?: string } | null>(null);

  const tap = (entry: TuneEntry) => {
    const next = applyTuneEntry(state, entry);
    if (!next.ok) {
      setLast({ screw: entry.screw, refused: next.message });
      return;
    }
    setLast({ screw: entry.screw, entry });
    onEntry(entry, next.value);
  };

  return (
    <div className="flex flex-col gap-4">
      {screws.map((screw) => {
        const s = state[screw];
        const mine = last?.screw === screw ? last : null;
        const meaning = mine?.entry ? describeEntry(mine.entry) : null;
        return (
          <section key={screw} aria-label={SCREW_LABELS[screw]} className="rounded-2xl border-2 border-line bg-surface p-4">
            <header className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="text-xl font-bold">
                <span className="mr-2 rounded-lg bg-ink px-2 py-0.5 text-bg">{SCREW_SHORT[screw]}</span>
                {capitalize(SCREW_LABELS[screw])}
              </h3>
              <p className="text-lg font-bold tabular-nums" data-testid={`net-${screw}`}>
                {describePosition(s)}
              </p>
            </header>
            <div className="mt-3 flex flex-col gap-3">
              {ROWS.map((row) => (
                <div key={row.direction} className="grid grid-cols-[5.5rem_1fr_1fr_1fr] items-center gap-3">
                  <p className="leading-tight">
                    <span className="block text-lg font-bold">{row.word}</span>
                    <span className="block text-sm text-ink-2">{row.sub}</span>
                  </p>
                  {STEPS.map((st) => (
                    <button
                      key={st.eighths}
                      type="button"
                      disabled={disabled}
                      aria-label={`${SCREW_SHORT[screw]} screw ${st.label} turn ${row.word.toLowerCase()}`}
                      onClick={() => tap({ screw, direction: row.direction, eighths: st.eighths })}
                      className="tap-bench rounded-2xl border-2 border-line bg-surface-2 text-2xl font-bold text-ink select-none active:border-accent disabled:opacity-50"
                    >
                      {st.label}
                    </button>
                  ))}
                </div>
              ))}
            </div>
            {mine?.refused ? (
              <p role="alert" className="mt-3 rounded-xl border-l-8 border-bad bg-bad-soft px-3 py-2 font-semibold">
                {mine.refused}
              </p>
            ) : null}
            {meaning ? (
              <div className="mt-3 rounded-xl bg-surface-2 px-3 py-2" aria-live="polite">
                <p className="font-bold">{meaning.summary}</p>
                <p>{meaning.meaning}</p>
                {meaning.warning ? <p className="font-semibold text-bad">{meaning.warning}</p> : null}
                <p className="text-sm text-muted">{meaning.basis}</p>
              </div>
            ) : null}
          </section>
        );
      })}
    </div>
  );
}
