/**
 * The counter's view of a ticket's synced bench sheet, built from the rows the bench sent (pure: no database,
 * no framework). Entries: the latest per step in bench order, with the earlier and voided ones as history.
 */
import type { BenchEntryRow, FindingRow, LaborEntryRow, PartUsedRow, PhotoRow, TicketNoteRow, TuneEntryRow } from "../sync/protocol";
import type { Procedure } from "../procedures/model";
import { describeStepValue, stepById } from "../procedures/describe";
import { laborTotal } from "../bench/sheet";
import { applyTuneLog, describePosition, SCREW_LABELS, SCREWS, type Baseline, type Screw, type TuneEntry } from "../trade/tune";

export interface SheetRows {
  bench_entry: BenchEntryRow[];
  finding: FindingRow[];
  tune_entry: TuneEntryRow[];
  photo: PhotoRow[];
  labor_entry: LaborEntryRow[];
  ticket_note: TicketNoteRow[];
  part_used: PartUsedRow[];
}

export interface EntryLine {
  stepId: string;
  section: string;
  title: string;
  answer: string;
  at: string;
  by: string;
  note: string | null;
  /** Earlier answers for the same step, newest first, voided ones marked. */
  history: Array<{ answer: string; at: string; by: string; voided: boolean; voidReason: string | null }>;
}

export const GRADE_LABELS = { cause: "Why it came in", due_soon: "Will fail soon", advisory: "Advisory" } as const;
export const GRADE_ORDER = ["cause", "due_soon", "advisory"] as const;

export interface BenchSheetView {
  procedureTitle: string | null;
  entries: EntryLine[];
  findings: Array<FindingRow & { byName: string; photos: PhotoRow[] }>;
  tune: Array<{ screw: Screw; label: string; position: string }>;
  tuneProblem: string | null;
  laborMinutes: number;
  laborRunning: boolean;
  photos: PhotoRow[];
  notes: Array<TicketNoteRow & { byName: string }>;
  parts: PartUsedRow[];
  isEmpty: boolean;
}

/** The step id that marks a ticket's intake photos (taken at the counter). */
export const INTAKE_PHOTO_STEP = "intake";

const cap = (s: string) => (s ? s[0]!.toUpperCase() + s.slice(1) : s);
const byTime = <T extends { at: string }>(a: T, b: T) => a.at.localeCompare(b.at);

/** Whole minutes worked: each interval summed; an open one counts up to `now` (lib/bench/sheet). */
export function laborMinutes(rows: LaborEntryRow[], now: Date): { minutes: number; running: boolean } {
  const t = laborTotal(rows, null, now);
  return { minutes: t.minutes, running: t.running !== null };
}

export function buildBenchSheetView(
  rows: SheetRows,
  procedures: ReadonlyMap<string, Procedure>,
  names: ReadonlyMap<string, string>,
  now: Date = new Date(),
): BenchSheetView {
  const who = (id: string) => names.get(id) ?? "someone";
  const entries = [...rows.bench_entry].sort(byTime);
  const procedure = entries.length ? procedures.get(entries[entries.length - 1]!.procedureId) : undefined;

  // Step order and section titles from the procedure; steps it does not know go last, in time order.
  const order = new Map<string, { index: number; section: string }>();
  if (procedure) {
    let i = 0;
    for (const section of procedure.sections) for (const step of section.steps) order.set(step.id, { index: i++, section: section.title });
  }
  const byStep = new Map<string, BenchEntryRow[]>();
  for (const e of entries) byStep.set(e.stepId, [...(byStep.get(e.stepId) ?? []), e]);
  const lines: EntryLine[] = [];
  for (const [stepId, list] of byStep) {
    const live = list.filter((e) => !e.voidedAt);
    const latest = live[live.length - 1];
    if (!latest) continue; // every answer voided: nothing stands for this step
    const step = stepById(procedures.get(latest.procedureId), stepId);
    lines.push({
      stepId,
      section: order.get(stepId)?.section ?? "Other",
      title: step?.title ?? stepId,
      answer: describeStepValue(step, latest.value),
      at: latest.at,
      by: who(latest.recordedBy),
      note: latest.note,
      history: list
        .filter((e) => e !== latest)
        .reverse()
        .map((e) => ({ answer: describeStepValue(step, e.value), at: e.at, by: who(e.recordedBy), voided: Boolean(e.voidedAt), voidReason: e.voidReason })),
    });
  }
  lines.sort((a, b) => (order.get(a.stepId)?.index ?? Infinity) - (order.get(b.stepId)?.index ?? Infinity) || a.at.localeCompare(b.at));

  // Tune log: baselines first, then turns, replayed with lib/trade/tune.
  const baselines: Partial<Record<Screw, Baseline>> = {};
  const turns: TuneEntry[] = [];
  for (const t of [...rows.tune_entry].sort(byTime)) {
    if (t.kind === "baseline") baselines[t.screw] = t.baselineKind === "seated-then-out" ? { kind: "seated-then-out", eighths: t.eighths } : { kind: "as-found" };
    else if (t.direction) turns.push({ screw: t.screw, direction: t.direction, eighths: t.eighths });
  }
  const touched = new Set<Screw>([...(Object.keys(baselines) as Screw[]), ...turns.map((t) => t.screw)]);
  const log = applyTuneLog(baselines, turns);
  const tuneState = log.ok ? log.value : log.state;
  const tune = tuneState
    ? SCREWS.filter((s) => touched.has(s)).map((s) => ({ screw: s, label: cap(SCREW_LABELS[s]), position: describePosition(tuneState[s]) }))
    : [];

  // Intake photos are the counter's, shown with the intake; the bench sheet shows the bench's own.
  const allPhotos = [...rows.photo].sort(byTime);
  const photos = allPhotos.filter((p) => p.stepId !== INTAKE_PHOTO_STEP);
  const labor = laborMinutes(rows.labor_entry, now);
  const findings = rows.finding
    .filter((f) => !f.withdrawn)
    .sort((a, b) => GRADE_ORDER.indexOf(a.grade) - GRADE_ORDER.indexOf(b.grade) || a.at.localeCompare(b.at))
    .map((f) => ({
      ...f,
      byName: who(f.createdBy),
      photos: allPhotos.filter((p) => p.findingId === f.id || f.photoIds.includes(p.id) || f.photoIds.includes(p.sha256)),
    }));
  return {
    procedureTitle: procedure?.title ?? null,
    entries: lines,
    findings,
    tune,
    tuneProblem: log.ok ? null : log.message,
    laborMinutes: labor.minutes,
    laborRunning: labor.running,
    photos,
    notes: [...rows.ticket_note].sort(byTime).map((n) => ({ ...n, byName: who(n.authorId) })),
    parts: [...rows.part_used].sort(byTime),
    isEmpty:
      lines.length + findings.length + rows.tune_entry.length + photos.length + rows.labor_entry.length + rows.ticket_note.length + rows.part_used.length ===
      0,
  };
}
