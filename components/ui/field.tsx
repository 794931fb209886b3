import type { InputHTMLAttributes, ReactNode } from "react";

/** A labelled input with its error shown right beside it. */
export function Field({
  label,
  name,
  error,
  hint,
  className = "",
  ...input
}: InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; name: string; error?: string; hint?: ReactNode }) {
  const id = input.id ?? `f-${name}`;
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <input
        id={id}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        {...input}
        className={
          "tap rounded-xl border-2 bg-surface px-4 text-lg text-ink " +
          (error ? "border-bad" : "border-line focus:border-accent")
        }
      />
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-bad" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}
