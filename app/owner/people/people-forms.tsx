"use client";

import { useActionState } from "react";
import type { FormState } from "@/lib/http/action";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Button } from "@/components/ui/button";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { addPersonAction, changeRoleAction, resetPasswordAction, setActiveAction } from "./actions";

const v = (state: FormState, key: string) => {
  const value = state.values?.[key];
  return typeof value === "string" ? value : undefined;
};

function Result({ state }: { state: FormState }) {
  if (!state.message) return null;
  return <Notice tone={state.ok ? "ok" : "bad"}>{state.message}</Notice>;
}

export function AddPersonForm() {
  const [state, action, pending] = useActionState<FormState, FormData>(addPersonAction, {});
  return (
    <form action={action} className="grid gap-4 md:grid-cols-2" noValidate>
      <div className="md:col-span-2">
        <Result state={state} />
      </div>
      <Field label="Name" name="name" defaultValue={v(state, "name")} error={state.fields?.name} autoComplete="off" />
      <Field label="E-mail" name="email" type="email" defaultValue={v(state, "email")} error={state.fields?.email} autoComplete="off" />
      <div className="flex flex-col gap-1">
        <label htmlFor="f-role" className="font-semibold">Role</label>
        <select id="f-role" name="role" defaultValue={v(state, "role") ?? "tech"} className="tap rounded-xl border-2 border-line bg-surface px-3 text-lg">
          {ROLES.map((r) => (
            <option key={r} value={r}>{ROLE_LABELS[r]}</option>
          ))}
        </select>
        {state.fields?.role ? <p className="text-sm font-semibold text-bad">{state.fields.role}</p> : null}
      </div>
      <Field
        label="First password"
        name="password"
        type="text"
        autoComplete="new-password"
        hint="At least 10 characters. Hand it over in person."
        defaultValue={v(state, "password")}
        error={state.fields?.password}
      />
      <div className="md:col-span-2">
        <Button type="submit" disabled={pending}>{pending ? "Adding…" : "Add person"}</Button>
      </div>
    </form>
  );
}

export function PersonControls({ id, name, role, active, isSelf }: { id: string; name: string; role: Role; active: boolean; isSelf: boolean }) {
  const [roleState, roleAction] = useActionState<FormState, FormData>(changeRoleAction, {});
  const [activeState, activeAction] = useActionState<FormState, FormData>(setActiveAction, {});
  const [pwState, pwAction] = useActionState<FormState, FormData>(resetPasswordAction, {});
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <form action={roleAction} className="flex items-end gap-2">
          <input type="hidden" name="id" value={id} />
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Role
            <select name="role" defaultValue={role} aria-label={`Role of ${name}`} className="tap rounded-xl border-2 border-line bg-surface px-3 text-base">
              {ROLES.map((r) => (
                <option key={r} value={r}>{ROLE_LABELS[r]}</option>
              ))}
            </select>
          </label>
          <Button type="submit" variant="secondary">Change</Button>
        </form>
        {isSelf ? null : (
          <form action={activeAction}>
            <input type="hidden" name="id" value={id} />
            <input type="hidden" name="active" value={active ? "no" : "yes"} />
            <Button type="submit" variant="secondary" className={active ? "text-bad" : ""}>
              {active ? `Switch off ${name.split(" ")[0]}` : `Switch on ${name.split(" ")[0]}`}
            </Button>
          </form>
        )}
        <form action={pwAction} className="flex items-end gap-2">
          <input type="hidden" name="id" value={id} />
          <label className="flex flex-col gap-1 text-sm font-semibold">
            New password
            <input
              name="password"
              type="text"
              autoComplete="new-password"
              defaultValue={v(pwState, "password")}
              aria-invalid={pwState.fields?.password ? true : undefined}
              className="tap w-44 rounded-xl border-2 border-line bg-surface px-3 text-base"
            />
          </label>
          <Button type="submit" variant="secondary">Set</Button>
        </form>
      </div>
      {[roleState, activeState, pwState].map((s, i) =>
        s.message ? (
          <Notice key={i} tone={s.ok ? "ok" : "bad"}>
            {s.fields?.password ? `${s.message} ${s.fields.password}` : s.message}
          </Notice>
        ) : null,
      )}
    </div>
  );
}
