import { eq } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "../../db/client";
import { users } from "../../db/schema";
import type { Role } from "./roles";
import { burnPasswordCheck, verifyPassword } from "./password";
import { accountKey, addressKey, clearAccountFailures, lockedForMs, minutesLabel, recordFailure } from "./rate-limit";

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email("Enter the e-mail address you sign in with."),
  password: z.string().min(1, "Enter your password.").max(200, "That password is too long."),
});

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  sessionVersion: number;
}

export type AuthResult =
  | { ok: true; user: SignedInUser }
  | { ok: false; reason: "invalid" | "inactive" | "rate_limited"; message: string; retryAfterMs?: number };

export const INVALID_MESSAGE = "That e-mail and password do not match an account.";
export const INACTIVE_MESSAGE = "This account has been switched off. Ask the shop owner to turn it back on.";
export const rateLimitedMessage = (ms: number) => `Too many attempts. Try again in ${minutesLabel(ms)}.`;

/** Checks a sign-in; counts failures per account and per address. */
export async function authenticate(db: Db, input: { email: string; password: string }, address: string): Promise<AuthResult> {
  const { email, password } = input;
  const locked = lockedForMs(db, [accountKey(email), addressKey(address)]);
  if (locked > 0) return { ok: false, reason: "rate_limited", message: rateLimitedMessage(locked), retryAfterMs: locked };

  const user = db.select().from(users).where(eq(users.email, email)).get();
  const passwordOk = user ? await verifyPassword(password, user.passwordHash) : (await burnPasswordCheck(password), false);
  if (!user || !passwordOk) {
    recordFailure(db, email, address);
    const nowLocked = lockedForMs(db, [accountKey(email), addressKey(address)]);
    if (nowLocked > 0) return { ok: false, reason: "rate_limited", message: rateLimitedMessage(nowLocked), retryAfterMs: nowLocked };
    return { ok: false, reason: "invalid", message: INVALID_MESSAGE };
  }
  if (!user.active) return { ok: false, reason: "inactive", message: INACTIVE_MESSAGE };
  clearAccountFailures(db, email);
  return {
    ok: true,
    user: { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion },
  };
}

/** The current state of a user for an existing session: null when the session must end. */
export function sessionUser(db: Db, id: string, sessionVersion: number): SignedInUser | null {
  const user = db.select().from(users).where(eq(users.id, id)).get();
  if (!user || !user.active || user.sessionVersion !== sessionVersion) return null;
  return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
}
