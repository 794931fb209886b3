import "server-only";
import type { Db } from "@/db/client";
import { stmt } from "./store";

export interface ProcedureInput {
  id: string;
  machineKind: string;
  name: string;
  version: number;
  /** The procedure definition (validated by lib/procedures before it gets here). */
  definition: unknown;
}

/**
 * Saves a procedure for the bench devices (insert, or replace when the version is newer). The trigger
 * logs it, so every device receives it on its next pull. Returns whether anything changed.
 */
export function saveProcedure(db: Db, p: ProcedureInput): boolean {
  const current = stmt(db, "SELECT version FROM procedures WHERE id = ?").get(p.id) as { version: number } | undefined;
  if (current && current.version >= p.version) return false;
  stmt(
    db,
    `INSERT INTO procedures (id, machine_kind, name, version, definition, updated_at) VALUES (?, ?, ?, ?, ?, ?)
     ON CONFLICT (id) DO UPDATE SET machine_kind = excluded.machine_kind, name = excluded.name, version = excluded.version,
       definition = excluded.definition, updated_at = excluded.updated_at`,
  ).run(p.id, p.machineKind, p.name, p.version, JSON.stringify(p.definition), Date.now());
  return true;
}
