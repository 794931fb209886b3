/**
 * Which steps a sheet shows, from the results so far.
 *
 * Steps are walked in bench order. A step is shown when it fits the machine (`onlyFor`) and its `showIf` holds on
 * the results of the steps shown before it. A result recorded on a step that is now hidden (the tech changed an
 * earlier answer) stays in the history but no longer counts: it neither shows later steps nor fires guide rules.
 */
import type { MachineKind } from "../tickets/machine";
import { allSteps, findStep, type Condition, type Procedure, type Step } from "./model";
import { valueTokens, type Results, type StepValue } from "./values";

export type SheetContext = {
  /** The ticket's machine kind; without it every `onlyFor` step is shown. */
  machineKind?: MachineKind;
};

/** Evaluate a condition against results of visible steps (`effective`). */
export function evaluateCondition(procedure: Procedure, condition: Condition, effective: Results): boolean {
  if ("step" in condition) {
    const step = findStep(procedure, condition.step);
    if (!step) return false;
    const tokens = valueTokens(step, effective[condition.step]);
    return condition.anyOf.some((t) => tokens.includes(t));
  }
  if ("all" in condition) return condition.all.every((c) => evaluateCondition(procedure, c, effective));
  if ("any" in condition) return condition.any.some((c) => evaluateCondition(procedure, c, effective));
  return !evaluateCondition(procedure, condition.not, effective);
}

export type SheetView = {
  /** The steps shown, in bench order. */
  visible: Step[];
  /** The results that count: those of shown steps. */
  effective: Results;
};

/** The steps shown and the results that count, given the latest result per step. */
export function sheetView(procedure: Procedure, results: Results, context: SheetContext = {}): SheetView {
  const visible: Step[] = [];
  const effective: Record<string, StepValue> = {};
  for (const step of allSteps(procedure)) {
    if (step.onlyFor && context.machineKind && !step.onlyFor.includes(context.machineKind)) continue;
    if (step.showIf && !evaluateCondition(procedure, step.showIf, effective)) continue;
    visible.push(step);
    const value = results[step.id];
    if (value && value.kind === step.kind) effective[step.id] = value;
  }
  return { visible, effective };
}

/** The steps shown, in bench order. */
export function visibleSteps(procedure: Procedure, results: Results, context: SheetContext = {}): Step[] {
  return sheetView(procedure, results, context).visible;
}

/** Shown steps that are neither answered nor optional: what is left before the sheet is complete. */
export function openSteps(procedure: Procedure, results: Results, context: SheetContext = {}): Step[] {
  const { visible, effective } = sheetView(procedure, results, context);
  return visible.filter((s) => !s.optional && effective[s.id] === undefined);
}
