import { NextResponse } from "next/server";
import { z } from "zod";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { findMachinesBySerial } from "@/lib/counter/intake";
import { machinesOfCustomer, searchMachines } from "@/lib/counter/search";
import { readQuery, route } from "@/lib/http/route";

const query = z.object({
  q: z.string().max(100).optional(),
  customerId: z.uuid("Unknown customer.").optional(),
  serial: z.string().max(60).optional(),
});

/**
 * GET /api/counter/machines: `?q=` by tag, sticker or serial; `?customerId=` a customer's machines;
 * `?serial=` machines already on file with that serial (the duplicate flag at intake).
 */
export const GET = route(async (req: Request) => {
  await requireUser("counter", "owner");
  const { q, customerId, serial } = readQuery(req, query);
  const db = getDb();
  const headers = { "cache-control": "no-store" };
  if (serial !== undefined) return NextResponse.json({ duplicates: findMachinesBySerial(db, serial) }, { headers });
  if (customerId) return NextResponse.json({ machines: machinesOfCustomer(db, customerId) }, { headers });
  return NextResponse.json({ machines: searchMachines(db, q ?? "") }, { headers });
});
