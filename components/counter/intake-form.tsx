"use client";

import { useEffect, useMemo, useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import { useForm, useWatch, type FieldPath, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery } from "@tanstack/react-query";
import { Search, UserRound, Wrench, X } from "lucide-react";
import { intakeSchema, EMPTY_INTAKE, type IntakeInput, type IntakeValues } from "@/lib/counter/intake-schema";
import { dateIn } from "@/lib/counter/dates";
import type { CustomerHit, MachineHit } from "@/lib/counter/search";
import type { DuplicateMachine, IntakeResult } from "@/lib/counter/intake";
import { COMPLAINT_LABELS, COMPLAINT_PICKS, CONDITION_FLAGS, CONDITION_LABELS, CONTACT_LABELS, CONTACT_PREFERENCES } from "@/lib/tickets/intake";
import { ENGINE_TYPES, ENGINE_TYPE_LABELS, MACHINE_KINDS, MACHINE_KIND_LABELS } from "@/lib/tickets/machine";
import type { Caution } from "@/lib/trade/cautions";
import { formatTagCode } from "@/lib/trade/tag-code";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";
import { apiJson } from "./api";
import { CautionNote } from "./caution-note";
import { Chips, Select, TextArea } from "./fields";
import { IntakePhotos } from "./intake-photos";
import { takeInAction } from "@/app/counter/intake/actions";

const FIELD_ORDER: Array<FieldPath<IntakeValues>> = [
  "customerId", "firstName", "lastName", "phone", "email", "contactPreference", "emailConsent",
  "machineId", "kind", "engineType", "make", "model", "serial",
  "complaintPicks", "complaint", "conditionFlags", "conditionNote", "accessories", "photos", "promisedDate", "approvalLimit", "assignedTechId",
];

function useDebounced<T>(value: T, ms = 250): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

function Section({ title, icon, children, id }: { title: string; icon?: React.ReactNode; children: React.ReactNode; id: string }) {
  return (
    <section aria-labelledby={id} className="rounded-2xl border border-line bg-surface p-4 md:p-6">
      <h2 id={id} className="mb-4 flex items-center gap-2 text-xl font-bold">
        {icon}
        {title}
      </h2>
      <div className="flex flex-col gap-4">{children}</div>
    </section>
  );
}

export interface IntakePrefill {
  customer?: CustomerHit;
  machine?: MachineHit;
}

export function IntakeForm({
  techs,
  timezone,
  fuelCaution,
  prefill = {},
}: {
  techs: Array<{ id: string; name: string }>;
  timezone: string;
  fuelCaution: Caution | null;
  prefill?: IntakePrefill;
}) {
  const router = useRouter();
  const today = useMemo(() => dateIn(timezone, Date.now()), [timezone]);
  const schema = useMemo(() => intakeSchema(today), [today]);
  const [customer, setCustomer] = useState<CustomerHit | null>(prefill.customer ?? null);
  const [machine, setMachine] = useState<MachineHit | null>(prefill.machine ?? null);
  const [duplicates, setDuplicates] = useState<DuplicateMachine[]>([]);
  const [banner, setBanner] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();

  const defaults: IntakeValues = {
    ...EMPTY_INTAKE,
    ...(prefill.customer ? customerFields(prefill.customer) : {}),
    ...(prefill.machine ? { machineId: prefill.machine.id } : {}),
  };
  const form = useForm<IntakeValues, unknown, IntakeInput>({
    // The form holds plain strings; the schema narrows them (enums, dates, cents) on the way out.
    resolver: zodResolver(schema) as unknown as Resolver<IntakeValues, unknown, IntakeInput>,
    defaultValues: defaults,
    mode: "onSubmit",
    reValidateMode: "onChange",
    shouldFocusError: true,
  });
  const { register, handleSubmit, setValue, setError, control, formState } = form;
  const errors = formState.errors;
  const err = (k: FieldPath<IntakeValues>) => {
    const e = (errors as Record<string, { message?: string } | Array<{ message?: string }> | undefined>)[k];
    if (!e) return undefined;
    if (Array.isArray(e)) return e.find((x) => x?.message)?.message ?? "Check these choices.";
    return e.message;
  };
  const flags = useWatch({ control, name: "conditionFlags" });
  const serialIsDifferent = useWatch({ control, name: "serialIsDifferent" });
  const intakePhotos = useWatch({ control, name: "photos" });

  function customerFields(c: CustomerHit): Partial<IntakeValues> {
    return {
      customerId: c.id,
      firstName: c.firstName,
      lastName: c.lastName,
      phone: c.phone,
      email: c.email,
      contactPreference: c.contactPreference,
      emailConsent: c.emailConsent,
    };
  }

  function chooseCustomer(c: CustomerHit | null) {
    setCustomer(c);
    const f = c ? customerFields(c) : { customerId: "", firstName: "", lastName: "", phone: "", email: "", contactPreference: "phone", emailConsent: false };
    for (const [k, v] of Object.entries(f)) setValue(k as keyof IntakeValues, v as never, { shouldDirty: true });
  }

  async function chooseMachine(m: MachineHit | null) {
    setMachine(m);
    setDuplicates([]);
    setValue("machineId", m?.id ?? "", { shouldDirty: true });
    // A machine on file brings its owner along, unless a customer is already chosen or being typed in.
    if (m && m.customerId && !customer && !form.getValues("lastName").trim()) {
      const { customers } = await apiJson<{ customers: CustomerHit[] }>(`/api/counter/customers?id=${m.customerId}`);
      if (customers[0]) chooseCustomer(customers[0]);
    }
  }

  async function checkSerial(serial: string) {
    if (!serial.trim()) {
      setDuplicates([]);
      return;
    }
    try {
      const { duplicates } = await apiJson<{ duplicates: DuplicateMachine[] }>(`/api/counter/machines?serial=${encodeURIComponent(serial)}`);
      setDuplicates(duplicates);
    } catch {
      setDuplicates([]);
    }
  }

  function showServerErrors(result: Extract<IntakeResult, { ok: false }>) {
    setBanner(result.message);
    if (result.duplicates) setDuplicates(result.duplicates);
    const keys = FIELD_ORDER.filter((k) => result.fields[k]);
    keys.forEach((k, i) => setError(k, { type: "server", message: result.fields[k] }, { shouldFocus: i === 0 }));
    if (!keys.length) window.scrollTo({ top: 0, behavior: "smooth" });
  }

  const onValid = () => {
    setBanner(null);
    const values = form.getValues();
    startTransition(async () => {
      const result = await takeInAction(values);
      if (result.ok) {
        router.push(`/counter/tickets/${result.ticketId}?taken=1`);
      } else {
        showServerErrors(result);
      }
    });
  };
  const onInvalid = () => setBanner("Some fields need attention. Nothing you typed has been lost.");

  return (
    <form onSubmit={handleSubmit(onValid, onInvalid)} noValidate className="flex flex-col gap-6" aria-describedby={banner ? "intake-banner" : undefined}>
      {banner ? (
        <div id="intake-banner">
          <Notice tone="bad">{banner}</Notice>
        </div>
      ) : null}

      <div className="grid items-start gap-6 2xl:grid-cols-2">
      <Section id="sec-customer" title="Customer" icon={<UserRound size={22} aria-hidden />}>
        <CustomerFinder chosen={customer} onChoose={chooseCustomer} />
        <input type="hidden" {...register("customerId")} />
        {err("customerId") ? <p role="alert" className="font-semibold text-bad">{err("customerId")}</p> : null}
        <div className="grid gap-4 md:grid-cols-2">
          <Field label="First name" autoComplete="off" error={err("firstName")} {...register("firstName")} />
          <Field label="Last name" autoComplete="off" error={err("lastName")} {...register("lastName")} />
          <Field label="Phone" type="tel" inputMode="tel" autoComplete="off" error={err("phone")} hint="For example 555-0142 or +1 312 555 0142." {...register("phone")} />
          <Field label="E-mail" type="email" autoComplete="off" error={err("email")} {...register("email")} />
        </div>
        <Chips legend="How to reach them" name="contactPreference" type="radio" error={err("contactPreference")} options={CONTACT_PREFERENCES.map((p) => [p, CONTACT_LABELS[p]] as const)} inputProps={register("contactPreference")} />
        <label className="tap flex items-start gap-3 rounded-xl border-2 border-line px-3 py-3 has-[:checked]:border-accent has-[:checked]:bg-accent-soft">
          <input type="checkbox" className="mt-1 size-5" {...register("emailConsent")} />
          <span>
            <span className="font-semibold">Agrees to e-mail</span> about this repair (estimates, approval links, ready for pickup).
            <span className="block text-sm text-muted">Ask and tick only if they said yes.</span>
          </span>
        </label>
      </Section>

      <Section id="sec-machine" title="Machine" icon={<Wrench size={22} aria-hidden />}>
        <input type="hidden" {...register("machineId")} />
        <MachineFinder customer={customer} chosen={machine} onChoose={chooseMachine} />
        {err("machineId") ? <p role="alert" className="font-semibold text-bad">{err("machineId")}</p> : null}
        {machine ? null : (
          <>
            <Chips legend="Kind of machine" name="kind" type="radio" error={err("kind")} options={MACHINE_KINDS.map((k) => [k, MACHINE_KIND_LABELS[k]] as const)} inputProps={register("kind")} />
            <Chips legend="Engine" name="engineType" type="radio" error={err("engineType")} options={ENGINE_TYPES.map((k) => [k, ENGINE_TYPE_LABELS[k]] as const)} inputProps={register("engineType")} />
            <div className="grid gap-4 md:grid-cols-3">
              <Field label="Make" autoComplete="off" error={err("make")} {...register("make")} />
              <Field label="Model" autoComplete="off" error={err("model")} {...register("model")} />
              <Field label="Serial number" autoComplete="off" error={err("serial")} {...register("serial", { onBlur: (e) => checkSerial(e.target.value) })} />
            </div>
            {duplicates.length ? (
              <div role="status" className="rounded-xl border-l-8 border-bad bg-bad-soft px-4 py-3">
                <p className="font-bold">Possible duplicate: this serial is already on file.</p>
                <ul className="mt-2 flex flex-col gap-2">
                  {duplicates.map((d) => (
                    <li key={d.machineId} className="flex flex-wrap items-center justify-between gap-2">
                      <span>
                        {d.label} · s/n {d.serial} · {d.customerName}
                      </span>
                      <button
                        type="button"
                        className={buttonClass("secondary")}
                        onClick={async () => {
                          const m = await apiJson<{ machines: MachineHit[] }>(`/api/counter/machines?q=${encodeURIComponent(d.serial)}`);
                          const hit = m.machines.find((x) => x.id === d.machineId);
                          if (hit) await chooseMachine(hit);
                        }}
                      >
                        Use this machine
                      </button>
                    </li>
                  ))}
                </ul>
                <label className="tap mt-2 flex items-center gap-3 font-semibold">
                  <input type="checkbox" className="size-5" {...register("serialIsDifferent")} />
                  It is a different machine: save it anyway
                </label>
                {serialIsDifferent ? <p className="text-sm">The new machine will be saved with the same serial; the history notes that you confirmed it.</p> : null}
              </div>
            ) : null}
          </>
        )}
      </Section>

      </div>

      <div className="grid items-start gap-6 2xl:grid-cols-2">
      <Section id="sec-complaint" title="What's wrong">
        <Chips legend="Quick picks" name="complaintPicks" type="checkbox" error={err("complaintPicks")} options={COMPLAINT_PICKS.map((k) => [k, COMPLAINT_LABELS[k]] as const)} inputProps={register("complaintPicks")} />
        <TextArea id="f-complaint" label="In the customer's words" error={err("complaint")} {...register("complaint")} />
      </Section>

      <Section id="sec-condition" title="Condition at intake">
        <Chips legend="Tick what you see" name="conditionFlags" type="checkbox" error={err("conditionFlags")} options={CONDITION_FLAGS.map((k) => [k, CONDITION_LABELS[k]] as const)} inputProps={register("conditionFlags")} />
        {fuelCaution && flags?.includes("fuel_in_tank") ? <CautionNote caution={fuelCaution} /> : null}
        <TextArea id="f-conditionNote" label="Condition note" rows={2} error={err("conditionNote")} {...register("conditionNote")} />
        <Field label="Left with the machine" hint="Bar cover, battery, charger, grass bag…" autoComplete="off" error={err("accessories")} {...register("accessories")} />
        <IntakePhotos value={intakePhotos ?? []} onChange={(next) => setValue("photos", next, { shouldDirty: true })} error={err("photos")} />
      </Section>

      </div>

      <Section id="sec-promise" title="Promise and limit">
        <div className="grid gap-4 md:grid-cols-3">
          <Field label="Promised for" type="date" min={today} error={err("promisedDate")} {...register("promisedDate")} />
          <Field
            label="Call before going over ($)"
            inputMode="decimal"
            autoComplete="off"
            placeholder="e.g. 150"
            hint="Leave empty for no limit."
            error={err("approvalLimit")}
            {...register("approvalLimit")}
          />
          <Select id="f-assignedTechId" label="Technician (optional)" error={err("assignedTechId")} {...register("assignedTechId")}>
            <option value="">Not yet</option>
            {techs.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </Select>
        </div>
      </Section>

      <div className="sticky bottom-0 z-10 -mx-4 flex flex-wrap items-center gap-3 border-t border-line bg-bg/95 px-4 py-3 backdrop-blur md:static md:mx-0 md:border-0 md:bg-transparent md:p-0">
        <button type="submit" className={buttonClass("primary", "md", "text-lg")} disabled={pending}>
          {pending ? "Saving…" : "Take in and print tag"}
        </button>
        <p className="text-sm text-muted">The ticket number and tag code are given when you save.</p>
      </div>
    </form>
  );
}

function CustomerFinder({ chosen, onChoose }: { chosen: CustomerHit | null; onChoose: (c: CustomerHit | null) => void }) {
  const [q, setQ] = useState("");
  const dq = useDebounced(q.trim());
  const found = useQuery({
    queryKey: ["customers", dq],
    queryFn: () => apiJson<{ customers: CustomerHit[] }>(`/api/counter/customers?q=${encodeURIComponent(dq)}`),
    enabled: dq.length >= 2 && !chosen,
  });
  if (chosen) {
    return (
      <div className="flex flex-wrap items-center justify-between gap-3 rounded-xl bg-accent-soft px-4 py-3">
        <p>
          On file: <span className="font-bold">{chosen.lastName}</span>
          {chosen.firstName ? `, ${chosen.firstName}` : ""} · {chosen.phone || chosen.email}
          <span className="block text-sm text-ink-2">Changes to the details below are saved to their record.</span>
        </p>
        <button type="button" className={buttonClass("secondary")} onClick={() => onChoose(null)}>
          <X size={18} aria-hidden /> Someone else
        </button>
      </div>
    );
  }
  const hits = found.data?.customers ?? [];
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor="find-customer" className="font-semibold">
        Find a customer on file
      </label>
      <div className="relative">
        <Search size={20} aria-hidden className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-muted" />
        <input
          id="find-customer"
          type="search"
          value={q}
          onChange={(e) => setQ(e.target.value)}
          onKeyDown={(e) => e.key === "Enter" && e.preventDefault()}
          placeholder="Name, phone or e-mail"
          autoComplete="off"
          className="tap w-full rounded-xl border-2 border-line bg-surface pr-3 pl-10 text-lg focus:border-accent"
        />
      </div>
      {dq.length >= 2 ? (
        hits.length ? (
          <ul aria-label="Customers found" className="flex flex-col gap-2">
            {hits.map((c) => (
              <li key={c.id}>
                <button type="button" onClick={() => onChoose(c)} className="tap w-full rounded-xl border-2 border-line px-4 py-2 text-left hover:border-accent">
                  <span className="font-bold">{c.lastName}</span>
                  {c.firstName ? `, ${c.firstName}` : ""}
                  <span className="text-muted"> · {[c.phone, c.email].filter(Boolean).join(" · ")}</span>
                </button>
              </li>
            ))}
          </ul>
        ) : found.isFetching ? (
          <p className="text-muted">Searching…</p>
        ) : (
          <p className="text-muted">Nobody on file matches &ldquo;{dq}&rdquo;. Fill in the new customer below.</p>
        )
      ) : (
        <p className="text-sm text-muted">Or fill in a new customer below.</p>
      )}
    </div>
  );
}

function MachineLine({ m }: { m: MachineHit }) {
  return (
    <>
      <span className="font-bold">
        {m.make} {m.model}
      </span>{" "}
      <span className="text-muted">
        · {m.kindLabel}
        {m.serial ? ` · s/n ${m.serial}` : ""}
        {m.stickerCode ? ` · sticker ${formatTagCode(m.stickerCode)}` : ""}
        {m.customerName ? ` · ${m.customerName}` : ""}
      </span>
    </>
  );
}

function MachineFinder({ customer, chosen, onChoose }: { customer: CustomerHit | null; chosen: MachineHit | null; onChoose: (m: MachineHit | null) => void }) {
  const [q, setQ] = useState("");
  const dq = useDebounced(q.trim());
  const theirs = useQuery({
    queryKey: ["machines-of", customer?.id],
    queryFn: () => apiJson<{ machines: MachineHit[] }>(`/api/counter/machines?customerId=${customer!.id}`),
    enabled: Boolean(customer) && !chosen,
  });
  const found = useQuery({
    queryKey: ["machines", dq],
    queryFn: () => apiJson<{ machines: MachineHit[] }>(`/api/counter/machines?q=${encodeURIComponent(dq)}`),
    enabled: dq.length >= 2 && !chosen,
  });
  if (chosen) {
    return (
      <div className="flex flex-col gap-2 rounded-xl bg-accent-soft px-4 py-3">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <p>
            On file: <MachineLine m={chosen} />
          </p>
          <button type="button" className={buttonClass("secondary")} onClick={() => onChoose(null)}>
            <X size={18} aria-hidden /> Another machine
          </button>
        </div>
        {chosen.openTickets.length ? (
          <p role="status" className="font-semibold text-bad">
            Already in the shop on {chosen.openTickets.map((t) => `#${t.number} (${t.statusLabel.toLowerCase()})`).join(", ")}. Saving opens a second ticket.
          </p>
        ) : null}
      </div>
    );
  }
  const mine = theirs.data?.machines ?? [];
  const hits = found.data?.machines ?? [];
  return (
    <div className="flex flex-col gap-3">
      {mine.length ? (
        <div className="flex flex-col gap-2">
          <p className="font-semibold">Their machines on file</p>
          <ul className="flex flex-col gap-2">
            {mine.map((m) => (
              <li key={m.id}>
                <button type="button" onClick={() => onChoose(m)} className="tap w-full rounded-xl border-2 border-line px-4 py-2 text-left hover:border-accent">
                  <MachineLine m={{ ...m, customerName: "" }} />
                  {m.openTickets.length ? <span className="ml-2 text-sm font-semibold text-bad">in the shop now</span> : null}
                </button>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <div className="flex flex-col gap-2">
        <label htmlFor="find-machine" className="font-semibold">
          Find a machine by serial, tag or sticker
        </label>
        <div className="relative">
          <Search size={20} aria-hidden className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-muted" />
          <input
            id="find-machine"
            type="search"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            onKeyDown={(e) => e.key === "Enter" && e.preventDefault()}
            placeholder="Serial number or tag code"
            autoComplete="off"
            className="tap w-full rounded-xl border-2 border-line bg-surface pr-3 pl-10 text-lg focus:border-accent"
          />
        </div>
        {dq.length >= 2 ? (
          hits.length ? (
            <ul aria-label="Machines found" className="flex flex-col gap-2">
              {hits.map((m) => (
                <li key={m.id}>
                  <button type="button" onClick={() => onChoose(m)} className="tap w-full rounded-xl border-2 border-line px-4 py-2 text-left hover:border-accent">
                    <MachineLine m={m} />
                  </button>
                </li>
              ))}
            </ul>
          ) : found.isFetching ? (
            <p className="text-muted">Searching…</p>
          ) : (
            <p className="text-muted">No machine on file matches &ldquo;{dq}&rdquo;. Describe it below.</p>
          )
        ) : (
          <p className="text-sm text-muted">Or describe a machine new to the shop below.</p>
        )}
      </div>
    </div>
  );
}
