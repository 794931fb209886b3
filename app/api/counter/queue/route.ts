import { NextResponse } from "next/server";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { queuePage, queueQuerySchema } from "@/lib/counter/queue";
import { readQuery, route } from "@/lib/http/route";

/** GET /api/counter/queue?status=&tech=&overdue=1&q=&sort=&dir=&page=&pageSize=: one page of the queue board. */
export const GET = route(async (req: Request) => {
  await requireUser("counter", "owner");
  const query = readQuery(req, queueQuerySchema);
  return NextResponse.json(queuePage(getDb(), query), { headers: { "cache-control": "no-store" } });
});
