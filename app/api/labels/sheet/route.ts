import { z } from "zod";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { ticketLabels } from "@/lib/counter/label-data";
import { labelQuery, pdfResponse } from "@/lib/counter/label-response";
import { readQuery, route } from "@/lib/http/route";

const query = labelQuery.extend({
  tickets: z
    .string({ message: "Name the tickets to print." })
    .transform((s) => [...new Set(s.split(",").map((x) => x.trim()).filter(Boolean))])
    .pipe(z.array(z.string().min(1)).min(1, "Name the tickets to print.").max(100, "Print at most 100 tags at once.")),
});

/** GET /api/labels/sheet?tickets=<id>,<id>…&layout=sheet-letter&start=3: several tickets' tags in one PDF. */
export const GET = route(async (req: Request) => {
  await requireUser();
  const { tickets, layout, start } = readQuery(req, query);
  return pdfResponse(ticketLabels(getDb(), tickets), layout, start, `tags-${tickets.length}.pdf`);
});
