"use server";

import { AuthError } from "next-auth";
import { headers } from "next/headers";
import { getDb } from "@/db/client";
import { signIn, signOut, clientAddress } from "@/lib/auth/auth";
import { INACTIVE_MESSAGE, INVALID_MESSAGE, rateLimitedMessage, signInSchema } from "@/lib/auth/authenticate";
import { accountKey, addressKey, lockedForMs } from "@/lib/auth/rate-limit";
import { zodFields } from "@/lib/http/errors";

export interface SignInState {
  message?: string;
  fields?: Record<string, string>;
  email?: string;
}

/** Only same-site paths may be returned to after sign-in. */
function safeNext(value: FormDataEntryValue | null): string {
  const next = typeof value === "string" ? value : "";
  return next.startsWith("/") && !next.startsWith("//") && !next.startsWith("/sign-in") ? next : "/";
}

export async function signInAction(_prev: SignInState, formData: FormData): Promise<SignInState> {
  const email = String(formData.get("email") ?? "");
  const parsed = signInSchema.safeParse({ email, password: formData.get("password") ?? "" });
  if (!parsed.success) return { fields: zodFields(parsed.error), email };
  try {
    await signIn("credentials", { ...parsed.data, redirectTo: safeNext(formData.get("next")) });
    return {};
  } catch (err) {
    if (err instanceof AuthError) {
      const code = (err as AuthError & { code?: string }).code;
      if (code === "rate_limited") {
        const address = clientAddress(await headers());
        const ms = lockedForMs(getDb(), [accountKey(parsed.data.email), addressKey(address)]);
        return { message: rateLimitedMessage(ms), email };
      }
      if (code === "inactive") return { message: INACTIVE_MESSAGE, email };
      return { message: INVALID_MESSAGE, email };
    }
    throw err; // the success redirect
  }
}

export async function signOutAction(): Promise<void> {
  await signOut({ redirectTo: "/sign-in" });
}
