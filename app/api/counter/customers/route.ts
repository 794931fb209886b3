import { NextResponse } from "next/server";
import { z } from "zod";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { getCustomer, searchCustomers } from "@/lib/counter/search";
import { readQuery, route } from "@/lib/http/route";

const query = z.object({
  q: z.string().max(100, "Search with fewer than 100 characters.").default(""),
  id: z.uuid("Unknown customer.").optional(),
});

/** GET /api/counter/customers?q=: customers by name, phone or e-mail, for intake; `?id=` one customer. */
export const GET = route(async (req: Request) => {
  await requireUser("counter", "owner");
  const { q, id } = readQuery(req, query);
  const db = getDb();
  const customers = id ? [getCustomer(db, id)].filter((c) => c !== undefined) : searchCustomers(db, q);
  return NextResponse.json({ customers }, { headers: { "cache-control": "no-store" } });
});
