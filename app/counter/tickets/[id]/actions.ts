"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getDb } from "@/db/client";
import { formAction } from "@/lib/http/action";
import { issueSticker, replaceTag } from "@/lib/counter/tags";
import { handBack, handBackFormSchema } from "@/lib/counter/ticket-actions";
import { formatTagCode } from "@/lib/trade/tag-code";
import { resolveConflict } from "@/lib/sync/server";

const STAFF = ["counter", "owner"] as const;

export const replaceTagAction = formAction(
  [...STAFF],
  z.object({ ticketId: z.string().min(1), reason: z.string().trim().max(200, "Keep the reason under 200 characters.").default("") }),
  async ({ ticketId, reason }, user) => {
    const { oldCode, newCode } = replaceTag(getDb(), { ticketId, reason, actorId: user.id });
    revalidatePath(`/counter/tickets/${ticketId}`);
    return `New tag ${formatTagCode(newCode)}. ${formatTagCode(oldCode)} now answers "replaced" when scanned. Print the new tag.`;
  },
);

export const handBackAction = formAction([...STAFF], handBackFormSchema, async (form, user) => {
  handBack(getDb(), form, user.id);
  revalidatePath(`/counter/tickets/${form.ticketId}`);
  revalidatePath("/counter");
  return form.outcome === "returned_unrepaired" ? "Returned unrepaired; the ticket is closed." : "Handed back; the ticket is closed.";
});

export const issueStickerAction = formAction(
  [...STAFF],
  z.object({ machineId: z.string().min(1), back: z.string().startsWith("/counter/").default("/counter") }),
  async ({ machineId, back }, user) => {
    const code = issueSticker(getDb(), { machineId, actorId: user.id });
    revalidatePath(back);
    return `Sticker ${formatTagCode(code)} is ready to print.`;
  },
);

export const resolveConflictAction = formAction(
  [...STAFF],
  z.object({ ticketId: z.string().min(1), conflictId: z.string().min(1), resolution: z.enum(["kept_server", "used_device"]) }),
  async ({ ticketId, conflictId, resolution }, user) => {
    resolveConflict(getDb(), { conflictId, userId: user.id, resolution });
    revalidatePath(`/counter/tickets/${ticketId}`);
    return resolution === "used_device" ? "The bench's value is now the ticket's." : "The counter's value stays.";
  },
);
