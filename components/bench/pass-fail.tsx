"use client";

import { useId } from "react";
import { Check, X } from "lucide-react";

/** Two big answers side by side; the picked one is filled and keeps its icon, so it never relies on colour alone. */
export function PassFail({
  label,
  hint,
  value,
  onChange,
  passLabel = "Pass",
  failLabel = "Fail",
  disabled,
}: {
  label: string;
  hint?: string;
  value: boolean | null;
  onChange: (pass: boolean) => void;
  passLabel?: string;
  failLabel?: string;
  disabled?: boolean;
}) {
  const id = useId();
  const button = (pass: boolean) => {
    const on = value === pass;
    const Icon = pass ? Check : X;
    const filled = pass ? "border-ok bg-ok text-white dark:text-black" : "border-bad bg-bad text-white dark:text-black";
    return (
      <button
        type="button"
        role="radio"
        aria-checked={on}
        disabled={disabled}
        onClick={() => onChange(pass)}
        className={
          "tap-bench flex items-center justify-center gap-2 rounded-2xl border-2 px-4 py-3 text-xl font-bold select-none " +
          "disabled:opacity-50 " +
          (on ? filled : "border-line bg-surface text-ink active:bg-surface-2")
        }
      >
        <Icon aria-hidden size={26} strokeWidth={3} />
        {pass ? passLabel : failLabel}
      </button>
    );
  };
  return (
    <div className="flex flex-col gap-2">
      <p id={`${id}-label`} className="text-lg font-bold">
        {label}
      </p>
      {hint ? <p className="-mt-1 text-base text-ink-2">{hint}</p> : null}
      <div role="radiogroup" aria-labelledby={`${id}-label`} className="grid grid-cols-2 gap-3">
        {button(true)}
        {button(false)}
      </div>
    </div>
  );
}
