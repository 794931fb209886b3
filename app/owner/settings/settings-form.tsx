"use client";

import { useActionState } from "react";
import type { FormState } from "@/lib/http/action";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Button } from "@/components/ui/button";
import { saveSettingsAction } from "./actions";

function Choice({ name, label, options, value, error }: { name: string; label: string; options: Array<[string, string]>; value: string; error?: string }) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="font-semibold">{label}</legend>
      <div className="flex flex-wrap gap-2">
        {options.map(([v, text]) => (
          <label key={v} className="tap flex items-center gap-2 rounded-xl border-2 border-line bg-surface px-4 has-[:checked]:border-accent has-[:checked]:bg-accent-soft">
            <input type="radio" name={name} value={v} defaultChecked={value === v} className="size-5" />
            {text}
          </label>
        ))}
      </div>
      {error ? <p className="text-sm font-semibold text-bad">{error}</p> : null}
    </fieldset>
  );
}

export function SettingsForm({ initial }: { initial: Record<string, string> }) {
  const [state, action, pending] = useActionState<FormState, FormData>(saveSettingsAction, {});
  const val = (k: string) => {
    const typed = state.values?.[k];
    return typeof typed === "string" ? typed : (initial[k] ?? "");
  };
  const err = (k: string) => state.fields?.[k];
  return (
    <form action={action} className="flex flex-col gap-8" noValidate>
      {state.message ? <Notice tone={state.ok ? "ok" : "bad"}>{state.message}</Notice> : null}
      <section className="grid gap-4 md:grid-cols-2">
        <h2 className="text-xl font-bold md:col-span-2">The shop</h2>
        <Field label="Shop name" name="name" defaultValue={val("name")} error={err("name")} />
        <Field label="Phone" name="phone" type="tel" defaultValue={val("phone")} error={err("phone")} />
        <Field label="E-mail" name="email" type="email" defaultValue={val("email")} error={err("email")} />
        <Field label="Address" name="address" defaultValue={val("address")} error={err("address")} />
        <Field label="Time zone" name="timezone" defaultValue={val("timezone")} error={err("timezone")} hint="For example America/Chicago or Europe/Berlin." />
      </section>
      <section className="grid gap-4 md:grid-cols-2">
        <h2 className="text-xl font-bold md:col-span-2">Labor, tax and supplies</h2>
        <Field label="Labor rate ($ per hour)" name="laborRate" inputMode="decimal" defaultValue={val("laborRate")} error={err("laborRate")} />
        <Field label="Bill labor in steps of (minutes)" name="laborIncrementMinutes" inputMode="numeric" defaultValue={val("laborIncrementMinutes")} error={err("laborIncrementMinutes")} />
        <Field label="Sales tax rate (%)" name="taxRate" inputMode="decimal" defaultValue={val("taxRate")} error={err("taxRate")} />
        <Choice name="laborTaxable" label="Is repair labor taxed here?" value={val("laborTaxable")} error={err("laborTaxable")} options={[["yes", "Yes, tax labor"], ["no", "No, parts only"]]} />
        <Choice name="taxRounding" label="Round tax" value={val("taxRounding")} error={err("taxRounding")} options={[["invoice", "Once per invoice"], ["line", "On each line"]]} />
        <Field label="Shop supplies (% of labor)" name="shopSupplies" inputMode="decimal" defaultValue={val("shopSupplies")} error={err("shopSupplies")} />
        <Field label="Shop supplies cap ($)" name="shopSuppliesCap" inputMode="decimal" defaultValue={val("shopSuppliesCap")} error={err("shopSuppliesCap")} />
      </section>
      <section className="grid gap-4 md:grid-cols-2">
        <h2 className="text-xl font-bold md:col-span-2">Reports</h2>
        <Field label="Comeback window (days after hand-back)" name="comebackWindowDays" inputMode="numeric" defaultValue={val("comebackWindowDays")} error={err("comebackWindowDays")} />
      </section>
      <div>
        <Button type="submit" disabled={pending}>{pending ? "Saving…" : "Save settings"}</Button>
      </div>
    </form>
  );
}
