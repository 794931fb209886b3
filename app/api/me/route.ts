import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/guard";
import { route } from "@/lib/http/route";

export const dynamic = "force-dynamic";

/** Who is signed in: the bench device keeps this so the shell renders offline. */
export const GET = route(async () => {
  const user = await requireUser();
  return NextResponse.json({ user }, { headers: { "Cache-Control": "no-store" } });
});
