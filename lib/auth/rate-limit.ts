import { eq, inArray } from "drizzle-orm";
import type { Db } from "../../db/client";
import { signInAttempts } from "../../db/schema";

/**
 * Failed sign-ins are counted per account and per network address inside a window.
 * Reaching the limit locks that key until the lock runs out; a success clears the account's counter.
 */
export const RATE_LIMITS = {
  account: { maxFailures: 5, windowMs: 15 * 60_000, lockMs: 15 * 60_000 },
  address: { maxFailures: 20, windowMs: 15 * 60_000, lockMs: 15 * 60_000 },
} as const;

export function accountKey(email: string): string {
  return `acct:${email.trim().toLowerCase()}`;
}
export function addressKey(address: string): string {
  return `addr:${address || "unknown"}`;
}

/** Milliseconds until the given keys unlock; 0 when none is locked. */
export function lockedForMs(db: Db, keys: string[], now = Date.now()): number {
  const rows = db.select().from(signInAttempts).where(inArray(signInAttempts.key, keys)).all();
  return rows.reduce((max, r) => Math.max(max, r.lockedUntil - now), 0);
}

export function recordFailure(db: Db, email: string, address: string, now = Date.now()): void {
  const pairs: Array<[string, (typeof RATE_LIMITS)[keyof typeof RATE_LIMITS]]> = [
    [accountKey(email), RATE_LIMITS.account],
    [addressKey(address), RATE_LIMITS.address],
  ];
  db.transaction((tx) => {
    for (const [key, limit] of pairs) {
      const row = tx.select().from(signInAttempts).where(eq(signInAttempts.key, key)).get();
      const fresh = !row || now - row.windowStartedAt > limit.windowMs;
      const failures = fresh ? 1 : row.failures + 1;
      const windowStartedAt = fresh ? now : row.windowStartedAt;
      const lockedUntil = failures >= limit.maxFailures ? now + limit.lockMs : (row?.lockedUntil ?? 0);
      tx.insert(signInAttempts)
        .values({ key, failures, windowStartedAt, lockedUntil })
        .onConflictDoUpdate({ target: signInAttempts.key, set: { failures, windowStartedAt, lockedUntil } })
        .run();
    }
  });
}

export function clearAccountFailures(db: Db, email: string): void {
  db.delete(signInAttempts).where(eq(signInAttempts.key, accountKey(email))).run();
}

export function minutesLabel(ms: number): string {
  const minutes = Math.max(1, Math.ceil(ms / 60_000));
  return minutes === 1 ? "1 minute" : `${minutes} minutes`;
}
