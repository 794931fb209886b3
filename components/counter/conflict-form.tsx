"use client";

import { useActionState } from "react";
import type { FormState } from "@/lib/http/action";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { resolveConflictAction } from "@/app/counter/tickets/[id]/actions";

/** Decide a sync conflict: keep the value the counter has, or take the one the bench sent. */
export function ConflictForm({ ticketId, conflictId, deviceLabel, serverLabel }: { ticketId: string; conflictId: string; deviceLabel: string; serverLabel: string }) {
  const [state, action, pending] = useActionState<FormState, FormData>(resolveConflictAction, {});
  return (
    <form action={action} className="flex flex-col gap-2">
      <input type="hidden" name="ticketId" value={ticketId} />
      <input type="hidden" name="conflictId" value={conflictId} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" name="resolution" value="kept_server" variant="secondary" disabled={pending}>
          Keep “{serverLabel}”
        </Button>
        <Button type="submit" name="resolution" value="used_device" variant="secondary" disabled={pending}>
          Use the bench’s “{deviceLabel}”
        </Button>
      </div>
      {state.message && !state.ok ? <Notice tone="bad">{state.message}</Notice> : null}
    </form>
  );
}
