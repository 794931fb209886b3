"use client";

import { useId, useState } from "react";
import { ArrowDown, ArrowUp, Check } from "lucide-react";
import type { ReadingCheck } from "@/lib/trade/readings";
import { evaluateReading, READING_UNIT_LABELS } from "@/lib/procedures/values";
import type { ReadingSpec, ReadingUnit } from "@/lib/procedures/model";

export type RecordedReading = { value: number; unit: ReadingUnit; check: ReadingCheck | null };

/** "120", "120.5", "0,6" (a decimal comma) → number; anything else → NaN. */
export function parseReadingText(text: string): number {
  const t = text.trim().replace(",", ".");
  return /^\d+(\.\d+)?$|^\.\d+$/.test(t) ? Number(t) : Number.NaN;
}

const VERDICT = {
  low: { word: "Low", Icon: ArrowDown },
  within: { word: "Within", Icon: Check },
  high: { word: "High", Icon: ArrowUp },
} as const;

/**
 * A bench reading: a big numeric field (the phone's decimal keypad), a unit toggle, and the verdict against the
 * step's spec band (low / within / high, from lib/trade readings) as the tech types. A soft band (common practice
 * or a standard from memory) is shown as a typical range, never as a fail. "Record" hands the reading up; a bad
 * entry shows its error and keeps what was typed.
 */
export function ReadingInput({
  label,
  hint,
  spec,
  initial,
  onRecord,
  recordLabel = "Record reading",
}: {
  label: string;
  hint?: string;
  spec: ReadingSpec;
  initial?: { value: number; unit: ReadingUnit };
  onRecord: (reading: RecordedReading) => void;
  recordLabel?: string;
}) {
  const id = useId();
  const [text, setText] = useState(initial ? String(initial.value) : "");
  const [unit, setUnit] = useState<ReadingUnit>(initial?.unit ?? (spec.units[0] as ReadingUnit));
  const [error, setError] = useState<string | null>(null);

  const value = parseReadingText(text);
  const live = text.trim() === "" || Number.isNaN(value) ? null : evaluateReading(spec, value, unit);
  const check = live && live.ok ? live.value : null;

  const record = () => {
    if (text.trim() === "") return setError("Enter the reading first.");
    if (Number.isNaN(value)) return setError(`"${text}" is not a number. Use digits and one decimal point, e.g. 125 or 0.55.`);
    const r = evaluateReading(spec, value, unit);
    if (!r.ok) return setError(r.message);
    setError(null);
    onRecord({ value, unit, check: r.value });
  };

  return (
    <div className="flex flex-col gap-3">
      <label htmlFor={`${id}-value`} className="text-lg font-bold">
        {label}
      </label>
      {hint ? <p className="-mt-2 text-base text-ink-2">{hint}</p> : null}
      <div className="flex items-stretch gap-3">
        <input
          id={`${id}-value`}
          inputMode="decimal"
          enterKeyHint="done"
          autoComplete="off"
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            setError(null);
          }}
          onKeyDown={(e) => {
            if (e.key === "Enter") record();
          }}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-verdict${error ? ` ${id}-error` : ""}`}
          className={
            "tap-bench w-0 min-w-0 flex-1 rounded-2xl border-2 bg-surface px-4 text-3xl font-bold tabular-nums text-ink " +
            (error ? "border-bad" : "border-line focus:border-accent")
          }
        />
        {spec.units.length > 1 ? (
          <div role="radiogroup" aria-label="Unit" className="flex gap-2">
            {spec.units.map((u) => (
              <button
                key={u}
                type="button"
                role="radio"
                aria-checked={u === unit}
                onClick={() => {
                  setUnit(u);
                  setError(null);
                }}
                className={
                  "tap-bench rounded-2xl border-2 px-3 text-lg font-bold " +
                  (u === unit ? "border-accent bg-accent text-accent-ink" : "border-line bg-surface text-ink")
                }
              >
                {READING_UNIT_LABELS[u]}
              </button>
            ))}
          </div>
        ) : (
          <span className="flex items-center px-2 text-2xl font-bold">{READING_UNIT_LABELS[unit]}</span>
        )}
      </div>
      <div id={`${id}-verdict`} aria-live="polite">
        {check ? <VerdictLine check={check} /> : null}
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="font-semibold text-bad">
          {error}
        </p>
      ) : null}
      <button type="button" onClick={record} className="tap-bench rounded-2xl bg-accent px-5 text-lg font-bold text-accent-ink">
        {recordLabel}
      </button>
    </div>
  );
}

function VerdictLine({ check }: { check: ReadingCheck }) {
  const { word, Icon } = VERDICT[check.verdict];
  const tone =
    check.verdict === "within"
      ? "border-ok bg-ok-soft"
      : check.soft
        ? "border-line bg-surface-2"
        : "border-bad bg-bad-soft";
  return (
    <div className={`flex items-start gap-3 rounded-2xl border-l-8 px-4 py-3 ${tone}`} data-verdict={check.verdict}>
      <Icon aria-hidden size={28} strokeWidth={3} className="mt-0.5 shrink-0" />
      <div>
        <p className="text-xl font-bold">
          {word}
          {check.soft ? <span className="font-semibold"> · typical range</span> : null}
        </p>
        <p className="text-base">{check.message}</p>
      </div>
    </div>
  );
}
