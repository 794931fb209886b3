import "server-only";
import { z } from "zod";
import { LAYOUT_IDS, labelsPdf, type LayoutId, type TagLabel } from "./labels";

/** ?layout=label-4x2|roll-62|sheet-letter|sheet-a4 and, for sheets, ?start=1…10 (the first free label). */
export const labelQuery = z.object({
  layout: z.enum(LAYOUT_IDS, { message: `Choose a layout: ${LAYOUT_IDS.join(", ")}.` }).default("label-4x2"),
  start: z.coerce.number().int("Start at a whole label number.").min(1, "Labels are numbered from 1.").max(10, "A sheet has 10 labels.").default(1),
});

export async function pdfResponse(labels: TagLabel[], layout: LayoutId, start: number, filename: string): Promise<Response> {
  const bytes = await labelsPdf(labels, layout, { start });
  return new Response(Buffer.from(bytes), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `inline; filename="${filename}"`,
      "cache-control": "no-store",
    },
  });
}
