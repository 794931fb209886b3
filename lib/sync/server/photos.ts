import "server-only";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { Db } from "@/db/client";
import { dataDir } from "@/db/config";
import { AppError } from "@/lib/http/errors";
import { MAX_PHOTO_BYTES, type PhotoMime } from "../protocol";
import { stmt } from "./store";

/**
 * Photo bytes, stored once per content hash under DATA_DIR/photos with names the server makes
 * (from the hash it computed itself, never from anything the device sent as a file name).
 */
export const SHA256_HEX = /^[0-9a-f]{64}$/;

const EXT: Record<PhotoMime, string> = { "image/jpeg": "jpg", "image/png": "png", "image/webp": "webp" };

/** The image type by its first bytes (magic numbers), or null. */
export function sniffImage(buf: Uint8Array): PhotoMime | null {
  if (buf.length >= 3 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff) return "image/jpeg";
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (buf.length >= 8 && png.every((b, i) => buf[i] === b)) return "image/png";
  const ascii = (from: number, to: number) => String.fromCharCode(...buf.subarray(from, to));
  if (buf.length >= 12 && ascii(0, 4) === "RIFF" && ascii(8, 12) === "WEBP") return "image/webp";
  return null;
}

const tooLarge = () =>
  new AppError("payload_too_large", `The photo is larger than ${MAX_PHOTO_BYTES / (1024 * 1024)} MB. Take it again at a lower resolution.`);

/** Reads a request body, refusing (413) as soon as it passes the limit. */
export async function readBodyLimited(req: Request, limit = MAX_PHOTO_BYTES): Promise<Buffer> {
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooLarge();
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

export function photosDir(): string {
  const dir = path.join(dataDir(), "photos");
  fs.mkdirSync(dir, { recursive: true });
  return dir;
}

/** Stores the bytes named by their SHA-256; idempotent (a second upload of the same photo changes nothing). */
export function storePhoto(db: Db, sha256: string, bytes: Buffer, userId: string): { created: boolean; mime: PhotoMime; bytes: number } {
  if (!SHA256_HEX.test(sha256)) throw new AppError("validation", "The photo address must be its SHA-256 in lower-case hex.", { fields: { sha256: "64 hex digits" } });
  if (bytes.length === 0) throw new AppError("validation", "The photo is empty.");
  if (bytes.length > MAX_PHOTO_BYTES) throw tooLarge();
  const mime = sniffImage(bytes);
  if (!mime) throw new AppError("unsupported_media_type", "Only JPEG, PNG and WebP photos can be stored.");
  const actual = crypto.createHash("sha256").update(bytes).digest("hex");
  if (actual !== sha256) {
    throw new AppError("validation", "The photo's bytes do not match its hash (it was damaged on the way). Try again.", {
      fields: { sha256: "does not match the content" },
    });
  }
  const fileName = `${sha256.slice(0, 2)}/${sha256}.${EXT[mime]}`;
  const full = path.join(photosDir(), fileName);
  const known = stmt(db, "SELECT file_name FROM photo_files WHERE sha256 = ?").get(sha256) as { file_name: string } | undefined;
  if (known && fs.existsSync(path.join(photosDir(), known.file_name))) return { created: false, mime, bytes: bytes.length };
  fs.mkdirSync(path.dirname(full), { recursive: true });
  const tmp = `${full}.${crypto.randomUUID()}.tmp`;
  fs.writeFileSync(tmp, bytes);
  fs.renameSync(tmp, full);
  stmt(db, "INSERT INTO photo_files (sha256, mime, bytes, file_name, uploaded_by) VALUES (?, ?, ?, ?, ?) ON CONFLICT (sha256) DO UPDATE SET file_name = excluded.file_name").run(
    sha256,
    mime,
    bytes.length,
    fileName,
    userId,
  );
  return { created: !known, mime, bytes: bytes.length };
}

/** The stored photo, or null. */
export function readPhoto(db: Db, sha256: string): { mime: string; bytes: Buffer } | null {
  if (!SHA256_HEX.test(sha256)) return null;
  const row = stmt(db, "SELECT mime, file_name FROM photo_files WHERE sha256 = ?").get(sha256) as { mime: string; file_name: string } | undefined;
  if (!row) return null;
  const full = path.join(photosDir(), row.file_name);
  if (!fs.existsSync(full)) return null;
  return { mime: row.mime, bytes: fs.readFileSync(full) };
}
