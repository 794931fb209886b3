import type { Metadata } from "next";
import { Suspense } from "react";
import { TicketPlaceholder } from "@/components/bench/ticket-placeholder";

export const metadata: Metadata = { title: "Ticket" };

/**
 * PLACEHOLDER until the bench ticket screen lands: a static route (precached for offline use) that reads
 * `?id=<ticketId>` on the client, so one precached page serves every ticket.
 */
export const dynamic = "force-static";

export default function BenchTicketPage() {
  return (
    <Suspense>
      <TicketPlaceholder />
    </Suspense>
  );
}
