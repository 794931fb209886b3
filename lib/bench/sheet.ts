/**
 * The bench sheet of one ticket on the phone, from the rows the device store holds (pure: no framework, no
 * database): which procedure it follows, the results that count per step, the tune log replayed, the labor
 * total, and the progress through the sheet.
 *
 * Results come from three kinds of facts: bench entries (the newest entry per step that is not voided), tune
 * entries (a tune step's result is the whole log), and photos taken at a step (a photo step's result).
 */
import type { BenchEntryRow, LaborEntryRow, PhotoRow, ProcedureRow, TuneEntryRow } from "../sync/protocol";
import { procedureSchema, type Procedure } from "../procedures/model";
import { procedureFor, BUILT_IN_PROCEDURES } from "../procedures";
import { openSteps, sheetView } from "../procedures/conditions";
import { stepValueSchema, type Results, type StepValue } from "../procedures/values";
import { suggest, type Suggestion } from "../procedures/guide";
import { applyTuneEntry, startTune, SCREWS, type Baseline, type Screw, type TuneState } from "../trade/tune";
import type { EngineType, MachineKind } from "../tickets/machine";

const byTime = <T extends { at: string; id: string }>(a: T, b: T) => (a.at < b.at ? -1 : a.at > b.at ? 1 : a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

const parsed = new Map<string, Procedure | null>();

/**
 * The procedures this phone holds (pulled from the shop), parsed; a definition that does not parse is left out.
 * A procedure id and version never change meaning, so each is parsed once (the sheet re-reads on every tap).
 */
export function parseProcedures(rows: readonly ProcedureRow[]): Procedure[] {
  const out: Procedure[] = [];
  for (const r of rows) {
    const key = `${r.id}@${r.version}`;
    if (!parsed.has(key)) {
      const p = procedureSchema.safeParse(r.definition);
      parsed.set(key, p.success && p.data.id === r.id && p.data.version === r.version ? p.data : null);
    }
    const p = parsed.get(key);
    if (p) out.push(p);
  }
  return out;
}

/**
 * The procedure a ticket's sheet follows: the one its entries were recorded against (at the newest version this
 * phone holds), else the shop's procedure for the machine, else the built-in one. Undefined when none fits.
 */
export function sheetProcedure(
  machine: { kind: MachineKind; engineType: EngineType } | null,
  entries: readonly BenchEntryRow[],
  held: readonly Procedure[],
): Procedure | undefined {
  const pool = held.length ? held : BUILT_IN_PROCEDURES;
  const used = [...entries].sort(byTime).at(-1)?.procedureId;
  if (used) {
    const versions = [...pool, ...BUILT_IN_PROCEDURES].filter((p) => p.id === used);
    if (versions.length) return versions.reduce((a, b) => (b.version > a.version ? b : a));
  }
  if (!machine) return undefined;
  return procedureFor(machine.kind, machine.engineType, pool) ?? procedureFor(machine.kind, machine.engineType);
}

export interface TuneLog {
  state: TuneState;
  /** Screws with a baseline recorded (the buttons for a screw appear once its baseline is in). */
  baselined: Set<Screw>;
  /** The turns in order, for the log list. */
  turns: TuneEntryRow[];
  /** The first entry the math refuses (a log merged from two phones can break), or null. */
  problem: string | null;
}

/** Replays a ticket's tune entries in time order: a baseline (re)sets its screw, a turn moves it. */
export function tuneLog(rows: readonly TuneEntryRow[]): TuneLog {
  const start = startTune();
  if (!start.ok) throw new Error(start.message);
  let state = start.value;
  const baselined = new Set<Screw>();
  const turns: TuneEntryRow[] = [];
  let problem: string | null = null;
  for (const e of [...rows].sort(byTime)) {
    if (e.kind === "baseline") {
      const baseline: Baseline = e.baselineKind === "seated-then-out" ? { kind: "seated-then-out", eighths: e.eighths } : { kind: "as-found" };
      const b = startTune({ [e.screw]: baseline });
      if (!b.ok) {
        problem ??= b.message;
        continue;
      }
      state = { ...state, [e.screw]: b.value[e.screw] };
      baselined.add(e.screw);
    } else if (e.direction) {
      const r = applyTuneEntry(state, { screw: e.screw, direction: e.direction, eighths: e.eighths });
      if (!r.ok) {
        problem ??= r.message;
        continue;
      }
      state = r.value;
      turns.push(e);
    }
  }
  return { state, baselined, turns, problem };
}

/** The tune log as a tune step's result (baselines and turns), or undefined when nothing is recorded. */
function tuneResult(rows: readonly TuneEntryRow[]): StepValue | undefined {
  if (rows.length === 0) return undefined;
  const baselines: Partial<Record<Screw, Baseline>> = {};
  const entries: Array<{ screw: Screw; direction: "cw" | "ccw"; eighths: number }> = [];
  for (const e of [...rows].sort(byTime)) {
    if (e.kind === "baseline") baselines[e.screw] = e.baselineKind === "seated-then-out" ? { kind: "seated-then-out", eighths: e.eighths } : { kind: "as-found" };
    else if (e.direction) entries.push({ screw: e.screw, direction: e.direction, eighths: e.eighths });
  }
  return { kind: "tune", baselines, entries };
}

export interface SheetRowsOnPhone {
  benchEntries: readonly BenchEntryRow[];
  tuneEntries: readonly TuneEntryRow[];
  photos: readonly PhotoRow[];
}

/** The latest result per step (what the sheet shows and the guide reads). */
export function sheetResults(procedure: Procedure | undefined, rows: SheetRowsOnPhone): Results {
  const results: Record<string, StepValue> = {};
  for (const e of [...rows.benchEntries].sort(byTime)) {
    if (e.voidedAt) continue;
    const v = stepValueSchema.safeParse(e.value);
    if (v.success) results[e.stepId] = v.data;
  }
  if (!procedure) return results;
  for (const section of procedure.sections) {
    for (const step of section.steps) {
      if (step.kind === "tune") {
        const t = tuneResult(rows.tuneEntries);
        if (t) results[step.id] = t;
      } else if (step.kind === "photo") {
        const shas = rows.photos.filter((p) => p.stepId === step.id).map((p) => p.sha256);
        if (shas.length) results[step.id] = { kind: "photo", photoIds: [...new Set(shas)] };
      }
    }
  }
  return results;
}

export interface SheetState {
  procedure: Procedure | undefined;
  results: Results;
  /** Ids of the steps shown, in bench order. */
  visible: Set<string>;
  /** Shown steps still to do (not optional, not answered). */
  open: string[];
  answered: number;
  total: number;
  suggestions: Suggestion[];
}

/** Everything the sheet needs to draw itself. */
export function sheetState(
  procedure: Procedure | undefined,
  rows: SheetRowsOnPhone,
  machineKind?: MachineKind,
): SheetState {
  const results = sheetResults(procedure, rows);
  if (!procedure) return { procedure, results, visible: new Set(), open: [], answered: 0, total: 0, suggestions: [] };
  const ctx = { machineKind };
  const view = sheetView(procedure, results, ctx);
  const open = openSteps(procedure, results, ctx).map((s) => s.id);
  const required = view.visible.filter((s) => !s.optional);
  return {
    procedure,
    results,
    visible: new Set(view.visible.map((s) => s.id)),
    open,
    answered: required.length - open.length,
    total: required.length,
    suggestions: suggest(procedure, results, ctx),
  };
}

export interface LaborTotal {
  /** Whole minutes worked on the ticket (closed intervals and a running one up to `now`). */
  minutes: number;
  seconds: number;
  /** The timer running for this person, if any. */
  running: LaborEntryRow | null;
}

/** Time worked on a ticket from its labor entries (stored as start and end times, so it survives a reload). */
export function laborTotal(rows: readonly LaborEntryRow[], userId: string | null, now: Date | number): LaborTotal {
  const t = typeof now === "number" ? now : now.getTime();
  let ms = 0;
  let running: LaborEntryRow | null = null;
  for (const r of rows) {
    const start = Date.parse(r.startedAt);
    const end = r.endedAt ? Date.parse(r.endedAt) : t;
    if (!r.endedAt && (userId === null || r.userId === userId)) running = r;
    if (Number.isFinite(start) && Number.isFinite(end) && end > start) ms += end - start;
  }
  const seconds = Math.floor(ms / 1000);
  return { minutes: Math.floor(seconds / 60), seconds, running };
}

/** "0:07:05" style clock for a running timer. */
export function formatClock(seconds: number): string {
  const s = Math.max(0, Math.floor(seconds));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const r = s % 60;
  return `${h}:${String(m).padStart(2, "0")}:${String(r).padStart(2, "0")}`;
}

/** The screws a tune step covers, in the order of lib/trade/tune. */
export function tuneScrews(screws: readonly Screw[]): Screw[] {
  return SCREWS.filter((s) => screws.includes(s));
}
