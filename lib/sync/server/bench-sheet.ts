import "server-only";
import type { Db } from "@/db/client";
import { FACT_ENTITIES, type FactEntity, type WireRows } from "../protocol";
import { factsOfTicket } from "./store";

/** Everything the bench has synced for one ticket, oldest first (for the counter's ticket page). */
export function benchSheetFor(db: Db, ticketId: string): { [E in FactEntity]: WireRows[E][] } {
  const out = {} as { [E in FactEntity]: WireRows[E][] };
  for (const e of FACT_ENTITIES) (out as Record<string, unknown>)[e] = factsOfTicket(db, e, ticketId);
  return out;
}
