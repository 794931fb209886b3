import "server-only";
import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { getDb } from "@/db/client";
import { authenticate, sessionUser, signInSchema } from "./authenticate";
import { authSecret } from "./secret";
import type { Role } from "./roles";

declare module "next-auth" {
  interface Session {
    user: { id: string; email: string; name: string; role: Role };
  }
  interface User {
    role?: Role;
    sessionVersion?: number;
  }
}

/** Failed sign-in with a reason the sign-in form can show ("invalid", "inactive", "rate_limited"). */
class SignInRefused extends CredentialsSignin {
  constructor(code: string) {
    super();
    this.code = code;
  }
}

export function clientAddress(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for");
  return forwarded?.split(",")[0]?.trim() || headers.get("x-real-ip") || "unknown";
}

export const { handlers, auth, signIn, signOut } = NextAuth({
  trustHost: true,
  secret: authSecret(),
  session: { strategy: "jwt", maxAge: 14 * 24 * 60 * 60 },
  pages: { signIn: "/sign-in", error: "/sign-in" },
  logger: {
    // A refused sign-in is an expected answer (counted by the rate limiter), not a server error.
    error(error) {
      if (error.name === "CredentialsSignin" || (error as { type?: string }).type === "CredentialsSignin") return;
      console.error("[auth]", error);
    },
  },
  providers: [
    Credentials({
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(raw, request) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) throw new SignInRefused("invalid");
        const result = await authenticate(getDb(), parsed.data, clientAddress(request.headers));
        if (!result.ok) throw new SignInRefused(result.reason);
        const u = result.user;
        return { id: u.id, email: u.email, name: u.name, role: u.role, sessionVersion: u.sessionVersion };
      },
    }),
  ],
  callbacks: {
    // Runs on every session read: a deactivated user's (or a reset password's) session ends on its next request.
    jwt({ token, user }) {
      if (user?.id) {
        token.sub = user.id;
        token.sv = user.sessionVersion;
      }
      if (!token.sub) return null;
      const current = sessionUser(getDb(), token.sub, Number(token.sv));
      if (!current) return null;
      token.role = current.role;
      token.name = current.name;
      token.email = current.email;
      return token;
    },
    session({ session, token }) {
      session.user = {
        ...session.user,
        id: String(token.sub),
        email: String(token.email),
        name: String(token.name),
        role: token.role as Role,
      };
      return session;
    },
  },
});
