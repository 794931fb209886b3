/**
 * The procedure model: a bench-sheet template per machine kind, in sections of steps.
 *
 * - A step's `id` is stable across versions of its procedure: results recorded against version 1 still belong
 *   to the same step in version 2. A step whose meaning changes gets a new id (see `validateRevision`).
 * - Step kinds: choice chips (single or multi), pass/fail, reading (a number with a unit and a spec band),
 *   text note, photo, tune entry (carburetor screws) and parts used.
 * - `hazards` names the hazardous step kinds of lib/trade/cautions; the sheet shows `cautionsFor(kind)` at the step.
 * - `showIf` shows a step only when earlier results match (e.g. the spark test when the primed start gave no start).
 * - `onlyFor` narrows a step to some machine kinds of a procedure that covers several (trimmer, blower, hedge trimmer).
 *
 * Pure TypeScript plus zod: no framework, no database.
 */
import { z } from "zod";
import { HAZARDOUS_STEP_KINDS, type HazardousStepKind } from "../trade/cautions";
import { PRESSURE_UNITS } from "../trade/units";
import { SCREWS } from "../trade/tune";
import { ENGINE_TYPES, MACHINE_KINDS } from "../tickets/machine";

export const STEP_KINDS = ["choice", "pass-fail", "reading", "note", "photo", "tune", "parts"] as const;
export type StepKind = (typeof STEP_KINDS)[number];

export const STEP_KIND_LABELS: Record<StepKind, string> = {
  choice: "Choice chips",
  "pass-fail": "Pass / fail",
  reading: "Reading",
  note: "Text note",
  photo: "Photo",
  tune: "Tune entry",
  parts: "Parts used",
};

/** Ids: lower-case words joined by dashes ("primed-start"). */
const ID = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;
const idSchema = z.string().regex(ID, "Use lower-case letters, digits and dashes (e.g. primed-start).");
const text = (max: number) => z.string().trim().min(1).max(max);

// ---- Conditions -----------------------------------------------------------------------------------

/**
 * When a step is shown (and when a guide rule fires).
 * `{ step, anyOf }` holds when that step is shown, answered, and its result gives any of the tokens:
 * a choice's option ids, "pass" / "fail", a reading's verdict "low" / "within" / "high", or "answered".
 */
export type Condition =
  | { step: string; anyOf: string[] }
  | { all: Condition[] }
  | { any: Condition[] }
  | { not: Condition };

export const conditionSchema: z.ZodType<Condition> = z.lazy(() =>
  z.union([
    z.strictObject({ step: idSchema, anyOf: z.array(z.string().min(1)).min(1) }),
    z.strictObject({ all: z.array(conditionSchema).min(1) }),
    z.strictObject({ any: z.array(conditionSchema).min(1) }),
    z.strictObject({ not: conditionSchema }),
  ]),
);

/** The tokens a result can give, besides option ids. */
export const PASS_FAIL_TOKENS = ["pass", "fail"] as const;
export const VERDICT_TOKENS = ["low", "within", "high"] as const;
export const ANSWERED = "answered";

// ---- Readings ------------------------------------------------------------------------------------

const bandSchema = z
  .strictObject({ min: z.number(), max: z.number() })
  .refine((b) => b.min <= b.max, "The band's low limit is above its high limit.");

const gapSpecSchema = z.union([
  z
    .strictObject({ min: z.number().nonnegative(), max: z.number().positive(), unit: z.enum(["in", "mm"]) })
    .refine((b) => b.min <= b.max, "The gap's low limit is above its high limit."),
  z.strictObject({
    nominal: z.number().positive(),
    tolerance: z.number().nonnegative(),
    unit: z.enum(["in", "mm"]),
  }),
]);

/**
 * What a reading step measures, with its spec. Owner-set bands are hard pass/fail; with none set, a
 * built-in default (common practice, or a standard recalled from memory) is shown as a soft band.
 */
export const readingSpecSchema = z.discriminatedUnion("quantity", [
  z.strictObject({
    quantity: z.literal("compression"),
    units: z.array(z.enum(PRESSURE_UNITS)).min(1),
    /** Owner-set band in psi; absent: the soft default 100–150 psi (common practice). */
    ownerBandPsi: bandSchema.optional(),
  }),
  z.strictObject({
    quantity: z.literal("plug-gap"),
    units: z.array(z.enum(["mm", "in"])).min(1),
    /** Owner-set gap (the plug or engine maker's figure). */
    ownerGap: gapSpecSchema.optional(),
    /** Soft default when no owner gap is set: the typical small two-stroke band (common practice). */
    typical: z.enum(["two-stroke"]).optional(),
  }),
  z.strictObject({ quantity: z.literal("rpm"), units: z.tuple([z.literal("rpm")]), ownerWindow: bandSchema.optional() }),
  z.strictObject({
    quantity: z.literal("volts"),
    units: z.tuple([z.literal("V")]),
    nominal: z.number().positive(),
    /** Owner-set band; absent for 120 / 240 V: ANSI C84.1 Range A (from memory, soft). */
    ownerBand: bandSchema.optional(),
  }),
  z.strictObject({
    quantity: z.literal("hertz"),
    units: z.tuple([z.literal("Hz")]),
    nominal: z.union([z.literal(50), z.literal(60)]),
    /** Owner-set window; absent: nominal ± 5 % (common practice, soft). */
    ownerWindow: bandSchema.optional(),
  }),
]);
export type ReadingSpec = z.infer<typeof readingSpecSchema>;
export type ReadingQuantity = ReadingSpec["quantity"];
export type ReadingUnit = ReadingSpec["units"][number];

