/**
 * Checks of a procedure definition beyond its zod shape:
 * - step ids unique in the procedure, section ids unique, option and part ids unique within their step;
 * - every hazardous step carries its hazard kind: a step whose words name a hazardous activity (fuel, a primed
 *   start, a spark test, cleaner spray, running the engine, chain or bar work, compressed air, the muffler) must
 *   list that kind in `hazards`, and every listed kind must have cautions in the registry;
 * - `showIf` refers only to steps that come earlier in bench order, with tokens those steps can give;
 * - `onlyFor` names machine kinds the procedure covers;
 * - a reading's units are ones its quantity allows.
 *
 * `validateRevision` checks a new version against the one before: ids stay stable in meaning.
 */
import type { z } from "zod";
import { cautionsFor, HAZARDOUS_STEP_KINDS, type HazardousStepKind } from "../trade/cautions";
import { allSteps, procedureSchema, type Condition, type Procedure, type Step } from "./model";
import { possibleTokens } from "./values";

export type ValidationResult = { ok: true; procedure: Procedure } | { ok: false; problems: string[] };

/**
 * Words that name a hazardous activity, per hazard kind. Checked against a step's title and help.
 * Kept narrow on purpose: "spark plug", "spark arrestor", "bar oil", "control bar" and "primer bulb" are not cues.
 */
export const HAZARD_CUES: Record<HazardousStepKind, RegExp> = {
  fueling: /\b(fuel|gasoline|petrol|premix)\b|\bfuel mix\b/i,
  "prime-start": /\bprim(e|ed|es|ing)\b|\btest start\b/i,
  "spark-test": /\bspark\b(?![\s-]*(plug|arrest))/i,
  "solvent-cleaning": /\b(cleaner|solvent|degreas\w*)\b/i,
  "test-run": /\b(run|runs|running|idle|idles|idling|accelerat\w*|full throttle|cut|load)\b/i,
  "chain-work": /\b(chain|sprocket|clutch|guide bar|bar nose|bar rails?)\b/i,
  "compressed-air": /\bcompressed air\b|\bair gun\b|\bblow(n|ing)? (out|off|through|clean)\b/i,
  "hot-muffler": /\b(muffler|exhaust port)\b|\bspark arrest\w*/i,
  "blade-work": /\b(blade|blades|blade bolt)\b/i,
  "electrical-output": /\b(outlet|outlets|volts|GFCI|receptacle)\b/i,
};

/** The hazard kinds a step's words name. */
export function cuedHazards(step: Pick<Step, "title" | "help">): HazardousStepKind[] {
  const words = `${step.title} ${step.help ?? ""}`;
  return HAZARDOUS_STEP_KINDS.filter((k) => HAZARD_CUES[k].test(words));
}

function zodProblems(error: z.ZodError): string[] {
  return error.issues.map((i) => `${i.path.length ? i.path.join(".") : "procedure"}: ${i.message}`);
}

function checkCondition(
  c: Condition,
  where: string,
  earlier: ReadonlyMap<string, Step>,
  all: ReadonlyMap<string, Step>,
  problems: string[],
): void {
  if ("step" in c) {
    const target = earlier.get(c.step);
    if (!target) {
      problems.push(
        all.has(c.step)
          ? `${where}: showIf refers to "${c.step}", which does not come before it.`
          : `${where}: showIf refers to "${c.step}", which is not a step of this procedure.`,
      );
      return;
    }
    const tokens = possibleTokens(target);
    for (const t of c.anyOf) {
      if (!tokens.includes(t)) problems.push(`${where}: "${c.step}" can never give "${t}" (it gives ${tokens.join(", ")}).`);
    }
    return;
  }
  const parts = "all" in c ? c.all : "any" in c ? c.any : [c.not];
  for (const p of parts) checkCondition(p, where, earlier, all, problems);
}

