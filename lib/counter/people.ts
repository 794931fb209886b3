import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { users } from "@/db/schema";

/** Active bench technicians, by name: the choices for "assign a tech". */
export function listTechs(db: Pick<Db, "select">): Array<{ id: string; name: string }> {
  return db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(eq(users.role, "tech"), eq(users.active, true)))
    .orderBy(asc(users.name))
    .all();
}

export function isActiveTech(db: Pick<Db, "select">, id: string): boolean {
  return Boolean(
    db.select({ id: users.id }).from(users).where(and(eq(users.id, id), eq(users.role, "tech"), eq(users.active, true))).get(),
  );
}
