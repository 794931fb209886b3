"use client";

import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes, TextareaHTMLAttributes } from "react";

/** An error line tied to its control by id. */
function ErrorLine({ id, error }: { id: string; error?: string }) {
  return error ? (
    <p id={`${id}-error`} role="alert" className="text-sm font-semibold text-bad">
      {error}
    </p>
  ) : null;
}

const box = (error?: string) =>
  "rounded-xl border-2 bg-surface px-4 text-lg text-ink " + (error ? "border-bad" : "border-line focus:border-accent");

export function TextArea({
  label,
  id,
  error,
  hint,
  ...rest
}: TextareaHTMLAttributes<HTMLTextAreaElement> & { label: ReactNode; id: string; error?: string; hint?: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <textarea
        id={id}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={[error ? `${id}-error` : "", hint ? `${id}-hint` : ""].filter(Boolean).join(" ") || undefined}
        {...rest}
        className={`${box(error)} py-3`}
      />
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      <ErrorLine id={id} error={error} />
    </div>
  );
}

export function Select({
  label,
  id,
  error,
  children,
  ...rest
}: SelectHTMLAttributes<HTMLSelectElement> & { label: ReactNode; id: string; error?: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <select id={id} aria-invalid={error ? true : undefined} aria-describedby={error ? `${id}-error` : undefined} {...rest} className={`tap ${box(error)} px-3`}>
        {children}
      </select>
      <ErrorLine id={id} error={error} />
    </div>
  );
}

/** Big tappable radio or checkbox choices in a fieldset, with the error under the group. */
export function Chips({
  legend,
  name,
  type,
  options,
  error,
  inputProps,
  hint,
  defaultValue,
}: {
  legend: ReactNode;
  name: string;
  type: "radio" | "checkbox";
  options: ReadonlyArray<readonly [value: string, label: string]>;
  error?: string;
  hint?: ReactNode;
  /** Props for every input (react-hook-form's register result). */
  inputProps: InputHTMLAttributes<HTMLInputElement> & { ref?: React.Ref<HTMLInputElement> };
  /** For uncontrolled radios (server-action forms): the value to start checked. */
  defaultValue?: string;
}) {
  const id = `chips-${name}`;
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? `${id}-error` : undefined} aria-invalid={error ? true : undefined}>
      <legend className="mb-1 font-semibold">{legend}</legend>
      {hint ? <p className="-mt-1 text-sm text-muted">{hint}</p> : null}
      <div className="flex flex-wrap gap-2">
        {options.map(([value, label]) => (
          <label
            key={value}
            className={
              "tap flex items-center gap-2 rounded-xl border-2 bg-surface px-3 select-none has-[:checked]:border-accent has-[:checked]:bg-accent-soft has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent " +
              (error ? "border-bad" : "border-line")
            }
          >
            <input
              type={type}
              value={value}
              {...inputProps}
              {...(defaultValue !== undefined ? { defaultChecked: defaultValue === value } : {})}
              className="size-5 accent-[var(--color-accent)]"
            />
            {label}
          </label>
        ))}
      </div>
      <ErrorLine id={id} error={error} />
    </fieldset>
  );
}
