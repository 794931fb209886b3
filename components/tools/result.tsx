import type { ReactNode } from "react";

/** A result readable at arm's length: big figure, small explanation under it. */
export function BigResult({ label, value, detail }: { label: string; value: ReactNode; detail?: ReactNode }) {
  return (
    <div role="status" aria-live="polite" className="rounded-2xl border-2 border-accent bg-accent-soft px-5 py-4">
      <p className="text-base font-bold text-ink-2">{label}</p>
      <p className="text-4xl font-black tracking-tight text-ink" data-testid="big-result">
        {value}
      </p>
      {detail ? <div className="mt-1 text-base text-ink-2">{detail}</div> : null}
    </div>
  );
}

export function ToolError({ children }: { children: ReactNode }) {
  return (
    <p role="alert" className="rounded-2xl border-l-8 border-bad bg-bad-soft px-4 py-3 text-lg font-semibold text-ink">
      {children}
    </p>
  );
}

/** Parses a number as typed on a phone ("2,5" or "2.5"); NaN when it is not one. */
export function typedNumber(text: string): number {
  const t = text.trim().replace(",", ".");
  return t === "" || !/^[-+]?(\d+\.?\d*|\.\d+)$/.test(t) ? Number.NaN : Number(t);
}
