import type { Metadata } from "next";
import { Suspense } from "react";
import { TicketScreen } from "@/components/bench/ticket/ticket-screen";

export const metadata: Metadata = { title: "Ticket" };

/**
 * The bench ticket. A static route (precached for offline use) that reads `?id=<ticketId>` on the client and
 * renders from the phone's own store, so one precached page serves every ticket with no network.
 */
export const dynamic = "force-static";

export default function BenchTicketPage() {
  return (
    <Suspense>
      <TicketScreen />
    </Suspense>
  );
}
