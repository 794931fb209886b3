/**
 * What a mutation does to its row, written once and used by both sides: the device applies it to its
 * store when the tech records (and again on top of newer server rows while the change is waiting), the
 * server applies it when the push arrives. The same function on both sides is why a synced device
 * holds exactly the server's rows. Pure: no framework, no database.
 */
import type {
  BenchEntryRow,
  Entity,
  FindingRow,
  LaborEntryRow,
  MutationArgs,
  MutationName,
  PartUsedRow,
  PhotoRow,
  TicketNoteRow,
  TicketRow,
  TuneEntryRow,
  WireRows,
} from "./protocol";

/** Canonical ISO time (millisecond precision, UTC) so both sides store the same text. */
export const isoTime = (t: string | number | Date): string => new Date(t).toISOString();

const part = (p: { description: string; partNumber?: string; qty: number }) => ({
  description: p.description,
  partNumber: p.partNumber ?? null,
  qty: p.qty,
});

type Creating =
  | "bench.entry.recorded"
  | "finding.added"
  | "tune.recorded"
  | "photo.attached"
  | "labor.started"
  | "ticket.note_added"
  | "parts.used";

/** The new row a creating mutation adds, recorded by `userId`. */
export function createdRow<N extends Creating>(name: N, args: MutationArgs<N>, userId: string): WireRows[Entity] {
  switch (name) {
    case "bench.entry.recorded": {
      const a = args as MutationArgs<"bench.entry.recorded">;
      return {
        id: a.id,
        ticketId: a.ticketId,
        procedureId: a.procedureId,
        procedureVersion: a.procedureVersion,
        stepId: a.stepId,
        value: a.value,
        note: a.note ?? null,
        at: isoTime(a.at),
        recordedBy: userId,
        voidedAt: null,
        voidedBy: null,
        voidReason: null,
      } satisfies BenchEntryRow;
    }
    case "finding.added": {
      const a = args as MutationArgs<"finding.added">;
      return {
        id: a.id,
        ticketId: a.ticketId,
        stepId: a.stepId ?? null,
        grade: a.grade,
        title: a.title,
        note: a.note,
        photoIds: a.photoIds,
        suggestedParts: a.suggestedParts.map(part),
        suggestedLaborMinutes: a.suggestedLaborMinutes ?? null,
        alternatives: a.alternatives ? a.alternatives.map((x) => ({ label: x.label, parts: x.parts.map(part), laborMinutes: x.laborMinutes })) : null,
        withdrawn: false,
        createdBy: userId,
        at: isoTime(a.at),
        changedAt: null,
        changedBy: null,
        revision: 1,
      } satisfies FindingRow;
    }
    case "tune.recorded": {
      const a = args as MutationArgs<"tune.recorded">;
      return {
        id: a.id,
        ticketId: a.ticketId,
        screw: a.screw,
        kind: a.kind,
        direction: a.direction ?? null,
        eighths: a.eighths,
        baselineKind: a.baselineKind ?? null,
        at: isoTime(a.at),
        recordedBy: userId,
      } satisfies TuneEntryRow;
    }
    case "photo.attached": {
      const a = args as MutationArgs<"photo.attached">;
      return {
        id: a.id,
        ticketId: a.ticketId,
        sha256: a.sha256,
        mime: a.mime,
        bytes: a.bytes,
        width: a.width ?? null,
        height: a.height ?? null,
        stepId: a.stepId ?? null,
        findingId: a.findingId ?? null,
        caption: a.caption ?? null,
        at: isoTime(a.at),
        takenBy: userId,
      } satisfies PhotoRow;
    }
    case "labor.started": {
      const a = args as MutationArgs<"labor.started">;
      return { id: a.id, ticketId: a.ticketId, userId, startedAt: isoTime(a.startedAt), endedAt: null } satisfies LaborEntryRow;
    }
    case "ticket.note_added": {
      const a = args as MutationArgs<"ticket.note_added">;
      return { id: a.id, ticketId: a.ticketId, text: a.text, at: isoTime(a.at), authorId: userId } satisfies TicketNoteRow;
    }
    case "parts.used": {
      const a = args as MutationArgs<"parts.used">;
      return {
        id: a.id,
        ticketId: a.ticketId,
        description: a.description,
        partNumber: a.partNumber ?? null,
        qty: a.qty,
        unitPriceCents: a.unitPriceCents ?? null,
        at: isoTime(a.at),
        recordedBy: userId,
      } satisfies PartUsedRow;
    }
    default:
      throw new Error(`not a creating mutation: ${String(name)}`);
  }
}

/** Why a change cannot be made to the row as it stands. */
export type RowRefusal = { code: "conflict" | "invalid"; message: string };

/** The bench entry after a void, or why not. */
export function voidedEntry(row: BenchEntryRow, args: MutationArgs<"bench.entry.voided">, userId: string): BenchEntryRow | RowRefusal {
  if (row.voidedAt) return { code: "conflict", message: "This entry had already been voided." };
  return { ...row, voidedAt: isoTime(args.at), voidedBy: userId, voidReason: args.reason ?? null };
}

/** The finding after a change. */
export function changedFinding(row: FindingRow, args: MutationArgs<"finding.changed">, userId: string): FindingRow {
  const next: FindingRow = { ...row, changedAt: isoTime(args.at), changedBy: userId, revision: row.revision + 1 };
  if (args.grade !== undefined) next.grade = args.grade;
  if (args.title !== undefined) next.title = args.title;
  if (args.note !== undefined) next.note = args.note;
  if (args.photoIds !== undefined) next.photoIds = args.photoIds;
  if (args.suggestedParts !== undefined) next.suggestedParts = args.suggestedParts.map(part);
  if (args.suggestedLaborMinutes !== undefined) next.suggestedLaborMinutes = args.suggestedLaborMinutes;
  if (args.alternatives !== undefined) {
    next.alternatives = args.alternatives.map((x) => ({ label: x.label, parts: x.parts.map(part), laborMinutes: x.laborMinutes }));
  }
  if (args.withdrawn !== undefined) next.withdrawn = args.withdrawn;
  return next;
}

/** The labor entry once stopped, or why not. */
export function stoppedLabor(row: LaborEntryRow, args: MutationArgs<"labor.stopped">): LaborEntryRow | RowRefusal {
  if (row.endedAt) return { code: "conflict", message: "This timer had already been stopped." };
  const endedAt = isoTime(args.endedAt);
  if (Date.parse(endedAt) < Date.parse(row.startedAt)) {
    return { code: "invalid", message: "The timer cannot stop before it started. Check the phone's clock." };
  }
  return { ...row, endedAt };
}

/** The ticket header as the device shows it after its own status change (the server's version + 1). */
export function ticketWithStatus(row: TicketRow, args: MutationArgs<"ticket.status_changed">): TicketRow {
  return { ...row, status: args.status, version: args.baseVersion + 1 };
}

export const isRefusal = (x: unknown): x is RowRefusal =>
  typeof x === "object" && x !== null && "code" in x && "message" in x && !("id" in x);

export type { MutationName };
