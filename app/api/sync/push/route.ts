import { NextResponse } from "next/server";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { readJson, route } from "@/lib/http/route";
import { pushRequestSchema } from "@/lib/sync/protocol";
import { applyPush } from "@/lib/sync/server/push";

export const dynamic = "force-dynamic";

/** A device's batch of recorded changes: each answered applied, duplicate or rejected (with the reason). */
export const POST = route(async (req) => {
  const user = await requireUser();
  const body = await readJson(req, pushRequestSchema);
  const result = applyPush(getDb(), user, body, { userAgent: req.headers.get("user-agent") ?? "" });
  return NextResponse.json(result, { headers: { "Cache-Control": "no-store" } });
});
