import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("@/lib/auth/auth", () => import("./helpers/auth-session"));

import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { closeDb, getDb, type Db } from "@/db/client";
import { sniffImage } from "@/lib/sync/server/photos";
import { MAX_PHOTO_BYTES } from "@/lib/sync/protocol";
import { tempDb } from "./helpers/db";
import { TECH, COUNTER, getPhoto, putPhoto, seedShop } from "./helpers/sync-server";

let ctx: ReturnType<typeof tempDb>;
let db: Db;
beforeEach(async () => {
  ctx = tempDb();
  closeDb();
  db = getDb();
  await seedShop(db);
});
afterEach(() => {
  closeDb();
  ctx.cleanup();
});

const sha = (b: Uint8Array) => crypto.createHash("sha256").update(b).digest("hex");
// Magic numbers: [ITU-T T.81 / JFIF] JPEG begins FF D8 FF; [ISO/IEC 15948 (PNG) §5.2] 89 50 4E 47 0D 0A 1A 0A;
// [RFC 9649 (WebP) §2.5] "RIFF" <size> "WEBP"; [GIF89a spec] "GIF89a".
const JPEG = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from("JFIF\0"), crypto.randomBytes(4000)]);
const PNG = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), crypto.randomBytes(100)]);
const WEBP = Buffer.concat([Buffer.from("RIFF"), Buffer.from([0x24, 0, 0, 0]), Buffer.from("WEBPVP8 "), crypto.randomBytes(100)]);
const GIF = Buffer.concat([Buffer.from("GIF89a"), crypto.randomBytes(100)]);

describe("photo bytes", () => {
  it("[FIPS 180-4 example] names content by SHA-256: 'abc' → ba7816bf…f20015ad", () => {
    expect(sha(Buffer.from("abc"))).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("recognises JPEG, PNG and WebP by their first bytes, nothing else", () => {
    expect(sniffImage(JPEG)).toBe("image/jpeg");
    expect(sniffImage(PNG)).toBe("image/png");
    expect(sniffImage(WEBP)).toBe("image/webp");
    expect(sniffImage(GIF)).toBeNull();
    expect(sniffImage(Buffer.from("%PDF-1.7"))).toBeNull();
  });

  it("PUT stores once (201), again is harmless (200), GET returns the same bytes to signed-in staff", async () => {
    const first = await putPhoto(TECH, sha(JPEG), JPEG);
    expect(first).toEqual({ status: 201, body: { sha256: sha(JPEG), created: true, mime: "image/jpeg", bytes: JPEG.length } });
    const again = await putPhoto(TECH, sha(JPEG), JPEG);
    expect(again.status).toBe(200);
    expect(again.body.created).toBe(false);
    const files = fs.readdirSync(path.join(ctx.dir, "photos"), { recursive: true }).map(String).filter((f) => f.endsWith(".jpg"));
    expect(files).toEqual([path.join(sha(JPEG).slice(0, 2), `${sha(JPEG)}.jpg`)]);
    const res = await getPhoto(COUNTER, sha(JPEG));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("image/jpeg");
    expect(Buffer.from(await res.arrayBuffer()).equals(JPEG)).toBe(true);
    expect((await getPhoto(null, sha(JPEG))).status).toBe(401);
    expect((await getPhoto(TECH, sha(PNG))).status).toBe(404);
  });

  it("takes PNG and WebP too", async () => {
    expect((await putPhoto(TECH, sha(PNG), PNG)).body.mime).toBe("image/png");
    expect((await putPhoto(TECH, sha(WEBP), WEBP)).body.mime).toBe("image/webp");
  });

  it("refuses other types with 415 [RFC 9110 §15.5.16]", async () => {
    const res = await putPhoto(TECH, sha(GIF), GIF);
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: "unsupported_media_type", message: expect.stringContaining("JPEG, PNG and WebP") });
  });

  it("refuses more than 8 MB with 413 [RFC 9110 §15.5.14], by the declared length and by the bytes sent", async () => {
    const big = Buffer.concat([JPEG, Buffer.alloc(MAX_PHOTO_BYTES)]);
    const declared = await putPhoto(TECH, sha(big), big, { "content-length": String(big.length) });
    expect(declared.status).toBe(413);
    expect(declared.body.error.code).toBe("payload_too_large");
    const streamed = await putPhoto(TECH, sha(big), big);
    expect(streamed.status).toBe(413);
    expect(fs.existsSync(path.join(ctx.dir, "photos")) ? fs.readdirSync(path.join(ctx.dir, "photos")) : []).toEqual([]);
  });

  it("refuses bytes that do not match their hash, a bad hash and an empty body with 400", async () => {
    expect((await putPhoto(TECH, sha(PNG), JPEG)).status).toBe(400);
    expect((await putPhoto(TECH, "not-a-hash", JPEG)).status).toBe(400);
    expect((await putPhoto(TECH, sha(Buffer.alloc(0)), Buffer.alloc(0))).status).toBe(400);
    expect((await putPhoto(null, sha(JPEG), JPEG)).status).toBe(401);
    expect(db.$client.prepare("SELECT count(*) AS n FROM photo_files").get()).toEqual({ n: 0 });
  });
});
