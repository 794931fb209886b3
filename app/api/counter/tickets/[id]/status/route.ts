import { NextResponse } from "next/server";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { moveStatus, statusMoveSchema } from "@/lib/counter/ticket-actions";
import { readJson, route } from "@/lib/http/route";

/** POST /api/counter/tickets/<id>/status { from, to, reason? }: 409 when the ticket moved meanwhile. */
export const POST = route(async (req: Request, ctx: { params: Promise<{ id: string }> }) => {
  const user = await requireUser("counter", "owner");
  const body = await readJson(req, statusMoveSchema);
  const { id } = await ctx.params;
  return NextResponse.json(moveStatus(getDb(), { ticketId: id, ...body, actorId: user.id }));
});
