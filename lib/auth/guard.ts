import "server-only";
import { forbidden, redirect } from "next/navigation";
import { AppError } from "@/lib/http/errors";
import { auth } from "./auth";
import type { Role } from "./roles";

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

/** The signed-in, active user, or null. The session callback has already checked the account is still active. */
export async function getCurrentUser(): Promise<CurrentUser | null> {
  const session = await auth();
  const u = session?.user;
  if (!u?.id || !u.role) return null;
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}

/**
 * The one access guard. Every route handler and server action calls it.
 * No roles given: any signed-in user. Throws AppError("unauthorized" | "forbidden").
 */
export async function requireUser(...roles: Role[]): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) throw new AppError("unauthorized", "Sign in to continue.");
  if (roles.length && !roles.includes(user.role)) {
    throw new AppError("forbidden", "Your role does not allow this.");
  }
  return user;
}

/** The same guard for pages: not signed in goes to sign-in; the wrong role sees the not-allowed page. */
export async function requirePageUser(returnTo: string, ...roles: Role[]): Promise<CurrentUser> {
  try {
    return await requireUser(...roles);
  } catch (err) {
    if (err instanceof AppError && err.code === "unauthorized") {
      redirect(`/sign-in?next=${encodeURIComponent(returnTo)}`);
    }
    if (err instanceof AppError && err.code === "forbidden") forbidden();
    throw err;
  }
}
