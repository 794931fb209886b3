import { AsyncLocalStorage } from "node:async_hooks";

/**
 * Stand-in for next-auth's `auth()` in tests: the session of whoever the current request runs as.
 * `withUser(user, fn)` scopes a session to one async call (safe when requests interleave, as in the
 * sync simulation); `signInAs(user)` sets the default for everything else.
 */
export interface TestUser {
  id: string;
  email: string;
  name: string;
  role: "owner" | "counter" | "tech";
}
type Session = { user: TestUser } | null;

const scoped = new AsyncLocalStorage<Session>();
let fallback: Session = null;

export function signInAs(user: TestUser | null): void {
  fallback = user ? { user } : null;
}

export function withUser<T>(user: TestUser | null, fn: () => T): T {
  return scoped.run(user ? { user } : null, fn);
}

export async function auth(): Promise<Session> {
  const s = scoped.getStore();
  return s === undefined ? fallback : s;
}
