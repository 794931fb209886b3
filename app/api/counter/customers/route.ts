import { NextResponse } from "next/server";
import { z } from "zod";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { searchCustomers } from "@/lib/counter/search";
import { readQuery, route } from "@/lib/http/route";

const query = z.object({ q: z.string().max(100, "Search with fewer than 100 characters.").default("") });

/** GET /api/counter/customers?q=: customers by name, phone or e-mail, for intake. */
export const GET = route(async (req: Request) => {
  await requireUser("counter", "owner");
  const { q } = readQuery(req, query);
  return NextResponse.json({ customers: searchCustomers(getDb(), q) }, { headers: { "cache-control": "no-store" } });
});
