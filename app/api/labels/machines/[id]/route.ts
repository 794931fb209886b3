import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { stickerLabel } from "@/lib/counter/label-data";
import { labelQuery, pdfResponse } from "@/lib/counter/label-response";
import { readQuery, route } from "@/lib/http/route";

/** GET /api/labels/machines/<machineId>?layout=…&start=…: the machine's permanent sticker as a PDF. */
export const GET = route(async (req: Request, ctx: { params: Promise<{ id: string }> }) => {
  await requireUser();
  const { layout, start } = readQuery(req, labelQuery);
  const { id } = await ctx.params;
  const label = stickerLabel(getDb(), id);
  return pdfResponse([label], layout, start, `sticker-${label.code}.pdf`);
});
