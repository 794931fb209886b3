/**
 * A recorded result in words, for the counter's view of the bench sheet and for histories:
 * "Strong", "Pass", "118 psi (within)", "Low ¼ turn out from seated; High 1 turn out", "Fuel line (1/8 in) × 1".
 */
import { applyTuneLog, describePosition, SCREW_LABELS } from "../trade/tune";
import { allSteps, type Procedure, type Step } from "./model";
import { evaluateReading, READING_UNIT_LABELS, stepValueSchema, type StepValue } from "./values";

export function stepById(procedure: Procedure | undefined, stepId: string): Step | undefined {
  return procedure ? allSteps(procedure).find((s) => s.id === stepId) : undefined;
}

const cap = (s: string) => (s ? s[0]!.toUpperCase() + s.slice(1) : s);

/** The result in words; a value that does not fit its step is shown as "(unreadable result)", never thrown. */
export function describeStepValue(step: Step | undefined, raw: unknown): string {
  const parsed = stepValueSchema.safeParse(raw);
  if (!parsed.success) return "(unreadable result)";
  const value: StepValue = parsed.data;
  switch (value.kind) {
    case "choice": {
      if (step?.kind !== "choice") return value.selected.join(", ");
      return value.selected.map((id) => step.options.find((o) => o.id === id)?.label ?? id).join(", ") || "Nothing picked";
    }
    case "pass-fail":
      if (step?.kind === "pass-fail") return value.pass ? (step.passLabel ?? "Pass") : (step.failLabel ?? "Fail");
      return value.pass ? "Pass" : "Fail";
    case "reading": {
      const unit = (READING_UNIT_LABELS as Record<string, string>)[value.unit] ?? value.unit;
      const base = `${value.value} ${unit}`;
      if (step?.kind !== "reading") return base;
      const check = evaluateReading(step.reading, value.value, value.unit);
      return check.ok && check.value ? `${base} (${check.value.verdict})` : base;
    }
    case "note":
      return value.text.trim() || "(empty note)";
    case "photo":
      return value.photoIds.length === 1 ? "1 photo" : `${value.photoIds.length} photos`;
    case "tune": {
      const log = applyTuneLog(value.baselines, value.entries);
      if (!log.ok) return log.message;
      const screws = (Object.keys(value.baselines) as Array<keyof typeof log.value>).concat(value.entries.map((e) => e.screw));
      const unique = [...new Set(screws)];
      return unique.map((s) => `${cap(SCREW_LABELS[s])}: ${describePosition(log.value[s])}`).join("; ") || "No screw turned";
    }
    case "parts": {
      if (step?.kind !== "parts") return value.items.map((i) => `${i.partId} × ${i.quantity}`).join(", ");
      return (
        value.items
          .map((i) => {
            const part = step.catalog.find((p) => p.id === i.partId);
            const size = part?.sizes?.find((z) => z.id === i.sizeId)?.label;
            return `${part?.label ?? i.partId}${size ? ` (${size})` : ""} × ${i.quantity}`;
          })
          .join(", ") || "No parts"
      );
    }
  }
}
