import { NextResponse } from "next/server";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { route } from "@/lib/http/route";
import { AppError } from "@/lib/http/errors";

export const dynamic = "force-dynamic";

export const GET = route(async () => {
  try {
    getDb().get(sql`select 1`);
  } catch (err) {
    console.error("[health] database check failed", err);
    throw new AppError("internal", "The database is not answering.");
  }
  return NextResponse.json({ ok: true, service: "benchwright", db: "ok", time: new Date().toISOString() });
});
