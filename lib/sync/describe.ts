/**
 * Plain words for a recorded change, for the outbox and "needs attention" lists. Pure.
 */
import { STATUS_LABELS, type TicketStatus } from "../tickets/status";
import { describeEntry, formatTurnCount, SCREW_SHORT, type Screw } from "../trade/tune";
import type { MutationName } from "./protocol";

const GRADES: Record<string, string> = { cause: "cause", due_soon: "due soon", advisory: "advisory" };

export function describeChange(name: MutationName, args: Record<string, unknown>): string {
  switch (name) {
    case "bench.entry.recorded":
      return `Bench result: ${String(args.stepId)}`;
    case "bench.entry.voided":
      return args.reason ? `Voided a bench result (${String(args.reason)})` : "Voided a bench result";
    case "finding.added":
      return `Finding: ${String(args.title)} (${GRADES[String(args.grade)] ?? String(args.grade)})`;
    case "finding.changed":
      return args.withdrawn ? "Withdrew a finding" : "Changed a finding";
    case "tune.recorded": {
      const screw = args.screw as Screw;
      if (args.kind === "baseline") {
        return args.baselineKind === "seated-then-out"
          ? `Tune: ${SCREW_SHORT[screw]} screw seated, then ${formatTurnCount(Number(args.eighths))} out`
          : `Tune: ${SCREW_SHORT[screw]} screw as found`;
      }
      return `Tune: ${describeEntry({ screw, direction: args.direction as "cw" | "ccw", eighths: Number(args.eighths) }).summary}`;
    }
    case "photo.attached":
      return args.caption ? `Photo: ${String(args.caption)}` : "Photo";
    case "labor.started":
      return "Started the labor timer";
    case "labor.stopped":
      return "Stopped the labor timer";
    case "ticket.status_changed":
      return `Status: ${STATUS_LABELS[args.status as TicketStatus] ?? String(args.status)}`;
    case "ticket.note_added": {
      const text = String(args.text);
      return `Note: “${text.length > 60 ? `${text.slice(0, 59)}…` : text}”`;
    }
    case "parts.used":
      return `Part used: ${String(args.qty)} × ${String(args.description)}`;
    default:
      return String(name);
  }
}

/** "just now", "5 min ago", "3 h ago", or the date. */
export function timeAgo(iso: string | null, now = Date.now()): string {
  if (!iso) return "never";
  const s = Math.max(0, Math.round((now - Date.parse(iso)) / 1000));
  if (s < 45) return "just now";
  const m = Math.round(s / 60);
  if (m < 60) return `${m} min ago`;
  const h = Math.round(m / 60);
  if (h < 24) return `${h} h ago`;
  return new Date(iso).toLocaleDateString();
}
