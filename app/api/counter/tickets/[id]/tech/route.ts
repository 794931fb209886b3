import { NextResponse } from "next/server";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { assignSchema, assignTech } from "@/lib/counter/ticket-actions";
import { readJson, route } from "@/lib/http/route";

/** POST /api/counter/tickets/<id>/tech { techId | null }: assigns the bench technician. */
export const POST = route(async (req: Request, ctx: { params: Promise<{ id: string }> }) => {
  const user = await requireUser("counter", "owner");
  const { techId } = await readJson(req, assignSchema);
  const { id } = await ctx.params;
  return NextResponse.json(assignTech(getDb(), { ticketId: id, techId, actorId: user.id }));
});
