"use client";

import { useSearchParams } from "next/navigation";
import { BenchShell } from "./bench-shell";
import { Notice } from "@/components/ui/notice";

/** PLACEHOLDER for the bench ticket screen: shows which ticket was asked for; the bench sheet comes later. */
export function TicketPlaceholder() {
  const id = useSearchParams().get("id");
  return (
    <BenchShell title="Ticket">
      <div className="flex flex-col gap-4">
        {id ? (
          <p className="text-lg">
            Ticket <span className="font-mono font-bold" data-testid="ticket-id">{id}</span>
          </p>
        ) : (
          <Notice tone="bad" title="No ticket chosen">
            Open a ticket from today&apos;s work or scan its tag.
          </Notice>
        )}
        <Notice tone="info" title="Bench sheet not built yet">
          The bench sheet for this ticket will show here.
        </Notice>
      </div>
    </BenchShell>
  );
}
