"use client";

import { useId } from "react";
import { Check } from "lucide-react";

export type ChipOption = { id: string; label: string; exclusive?: boolean };

/**
 * Choice chips sized for gloved fingers: at least 56 px tall, with gaps between them; a picked chip shows a tick
 * as well as its colour. Single: one answer (a radio group). Multi: several, where an `exclusive` option
 * ("none found") clears the others and is cleared by them. No hover-only or double-tap actions.
 */
export function ChoiceChips({
  label,
  hint,
  options,
  mode,
  value,
  onChange,
  error,
  disabled,
}: {
  label: string;
  hint?: string;
  options: readonly ChipOption[];
  mode: "single" | "multi";
  value: readonly string[];
  onChange: (next: string[]) => void;
  error?: string;
  disabled?: boolean;
}) {
  const id = useId();
  const pick = (option: ChipOption) => {
    if (mode === "single") {
      if (!value.includes(option.id)) onChange([option.id]);
      return;
    }
    if (value.includes(option.id)) {
      onChange(value.filter((v) => v !== option.id));
      return;
    }
    if (option.exclusive) {
      onChange([option.id]);
      return;
    }
    const exclusive = new Set(options.filter((o) => o.exclusive).map((o) => o.id));
    onChange([...value.filter((v) => !exclusive.has(v)), option.id]);
  };
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}>
      <legend id={`${id}-label`} className="mb-1 text-lg font-bold">
        {label}
      </legend>
      {hint ? (
        <p id={`${id}-hint`} className="-mt-1 text-base text-ink-2">
          {hint}
        </p>
      ) : null}
      <div
        role={mode === "single" ? "radiogroup" : "group"}
        aria-labelledby={`${id}-label`}
        className="flex flex-wrap gap-3"
      >
        {options.map((o) => {
          const on = value.includes(o.id);
          return (
            <button
              key={o.id}
              type="button"
              disabled={disabled}
              {...(mode === "single" ? { role: "radio", "aria-checked": on } : { "aria-pressed": on })}
              onClick={() => pick(o)}
              className={
                "tap-bench inline-flex items-center gap-2 rounded-2xl border-2 px-5 py-3 text-left text-lg font-semibold " +
                "select-none disabled:opacity-50 " +
                (on ? "border-accent bg-accent text-accent-ink" : "border-line bg-surface text-ink active:bg-surface-2")
              }
            >
              {on ? <Check aria-hidden size={22} strokeWidth={3} /> : null}
              {o.label}
            </button>
          );
        })}
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="font-semibold text-bad">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
