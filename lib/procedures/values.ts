/**
 * What a tech records at a step (the result), its check against the step, and the tokens conditions match on.
 *
 * Results are append-only facts on the device; the sheet shows the latest per step. `Results` maps a step id
 * to that latest value.
 */
import { z } from "zod";
import { err, ok, type Result } from "../trade/result";
import {
  checkCompression,
  checkHertz,
  checkPlugGap,
  checkRpm,
  checkVolts,
  TYPICAL_PLUG_GAPS,
  type ReadingCheck,
} from "../trade/readings";
import { SCREWS, startTune, applyTuneLog } from "../trade/tune";
import { UNIT_LABELS } from "../trade/units";
import { ANSWERED, type ReadingSpec, type ReadingUnit, type Step } from "./model";

const screw = z.enum(SCREWS);

export const stepValueSchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("choice"), selected: z.array(z.string().min(1)).max(40) }),
  z.strictObject({ kind: z.literal("pass-fail"), pass: z.boolean() }),
  z.strictObject({ kind: z.literal("reading"), value: z.number(), unit: z.string().min(1) }),
  z.strictObject({ kind: z.literal("note"), text: z.string().max(4000) }),
  /** Photos by the SHA-256 of their bytes (the device keeps the Blob until the server has it). */
  z.strictObject({ kind: z.literal("photo"), photoIds: z.array(z.string().regex(/^[0-9a-f]{64}$/)).max(20) }),
  z.strictObject({
    kind: z.literal("tune"),
    baselines: z.partialRecord(
      screw,
      z.union([
        z.strictObject({ kind: z.literal("seated-then-out"), eighths: z.number().int() }),
        z.strictObject({ kind: z.literal("as-found") }),
      ]),
    ),
    entries: z
      .array(z.strictObject({ screw, direction: z.enum(["cw", "ccw"]), eighths: z.number().int() }))
      .max(200),
  }),
  z.strictObject({
    kind: z.literal("parts"),
    items: z
      .array(z.strictObject({ partId: z.string().min(1), sizeId: z.string().min(1).optional(), quantity: z.number().int().min(1).max(99) }))
      .max(40),
  }),
]);
export type StepValue = z.infer<typeof stepValueSchema>;
export type Results = Readonly<Record<string, StepValue | undefined>>;

// ---- Readings -------------------------------------------------------------------------------------

export const READING_UNIT_LABELS: Record<ReadingUnit, string> = {
  psi: UNIT_LABELS.psi,
  kPa: UNIT_LABELS.kPa,
  bar: UNIT_LABELS.bar,
  mm: UNIT_LABELS.mm,
  in: UNIT_LABELS.in,
  rpm: UNIT_LABELS.rpm,
  V: "V",
  Hz: "Hz",
};

const TWO_STROKE_GAP = TYPICAL_PLUG_GAPS[0];

/**
 * A reading against its step's spec: the verdict (low / within / high) with its message, or `null` when the
 * step has no band to compare with (the value is still recorded). Bad input comes back as an error message.
 */
export function evaluateReading(spec: ReadingSpec, value: number, unit: string): Result<ReadingCheck | null> {
  if (!(spec.units as readonly string[]).includes(unit)) {
    return err(`Pick one of the units of this reading: ${spec.units.map((u) => READING_UNIT_LABELS[u]).join(", ")}.`);
  }
  switch (spec.quantity) {
    case "compression":
      return checkCompression({ reading: value, unit: unit as (typeof spec.units)[number], ownerBandPsi: spec.ownerBandPsi });
    case "plug-gap": {
      const u = unit as "mm" | "in";
      if (spec.ownerGap) return checkPlugGap({ reading: value, unit: u, spec: spec.ownerGap });
      if (!spec.typical) {
        if (!Number.isFinite(value) || value < 0) return err("Enter the plug gap as a number, 0 or more.");
        return ok(null);
      }
      const checked = checkPlugGap({ reading: value, unit: u, spec: { ...TWO_STROKE_GAP.bandMm, unit: "mm" } });
      if (!checked.ok) return checked;
      // The typical band is common practice: a soft warning, never a failed step.
      return ok({
        ...checked.value,
        basis: "common-practice",
        soft: true,
        message: checked.value.message.replace(/\.$/, " (typical range, common practice; set the maker's gap on the procedure)."),
      });
    }
    case "rpm":
      if (!spec.ownerWindow) {
        if (!Number.isFinite(value) || value < 0) return err("Enter the engine speed as a number of rpm, 0 or more.");
        return ok(null);
      }
      return checkRpm({ reading: value, window: spec.ownerWindow });
    case "volts":
      if (!spec.ownerBand && spec.nominal !== 120 && spec.nominal !== 240) {
        if (!Number.isFinite(value) || value < 0) return err("Enter the voltage as a positive number (AC RMS).");
        return ok(null);
      }
      return checkVolts({ reading: value, nominal: spec.nominal, ownerBand: spec.ownerBand });
    case "hertz":
      return checkHertz({ reading: value, nominal: spec.nominal, ownerWindow: spec.ownerWindow });
  }
}

