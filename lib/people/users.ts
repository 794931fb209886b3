import crypto from "node:crypto";
import { and, asc, eq, ne, sql } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "../../db/client";
import { users } from "../../db/schema";
import { hashPassword, MIN_PASSWORD_LENGTH } from "../auth/password";
import { ROLES, type Role } from "../auth/roles";
import { audit } from "../audit/log";
import { AppError } from "../http/errors";

export const emailSchema = z.string().trim().toLowerCase().email("Enter a valid e-mail address.");
export const passwordSchema = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
  .max(200, "That password is too long.");

export const newUserSchema = z.object({
  name: z.string().trim().min(1, "Enter a name.").max(80, "Keep the name under 80 characters."),
  email: emailSchema,
  role: z.enum(ROLES, { message: "Choose a role." }),
  password: passwordSchema,
});
export type NewUser = z.infer<typeof newUserSchema>;

export function listUsers(db: Db) {
  return db
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active, createdAt: users.createdAt })
    .from(users)
    .orderBy(asc(users.name))
    .all();
}

export async function createUser(db: Db, input: NewUser, actorId: string | null): Promise<string> {
  const data = newUserSchema.parse(input);
  if (db.select({ id: users.id }).from(users).where(eq(users.email, data.email)).get()) {
    throw new AppError("conflict", "Someone already signs in with that e-mail.", { fields: { email: "Already in use." } });
  }
  const id = crypto.randomUUID();
  const passwordHash = await hashPassword(data.password);
  db.transaction((tx) => {
    tx.insert(users).values({ id, name: data.name, email: data.email, role: data.role, passwordHash }).run();
    audit(tx, { actorId, action: "user.created", entity: "user", entityId: id, details: { role: data.role } });
  });
  return id;
}

function activeOwnersOtherThan(db: Db, id: string): number {
  const row = db
    .select({ n: sql<number>`count(*)` })
    .from(users)
    .where(and(eq(users.role, "owner"), eq(users.active, true), ne(users.id, id)))
    .get();
  return row?.n ?? 0;
}

/** Switches an account on or off. Off ends its sessions at once (session version bump). */
export function setUserActive(db: Db, id: string, active: boolean, actorId: string | null): void {
  const user = db.select().from(users).where(eq(users.id, id)).get();
  if (!user) throw new AppError("not_found", "No such person.");
  if (!active && user.role === "owner" && activeOwnersOtherThan(db, id) === 0) {
    throw new AppError("conflict", "The shop needs at least one active owner.");
  }
  db.transaction((tx) => {
    tx.update(users)
      .set({ active, sessionVersion: active ? user.sessionVersion : user.sessionVersion + 1, updatedAt: new Date() })
      .where(eq(users.id, id))
      .run();
    audit(tx, { actorId, action: active ? "user.activated" : "user.deactivated", entity: "user", entityId: id });
  });
}

export function setUserRole(db: Db, id: string, role: Role, actorId: string | null): void {
  const user = db.select().from(users).where(eq(users.id, id)).get();
  if (!user) throw new AppError("not_found", "No such person.");
  if (user.role === "owner" && role !== "owner" && activeOwnersOtherThan(db, id) === 0) {
    throw new AppError("conflict", "The shop needs at least one active owner.");
  }
  db.transaction((tx) => {
    tx.update(users).set({ role, updatedAt: new Date() }).where(eq(users.id, id)).run();
    audit(tx, { actorId, action: "user.role_changed", entity: "user", entityId: id, details: { from: user.role, to: role } });
  });
}

/** Sets a new password and ends the person's existing sessions. */
export async function resetPassword(db: Db, id: string, password: string, actorId: string | null): Promise<void> {
  const passwordHash = await hashPassword(passwordSchema.parse(password));
  const user = db.select().from(users).where(eq(users.id, id)).get();
  if (!user) throw new AppError("not_found", "No such person.");
  db.transaction((tx) => {
    tx.update(users)
      .set({ passwordHash, sessionVersion: user.sessionVersion + 1, updatedAt: new Date() })
      .where(eq(users.id, id))
      .run();
    audit(tx, { actorId, action: "user.password_reset", entity: "user", entityId: id });
  });
}
