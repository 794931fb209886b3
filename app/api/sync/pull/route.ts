import { NextResponse } from "next/server";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { readQuery, route } from "@/lib/http/route";
import { pullQuerySchema } from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";

export const dynamic = "force-dynamic";

/** Changes since the device's cursor, in pages (a fresh device gets its working set). */
export const GET = route(async (req) => {
  const user = await requireUser();
  const query = readQuery(req, pullQuerySchema);
  const page = pullChanges(getDb(), user, query, { userAgent: req.headers.get("user-agent") ?? "" });
  return NextResponse.json(page, { headers: { "Cache-Control": "no-store" } });
});