// ---- Steps ---------------------------------------------------------------------------------------

const optionSchema = z.strictObject({
  id: idSchema,
  label: text(80),
  /** Picking it clears the others in a multi choice ("none found"). */
  exclusive: z.boolean().optional(),
});
export type ChoiceOption = z.infer<typeof optionSchema>;

const partSchema = z.strictObject({
  id: idSchema,
  label: text(80),
  /** Sizes to pick from, e.g. a fuel line's inside diameter. */
  sizes: z.array(z.strictObject({ id: idSchema, label: text(40) })).min(1).optional(),
});
export type PartOption = z.infer<typeof partSchema>;

const stepBase = {
  id: idSchema,
  title: text(120),
  /** A line of how-to under the title, our own words. */
  help: z.string().trim().max(400).optional(),
  hazards: z.array(z.enum(HAZARDOUS_STEP_KINDS)).min(1).optional(),
  showIf: conditionSchema.optional(),
  /** The tech may leave it blank and still finish the sheet. */
  optional: z.boolean().optional(),
  onlyFor: z.array(z.enum(MACHINE_KINDS)).min(1).optional(),
};

export const stepSchema = z.discriminatedUnion("kind", [
  z.strictObject({
    ...stepBase,
    kind: z.literal("choice"),
    mode: z.enum(["single", "multi"]),
    options: z.array(optionSchema).min(2),
  }),
  z.strictObject({
    ...stepBase,
    kind: z.literal("pass-fail"),
    passLabel: text(40).optional(),
    failLabel: text(40).optional(),
  }),
  z.strictObject({ ...stepBase, kind: z.literal("reading"), reading: readingSpecSchema }),
  z.strictObject({ ...stepBase, kind: z.literal("note"), placeholder: z.string().max(120).optional() }),
  z.strictObject({ ...stepBase, kind: z.literal("photo"), maxPhotos: z.number().int().min(1).max(20).optional() }),
  z.strictObject({ ...stepBase, kind: z.literal("tune"), screws: z.array(z.enum(SCREWS)).min(1) }),
  z.strictObject({ ...stepBase, kind: z.literal("parts"), catalog: z.array(partSchema).min(1) }),
]);
export type Step = z.infer<typeof stepSchema>;
export type StepOf<K extends StepKind> = Extract<Step, { kind: K }>;
export type ChoiceStep = StepOf<"choice">;
export type PassFailStep = StepOf<"pass-fail">;
export type ReadingStep = StepOf<"reading">;
export type NoteStep = StepOf<"note">;
export type PhotoStep = StepOf<"photo">;
export type TuneStep = StepOf<"tune">;
export type PartsStep = StepOf<"parts">;

export const sectionSchema = z.strictObject({
  id: idSchema,
  title: text(80),
  steps: z.array(stepSchema).min(1),
});
export type Section = z.infer<typeof sectionSchema>;

export const procedureSchema = z.strictObject({
  id: idSchema,
  /** Whole number, raised by one for every published change. */
  version: z.number().int().min(1),
  title: text(80),
  summary: z.string().trim().max(300).optional(),
  machineKinds: z.array(z.enum(MACHINE_KINDS)).min(1),
  engineTypes: z.array(z.enum(ENGINE_TYPES)).min(1),
  sections: z.array(sectionSchema).min(1),
});
export type Procedure = z.infer<typeof procedureSchema>;

/** Every step in bench order. */
export function allSteps(procedure: Procedure): Step[] {
  return procedure.sections.flatMap((s) => s.steps);
}

/** The step with this id, or undefined. */
export function findStep(procedure: Procedure, stepId: string): Step | undefined {
  for (const section of procedure.sections) {
    const step = section.steps.find((s) => s.id === stepId);
    if (step) return step;
  }
  return undefined;
}

/** The hazard kinds a step carries (empty for none). */
export function stepHazards(step: Step): readonly HazardousStepKind[] {
  return step.hazards ?? [];
}

/** The step ids a condition refers to. */
export function conditionSteps(c: Condition): string[] {
  if ("step" in c) return [c.step];
  if ("all" in c) return c.all.flatMap(conditionSteps);
  if ("any" in c) return c.any.flatMap(conditionSteps);
  return conditionSteps(c.not);
}
