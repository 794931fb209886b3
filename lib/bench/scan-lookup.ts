/**
 * What the scan screen says after a code was read and it is not on this phone: the server's answer to
 * `GET /api/tags/<code>` (lib/counter/tags `resolveTag`) put in words, with the one next step it allows.
 * Pure TypeScript, no framework.
 */
import { CLOSED_STATUSES, STATUS_LABELS, type TicketStatus } from "../tickets/status";
import { formatTagCode } from "../trade/tag-code";

/** The answer shape of GET /api/tags/<code> (kept in step with lib/counter/tags `TagResolution`). */
export type TagAnswer =
  | { kind: "ticket"; ticketId: string; number: number; status: TicketStatus }
  | { kind: "replaced"; ticketId: string; number: number; status: TicketStatus; currentCode: string }
  | { kind: "sticker"; machineId: string; openTicketId?: string };

export type OnlineOutcome =
  /** The server has an open ticket for this code: syncing should bring it to the phone. */
  | { kind: "sync-and-open"; ticketId: string; title: string; text: string }
  /** Nothing to open: closed ticket, old tag of a closed ticket, a sticker with no open ticket, unknown code. */
  | { kind: "nothing-open"; title: string; text: string }
  /** The session has ended: sign in again, then look again. */
  | { kind: "sign-in"; title: string; text: string }
  /** No answer (no network, server trouble): try again or ask the counter. */
  | { kind: "failed"; title: string; text: string };

export const NO_NETWORK_TEXT = "No network: sync when you are back online, or ask the counter.";

const closed = (s: TicketStatus) => CLOSED_STATUSES.includes(s);
const statusWords = (s: TicketStatus) => STATUS_LABELS[s].toLowerCase();

/** The server's answer (HTTP status and parsed body, or null when the request itself failed) in words. */
export function explainTagAnswer(code: string, res: { status: number; body: unknown } | null): OnlineOutcome {
  const tag = formatTagCode(code);
  if (res === null) return { kind: "failed", title: "Could not reach the shop's server", text: NO_NETWORK_TEXT };
  if (res.status === 401) {
    return { kind: "sign-in", title: "Sign in again to look it up", text: "Your sign-in on this phone has expired. Your work stays on this phone." };
  }
  if (res.status === 404) {
    return {
      kind: "nothing-open",
      title: `The shop does not know tag ${tag}`,
      text: "No ticket or machine carries this code. Check the code on the tag, or ask the counter.",
    };
  }
  if (res.status !== 200) {
    const message = (res.body as { error?: { message?: unknown } } | null)?.error?.message;
    return {
      kind: "failed",
      title: "The server could not look it up",
      text: `${typeof message === "string" ? `${message} ` : ""}Try again in a moment, or ask the counter.`,
    };
  }
  const a = res.body as TagAnswer;
  switch (a.kind) {
    case "ticket":
      return closed(a.status)
        ? {
            kind: "nothing-open",
            title: `Ticket #${a.number} is closed`,
            text: `Tag ${tag} belongs to ticket #${a.number}, which is ${statusWords(a.status)}. If the machine is back, the counter takes it in on a new ticket.`,
          }
        : {
            kind: "sync-and-open",
            ticketId: a.ticketId,
            title: `Ticket #${a.number} is at the shop`,
            text: `It is ${statusWords(a.status)}, but not on this phone yet. Sync to bring it here.`,
          };
    case "replaced":
      return closed(a.status)
        ? {
            kind: "nothing-open",
            title: `Tag ${tag} is an old tag`,
            text: `It was replaced by tag ${formatTagCode(a.currentCode)} on ticket #${a.number}, which is now ${statusWords(a.status)}.`,
          }
        : {
            kind: "sync-and-open",
            ticketId: a.ticketId,
            title: `Tag ${tag} was replaced`,
            text: `Ticket #${a.number} now carries tag ${formatTagCode(a.currentCode)}. Use the new tag from now on.`,
          };
    case "sticker":
      return a.openTicketId
        ? {
            kind: "sync-and-open",
            ticketId: a.openTicketId,
            title: "This is a machine's sticker",
            text: "The machine has an open ticket at the shop that is not on this phone yet. Sync to bring it here.",
          }
        : {
            kind: "nothing-open",
            title: "This machine has no open ticket",
            text: `${tag} is the machine's permanent sticker. Ask the counter to take the machine in on a new ticket.`,
          };
    default:
      return { kind: "failed", title: "The server's answer was not understood", text: "Reload the app to update it, or ask the counter." };
  }
}
