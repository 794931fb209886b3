import type { Db } from "../../db/client";
import { auditLog } from "../../db/schema";

/** Any Drizzle handle that can insert: the database itself or a transaction. */
type Writer = Pick<Db, "insert">;

export function audit(
  db: Writer,
  entry: { actorId: string | null; action: string; entity: string; entityId: string; details?: Record<string, unknown> },
): void {
  db.insert(auditLog)
    .values({ ...entry, details: entry.details ?? {} })
    .run();
}
