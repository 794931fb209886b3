/**
 * A ticket's history in plain words, from its audit-log entries. Pure: no framework, no database.
 */
import { STATUS_LABELS, type TicketStatus } from "../tickets/status";
import { formatTagCode } from "../trade/tag-code";

export interface AuditEntry {
  at: Date;
  action: string;
  actorName: string | null;
  details: Record<string, unknown>;
}

const status = (s: unknown) => (typeof s === "string" && s in STATUS_LABELS ? STATUS_LABELS[s as TicketStatus] : String(s));
const code = (c: unknown) => (typeof c === "string" ? formatTagCode(c) : "?");
const text = (t: unknown) => (typeof t === "string" ? t.trim() : "");

/** One line for one entry: what happened, and why when a reason was given. */
export function describeEntry(e: AuditEntry): { what: string; why?: string } {
  const d = e.details;
  switch (e.action) {
    case "ticket.created":
      return { what: `Taken in as #${String(d.number)} with tag ${code(d.tagCode)}${d.comebackOfTicketId ? " (a comeback)" : ""}` };
    case "ticket.status":
      return { what: `${status(d.from)} → ${status(d.to)}`, why: text(d.reason) || undefined };
    case "ticket.assigned":
      return { what: d.to ? `Assigned to ${text(d.toName) || "a technician"}` : "Unassigned" };
    case "ticket.tag_replaced":
      return { what: `Tag replaced: ${code(d.oldCode)} → ${code(d.newCode)}`, why: text(d.reason) || undefined };
    case "ticket.handed_back":
      return {
        what: `${d.outcome === "returned_unrepaired" ? "Returned unrepaired" : "Handed back"} to ${text(d.collectedBy)}`,
        why: text(d.note) || undefined,
      };
    default:
      return { what: e.action.replace(/^ticket\./, "").replace(/_/g, " ") };
  }
}
