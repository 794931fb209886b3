/**
 * A ticket's life in the shop. The names are Benchwright's own words.
 * Order matters: it is the order of the queue board's columns.
 */
export const TICKET_STATUSES = [
  "taken_in",
  "on_bench",
  "awaiting_ok",
  "awaiting_parts",
  "in_repair",
  "ready",
  "handed_back",
  "returned_unrepaired",
] as const;
export type TicketStatus = (typeof TICKET_STATUSES)[number];

export const STATUS_LABELS: Record<TicketStatus, string> = {
  taken_in: "Taken in",
  on_bench: "On the bench",
  awaiting_ok: "Waiting for customer's OK",
  awaiting_parts: "Waiting for parts",
  in_repair: "In repair",
  ready: "Ready for pickup",
  handed_back: "Handed back",
  returned_unrepaired: "Returned unrepaired",
};

/** Statuses after which the machine has left the shop. */
export const CLOSED_STATUSES: readonly TicketStatus[] = ["handed_back", "returned_unrepaired"];
export const OPEN_STATUSES: readonly TicketStatus[] = TICKET_STATUSES.filter((s) => !CLOSED_STATUSES.includes(s));

export function isOpenStatus(status: TicketStatus): boolean {
  return !CLOSED_STATUSES.includes(status);
}
