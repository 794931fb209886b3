import { eq } from "drizzle-orm";
import type { Db } from "./client";
import { procedures } from "./schema";
import { BUILT_IN_PROCEDURES } from "../lib/procedures";

export interface ProcedureInput {
  id: string;
  machineKind: string;
  name: string;
  version: number;
  /** The procedure definition (validated by lib/procedures before it gets here). */
  definition: unknown;
}

/**
 * Saves a procedure for the bench devices (insert, or replace when the version is newer). The sync trigger
 * logs it, so every device receives it on its next pull. Returns whether anything changed.
 */
export function saveProcedure(db: Pick<Db, "select" | "insert">, p: ProcedureInput): boolean {
  const current = db.select({ version: procedures.version }).from(procedures).where(eq(procedures.id, p.id)).get();
  if (current && current.version >= p.version) return false;
  const row = { machineKind: p.machineKind, name: p.name, version: p.version, definition: p.definition, updatedAt: new Date() };
  db.insert(procedures)
    .values({ id: p.id, ...row })
    .onConflictDoUpdate({ target: procedures.id, set: row })
    .run();
  return true;
}

/** Puts the built-in bench sheets (lib/procedures) in the database, so devices pull them; newer versions win. */
export function ensureBuiltInProcedures(db: Db): number {
  let changed = 0;
  db.transaction((tx) => {
    for (const p of BUILT_IN_PROCEDURES) {
      if (saveProcedure(tx, { id: p.id, machineKind: p.machineKinds.join(","), name: p.title, version: p.version, definition: p })) changed++;
    }
  });
  return changed;
}
