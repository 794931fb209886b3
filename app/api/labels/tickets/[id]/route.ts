import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { ticketLabels } from "@/lib/counter/label-data";
import { labelQuery, pdfResponse } from "@/lib/counter/label-response";
import { readQuery, route } from "@/lib/http/route";

/** GET /api/labels/tickets/<ticketId>?layout=…&start=…: the ticket's repair tag as a PDF, any time. */
export const GET = route(async (req: Request, ctx: { params: Promise<{ id: string }> }) => {
  await requireUser();
  const { layout, start } = readQuery(req, labelQuery);
  const { id } = await ctx.params;
  const labels = ticketLabels(getDb(), [id]);
  return pdfResponse(labels, layout, start, `tag-${labels[0]!.code}.pdf`);
});