/** True when a reading step can give a verdict (it has an owner band or a built-in default). */
export function readingHasBand(spec: ReadingSpec): boolean {
  switch (spec.quantity) {
    case "compression":
    case "hertz":
      return true;
    case "plug-gap":
      return Boolean(spec.ownerGap || spec.typical);
    case "rpm":
      return Boolean(spec.ownerWindow);
    case "volts":
      return Boolean(spec.ownerBand) || spec.nominal === 120 || spec.nominal === 240;
  }
}

// ---- Checking a value against its step ---------------------------------------------------------------

/** Check a recorded value against its step. Never throws on bad input: returns the message to show. */
export function checkStepValue(step: Step, value: StepValue): Result<StepValue> {
  if (value.kind !== step.kind) return err(`This step takes a ${step.kind} result, not a ${value.kind} result.`);
  switch (step.kind) {
    case "choice": {
      const v = value as Extract<StepValue, { kind: "choice" }>;
      const ids = new Set(step.options.map((o) => o.id));
      const unknown = v.selected.find((id) => !ids.has(id));
      if (unknown) return err(`"${unknown}" is not one of the choices of "${step.title}".`);
      if (new Set(v.selected).size !== v.selected.length) return err("A choice was picked twice.");
      if (step.mode === "single" && v.selected.length > 1) return err(`Pick one answer for "${step.title}".`);
      if (v.selected.length === 0) return err(`Pick an answer for "${step.title}".`);
      const exclusive = step.options.filter((o) => o.exclusive && v.selected.includes(o.id));
      if (exclusive.length > 0 && v.selected.length > 1) {
        return err(`"${exclusive[0]?.label}" cannot be picked together with other answers.`);
      }
      return ok(v);
    }
    case "reading": {
      const v = value as Extract<StepValue, { kind: "reading" }>;
      const r = evaluateReading(step.reading, v.value, v.unit);
      return r.ok ? ok(v) : r;
    }
    case "note": {
      const v = value as Extract<StepValue, { kind: "note" }>;
      return v.text.trim() === "" ? err("Write the note, or leave the step blank.") : ok(v);
    }
    case "photo": {
      const v = value as Extract<StepValue, { kind: "photo" }>;
      const max = step.maxPhotos ?? 6;
      if (v.photoIds.length === 0) return err("Take a photo, or leave the step blank.");
      if (v.photoIds.length > max) return err(`This step keeps up to ${max} photos.`);
      return ok(v);
    }
    case "tune": {
      const v = value as Extract<StepValue, { kind: "tune" }>;
      const allowed = new Set<string>(step.screws);
      const other = [...Object.keys(v.baselines), ...v.entries.map((e) => e.screw)].find((s) => !allowed.has(s));
      if (other) return err(`This machine's tune log has no ${other} screw.`);
      const start = startTune(v.baselines);
      if (!start.ok) return start;
      const log = applyTuneLog(v.baselines, v.entries);
      return log.ok ? ok(v) : err(log.message);
    }
    case "parts": {
      const v = value as Extract<StepValue, { kind: "parts" }>;
      for (const item of v.items) {
        const part = step.catalog.find((p) => p.id === item.partId);
        if (!part) return err(`"${item.partId}" is not in this step's parts list.`);
        if (part.sizes && !item.sizeId) return err(`Pick the size of the ${part.label.toLowerCase()}.`);
        if (item.sizeId && !part.sizes?.some((s) => s.id === item.sizeId)) {
          return err(`"${item.sizeId}" is not a size of the ${part.label.toLowerCase()}.`);
        }
      }
      return ok(v);
    }
    case "pass-fail":
      return ok(value);
  }
}

/** The tokens a result gives for conditions: option ids, "pass"/"fail", a verdict, and always "answered". */
export function valueTokens(step: Step, value: StepValue | undefined): string[] {
  if (!value || value.kind !== step.kind) return [];
  const tokens: string[] = [ANSWERED];
  if (value.kind === "choice") tokens.push(...value.selected);
  else if (value.kind === "pass-fail") tokens.push(value.pass ? "pass" : "fail");
  else if (value.kind === "reading" && step.kind === "reading") {
    const r = evaluateReading(step.reading, value.value, value.unit);
    if (r.ok && r.value) tokens.push(r.value.verdict);
  }
  return tokens;
}

/** Every token a step can give (for validating conditions and guide rules). */
export function possibleTokens(step: Step): string[] {
  switch (step.kind) {
    case "choice":
      return [ANSWERED, ...step.options.map((o) => o.id)];
    case "pass-fail":
      return [ANSWERED, "pass", "fail"];
    case "reading":
      return readingHasBand(step.reading) ? [ANSWERED, "low", "within", "high"] : [ANSWERED];
    default:
      return [ANSWERED];
  }
}
