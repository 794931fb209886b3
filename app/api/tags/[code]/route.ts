import { NextResponse } from "next/server";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { resolveTag } from "@/lib/counter/tags";
import { route } from "@/lib/http/route";

/**
 * GET /api/tags/<code>: what a scanned code stands for, for any signed-in role (the bench asks when the
 * ticket is not on the device). 400 when the check character is wrong, 404 when nothing carries it.
 */
export const GET = route(async (_req: Request, ctx: { params: Promise<{ code: string }> }) => {
  await requireUser();
  const { code } = await ctx.params;
  return NextResponse.json(resolveTag(getDb(), decodeURIComponent(code)), { headers: { "cache-control": "no-store" } });
});
