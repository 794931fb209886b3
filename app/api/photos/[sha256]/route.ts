import { NextResponse } from "next/server";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { AppError } from "@/lib/http/errors";
import { route } from "@/lib/http/route";
import { SHA256_HEX, readBodyLimited, readPhoto, storePhoto } from "@/lib/sync/server/photos";

export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ sha256: string }> };

async function hashParam(ctx: Ctx): Promise<string> {
  const { sha256 } = await ctx.params;
  if (!SHA256_HEX.test(sha256)) {
    throw new AppError("validation", "The photo address must be its SHA-256 in lower-case hex.", { fields: { sha256: "64 hex digits" } });
  }
  return sha256;
}

/** Upload a photo's bytes under their SHA-256 (idempotent). JPEG, PNG or WebP, at most 8 MB. */
export const PUT = route<Ctx>(async (req, ctx) => {
  const user = await requireUser();
  const sha256 = await hashParam(ctx);
  const bytes = await readBodyLimited(req);
  const stored = storePhoto(getDb(), sha256, bytes, user.id);
  return NextResponse.json({ sha256, ...stored }, { status: stored.created ? 201 : 200 });
});

/** A stored photo, for signed-in staff. */
export const GET = route<Ctx>(async (_req, ctx) => {
  await requireUser();
  const sha256 = await hashParam(ctx);
  const photo = readPhoto(getDb(), sha256);
  if (!photo) throw new AppError("not_found", "No photo with that hash has been uploaded.");
  return new Response(new Uint8Array(photo.bytes), {
    headers: {
      "Content-Type": photo.mime,
      "Content-Length": String(photo.bytes.length),
      "Cache-Control": "private, max-age=31536000, immutable",
      ETag: `"${sha256}"`,
      "X-Content-Type-Options": "nosniff",
    },
  });
});
