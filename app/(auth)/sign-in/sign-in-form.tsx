"use client";

import { useActionState, useState } from "react";
import { signInAction, type SignInState } from "@/lib/auth/actions";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Button } from "@/components/ui/button";

export function SignInForm({ next, initialError }: { next: string; initialError?: string }) {
  const [state, formAction, pending] = useActionState<SignInState, FormData>(signInAction, {
    message: initialError,
  });
  // Kept in state so a failed attempt never clears what was typed.
  const [email, setEmail] = useState("");
  return (
    <form action={formAction} className="flex flex-col gap-5" noValidate>
      {state.message ? <Notice tone="bad" title="Not signed in">{state.message}</Notice> : null}
      <input type="hidden" name="next" value={next} />
      <Field
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        inputMode="email"
        required
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={state.fields?.email}
      />
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        required
        error={state.fields?.password}
      />
      <Button type="submit" size="bench" disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
