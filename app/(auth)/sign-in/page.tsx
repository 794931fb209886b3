import type { Metadata } from "next";
import { Wrench } from "lucide-react";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

const ERRORS: Record<string, string> = {
  CredentialsSignin: "That e-mail and password do not match an account.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const params = await searchParams;
  const next = params.next ?? params.callbackUrl ?? "/";
  const code = params.code;
  const initialError =
    code === "rate_limited"
      ? "Too many attempts. Try again in a few minutes."
      : code === "inactive"
        ? "This account has been switched off. Ask the shop owner to turn it back on."
        : params.error
          ? (ERRORS[params.error] ?? "Sign-in failed. Try again.")
          : undefined;
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center px-5 py-10">
      <div className="mb-8 flex items-center gap-3">
        <span className="grid size-14 place-items-center rounded-2xl bg-accent text-accent-ink" aria-hidden>
          <Wrench size={30} strokeWidth={2.4} />
        </span>
        <div>
          <p className="text-3xl font-bold tracking-tight">Benchwright</p>
          <p className="text-muted">Bench, counter and shop, in one place</p>
        </div>
      </div>
      <h1 className="mb-4 text-2xl font-bold">Sign in</h1>
      <SignInForm next={next} initialError={initialError} />
    </main>
  );
}
