"use client";

import { useActionState } from "react";
import { useRouter } from "next/navigation";
import type { FormState } from "@/lib/http/action";
import type { TicketStatus } from "@/lib/tickets/status";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Button } from "@/components/ui/button";
import { handBackAction, issueStickerAction, replaceTagAction } from "@/app/counter/tickets/[id]/actions";
import { MoveStatusButton, TechSelect } from "./ticket-controls";
import { Chips, TextArea } from "./fields";

const val = (s: FormState, k: string, fallback = "") => {
  const v = s.values?.[k];
  return typeof v === "string" ? v : fallback;
};

/** Status move and technician, refreshing the page after a change. */
export function TicketControls({
  ticket,
  techId,
  techs,
}: {
  ticket: { id: string; number: number; tagCode: string; status: TicketStatus };
  techId: string | null;
  techs: Array<{ id: string; name: string }>;
}) {
  const router = useRouter();
  return (
    <div className="flex flex-wrap items-start gap-3">
      <MoveStatusButton ticket={ticket} onMoved={() => router.refresh()} />
      <TechSelect ticket={ticket} techId={techId} techs={techs} onChanged={() => router.refresh()} className="min-w-52" />
    </div>
  );
}

export function ReplaceTagForm({ ticketId }: { ticketId: string }) {
  const [state, action, pending] = useActionState<FormState, FormData>(replaceTagAction, {});
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      {state.message ? <Notice tone={state.ok ? "ok" : "bad"}>{state.message}</Notice> : null}
      <input type="hidden" name="ticketId" value={ticketId} />
      <Field name="reason" label="Why it is being replaced (optional)" placeholder="Came off, unreadable, melted…" defaultValue={state.ok ? "" : val(state, "reason")} error={state.fields?.reason} />
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Replacing…" : "Replace the tag"}
        </Button>
      </div>
    </form>
  );
}

export function HandBackForm({ ticketId, defaults }: { ticketId: string; defaults: { collectedBy: string; date: string; time: string; ready: boolean } }) {
  const [state, action, pending] = useActionState<FormState, FormData>(handBackAction, {});
  const f = state.fields ?? {};
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      {state.message ? <Notice tone={state.ok ? "ok" : "bad"}>{state.message}</Notice> : null}
      <input type="hidden" name="ticketId" value={ticketId} />
      <Chips
        legend="How it leaves"
        name="outcome"
        type="radio"
        error={f.outcome}
        options={[
          ["handed_back", "Handed back"],
          ["returned_unrepaired", "Returned unrepaired"],
        ]}
        inputProps={{ name: "outcome" }}
        defaultValue={val(state, "outcome", "handed_back")}
        hint={defaults.ready ? undefined : "This ticket is not marked ready yet."}
      />
      <div className="grid gap-4 md:grid-cols-3">
        <Field name="collectedBy" label="Collected by" defaultValue={val(state, "collectedBy", defaults.collectedBy)} error={f.collectedBy} autoComplete="off" />
        <Field name="collectedDate" type="date" label="Date" defaultValue={val(state, "collectedDate", defaults.date)} error={f.collectedDate} />
        <Field name="collectedTime" type="time" label="Time" defaultValue={val(state, "collectedTime", defaults.time)} error={f.collectedTime} />
      </div>
      <TextArea id="f-handback-note" name="note" label="Note (optional)" rows={2} defaultValue={val(state, "note")} error={f.note} />
      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Record hand-back and close"}
        </Button>
      </div>
    </form>
  );
}

export function GiveStickerForm({ machineId, back }: { machineId: string; back: string }) {
  const [state, action, pending] = useActionState<FormState, FormData>(issueStickerAction, {});
  return (
    <form action={action} className="flex flex-col gap-2">
      {state.message && !state.ok ? <Notice tone="bad">{state.message}</Notice> : null}
      <input type="hidden" name="machineId" value={machineId} />
      <input type="hidden" name="back" value={back} />
      <div>
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? "Making…" : "Give this machine a permanent sticker"}
        </Button>
      </div>
    </form>
  );
}
