"use client";

import { AlertText } from "@/components/ui/alert-text";
import { useState } from "react";
import { Minus, Plus, X } from "lucide-react";
import { ChoiceChips } from "../choice-chips";
import type { PartsStep } from "@/lib/procedures/model";
import type { StepValue } from "@/lib/procedures/values";

type PartsValue = Extract<StepValue, { kind: "parts" }>;

/**
 * Parts replaced at a step: pick the part (and its size, e.g. a fuel line's inside diameter), the quantity, add.
 * Each change records the whole list again as a new entry, so Undo brings the list back as it was.
 */
export function PartsStepInput({
  step,
  value,
  onChange,
  disabled,
  error,
}: {
  step: PartsStep;
  value: PartsValue;
  onChange: (next: PartsValue) => Promise<boolean>;
  disabled: boolean;
  error: string | null;
}) {
  const [partId, setPartId] = useState<string | null>(null);
  const [sizeId, setSizeId] = useState<string | null>(null);
  const [qty, setQty] = useState(1);
  const [local, setLocal] = useState<string | null>(null);
  const part = step.catalog.find((p) => p.id === partId);

  const add = async () => {
    if (!part) return setLocal("Pick the part first.");
    if (part.sizes && !sizeId) return setLocal(`Pick the size of the ${part.label.toLowerCase()}.`);
    setLocal(null);
    const item = { partId: part.id, ...(sizeId ? { sizeId } : {}), quantity: qty };
    const same = value.items.findIndex((i) => i.partId === item.partId && i.sizeId === item.sizeId);
    const items = same >= 0 ? value.items.map((i, n) => (n === same ? { ...i, quantity: Math.min(99, i.quantity + qty) } : i)) : [...value.items, item];
    if (await onChange({ kind: "parts", items })) {
      setPartId(null);
      setSizeId(null);
      setQty(1);
    }
  };

  const label = (i: PartsValue["items"][number]) => {
    const p = step.catalog.find((c) => c.id === i.partId);
    const s = p?.sizes?.find((z) => z.id === i.sizeId)?.label;
    return `${p?.label ?? i.partId}${s ? ` (${s})` : ""}`;
  };

  return (
    <div className="flex flex-col gap-4">
      <ChoiceChips
        label={step.title}
        hint={step.help}
        mode="single"
        options={step.catalog.map((p) => ({ id: p.id, label: p.label }))}
        value={partId ? [partId] : []}
        disabled={disabled}
        onChange={(v) => {
          setPartId(v[0] ?? null);
          setSizeId(null);
        }}
      />
      {part?.sizes ? (
        <ChoiceChips label={`Size of the ${part.label.toLowerCase()}`} mode="single" options={part.sizes} value={sizeId ? [sizeId] : []} onChange={(v) => setSizeId(v[0] ?? null)} disabled={disabled} />
      ) : null}
      {part ? (
        <div className="flex flex-wrap items-center gap-3">
          <span className="text-lg font-bold" id={`qty-${step.id}`}>
            Quantity
          </span>
          <button type="button" aria-label="One fewer" disabled={qty <= 1} onClick={() => setQty((q) => Math.max(1, q - 1))} className="tap-bench rounded-2xl border-2 border-line bg-surface-2 disabled:opacity-50">
            <Minus aria-hidden className="mx-auto" />
          </button>
          <output aria-labelledby={`qty-${step.id}`} className="min-w-10 text-center text-2xl font-black tabular-nums">
            {qty}
          </output>
          <button type="button" aria-label="One more" disabled={qty >= 99} onClick={() => setQty((q) => Math.min(99, q + 1))} className="tap-bench rounded-2xl border-2 border-line bg-surface-2 disabled:opacity-50">
            <Plus aria-hidden className="mx-auto" />
          </button>
          <button type="button" disabled={disabled} onClick={() => void add()} className="tap-bench rounded-2xl bg-accent px-6 text-lg font-bold text-accent-ink disabled:opacity-50">
            Add part
          </button>
        </div>
      ) : null}
      <AlertText message={local ?? error} />
      {value.items.length ? (
        <ul className="flex flex-col gap-2" aria-label="Parts replaced">
          {value.items.map((i, n) => (
            <li key={`${i.partId}-${i.sizeId ?? ""}`} className="flex items-center justify-between gap-3 rounded-xl bg-surface-2 px-3 py-1">
              <span className="text-lg">
                {label(i)} × {i.quantity}
              </span>
              <button
                type="button"
                disabled={disabled}
                aria-label={`Take off the list: ${label(i)}`}
                onClick={() => void onChange({ kind: "parts", items: value.items.filter((_, k) => k !== n) })}
                className="tap-bench inline-flex items-center justify-center rounded-2xl border-2 border-line bg-surface disabled:opacity-50"
              >
                <X aria-hidden />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