/** Validate a procedure definition: the zod shape, then the rules above. */
export function validateProcedure(input: unknown): ValidationResult {
  const parsed = procedureSchema.safeParse(input);
  if (!parsed.success) return { ok: false, problems: zodProblems(parsed.error) };
  const procedure = parsed.data;
  const problems: string[] = [];

  const sectionIds = new Set<string>();
  for (const s of procedure.sections) {
    if (sectionIds.has(s.id)) problems.push(`Section id "${s.id}" is used twice.`);
    sectionIds.add(s.id);
  }

  const all = new Map<string, Step>();
  for (const step of allSteps(procedure)) {
    if (all.has(step.id)) problems.push(`Step id "${step.id}" is used twice.`);
    else all.set(step.id, step);
  }

  const earlier = new Map<string, Step>();
  for (const step of allSteps(procedure)) {
    const where = `Step "${step.id}"`;
    const hazards = step.hazards ?? [];
    if (new Set(hazards).size !== hazards.length) problems.push(`${where}: a hazard kind is listed twice.`);
    for (const kind of hazards) {
      if (cautionsFor(kind).length === 0) problems.push(`${where}: hazard "${kind}" has no cautions in the registry.`);
    }
    for (const kind of cuedHazards(step)) {
      if (!hazards.includes(kind)) {
        problems.push(`${where}: its words ("${step.title}") name a hazardous activity, so it must carry the hazard "${kind}".`);
      }
    }
    if (step.showIf) checkCondition(step.showIf, where, earlier, all, problems);
    if (step.onlyFor) {
      for (const k of step.onlyFor) {
        if (!procedure.machineKinds.includes(k)) problems.push(`${where}: onlyFor names "${k}", which this procedure does not cover.`);
      }
    }
    if (step.kind === "choice") {
      const ids = step.options.map((o) => o.id);
      if (new Set(ids).size !== ids.length) problems.push(`${where}: an option id is used twice.`);
      if (step.mode === "single" && step.options.some((o) => o.exclusive)) {
        problems.push(`${where}: "exclusive" only makes sense on a multi choice.`);
      }
    }
    if (step.kind === "parts") {
      const ids = step.catalog.map((p) => p.id);
      if (new Set(ids).size !== ids.length) problems.push(`${where}: a part id is used twice.`);
    }
    if (step.kind === "reading" && new Set(step.reading.units).size !== step.reading.units.length) {
      problems.push(`${where}: a unit is listed twice.`);
    }
    earlier.set(step.id, step);
  }

  return problems.length ? { ok: false, problems } : { ok: true, procedure };
}

export type RevisionCheck = { ok: true; removedSteps: string[]; addedSteps: string[] } | { ok: false; problems: string[] };

/**
 * Check a new version of a procedure against the previous one. Step ids are stable across versions, so a kept id
 * must keep its kind (and a choice its option ids): recorded results stay meaningful. Removing a step is allowed
 * (its old results stay in the history); a step whose meaning changes must get a new id.
 */
export function validateRevision(previous: Procedure, next: Procedure): RevisionCheck {
  const problems: string[] = [];
  if (next.id !== previous.id) problems.push(`A revision keeps the procedure id ("${previous.id}"), not "${next.id}".`);
  if (next.version <= previous.version) {
    problems.push(`The new version (${next.version}) must be higher than ${previous.version}.`);
  }
  const before = new Map(allSteps(previous).map((s) => [s.id, s]));
  const after = new Map(allSteps(next).map((s) => [s.id, s]));
  for (const [id, old] of before) {
    const now = after.get(id);
    if (!now) continue;
    if (now.kind !== old.kind) {
      problems.push(`Step "${id}" changed from ${old.kind} to ${now.kind}: give the new step a new id.`);
      continue;
    }
    if (old.kind === "choice" && now.kind === "choice") {
      const kept = new Set(now.options.map((o) => o.id));
      for (const o of old.options) {
        if (!kept.has(o.id)) problems.push(`Step "${id}" lost its option "${o.id}": keep it, or give the step a new id.`);
      }
      if (old.mode !== now.mode) problems.push(`Step "${id}" changed from ${old.mode} to ${now.mode} choice: give it a new id.`);
    }
    if (old.kind === "reading" && now.kind === "reading" && old.reading.quantity !== now.reading.quantity) {
      problems.push(`Step "${id}" now measures ${now.reading.quantity} instead of ${old.reading.quantity}: give it a new id.`);
    }
  }
  if (problems.length) return { ok: false, problems };
  return {
    ok: true,
    removedSteps: [...before.keys()].filter((id) => !after.has(id)),
    addedSteps: [...after.keys()].filter((id) => !before.has(id)),
  };
}
