/**
 * Photos from the bench: downscale to at most 1600 px on the long edge as JPEG, and name the result by the
 * SHA-256 of its bytes (the upload is idempotent by that hash).
 *
 * Browser-only (`preparePhoto` needs a canvas); `sha256Hex` also runs in Node 20 (Web Crypto is global there).
 * The compression runs on the main thread: browser-image-compression's web worker would load its script from a
 * CDN, which fails offline. The library is loaded on first use, so it stays out of the page's first load.
 */
import { err, ok, type Result } from "../trade/result";

export const MAX_PHOTO_EDGE_PX = 1600;
export const PHOTO_MIME = "image/jpeg";
/** Refuse files far beyond any phone camera before decoding them (bytes). */
export const MAX_INPUT_BYTES = 40 * 1024 * 1024;

export type PreparedPhoto = {
  blob: Blob;
  /** Lower-case hex SHA-256 of the JPEG bytes. */
  sha256: string;
  width: number;
  height: number;
  mime: typeof PHOTO_MIME;
  bytes: number;
};

/** Lower-case hex SHA-256 of some bytes, by Web Crypto. */
export async function sha256Hex(data: Blob | ArrayBuffer | Uint8Array): Promise<string> {
  const buffer: BufferSource = data instanceof Blob ? await data.arrayBuffer() : (data as BufferSource);
  const digest = await globalThis.crypto.subtle.digest("SHA-256", buffer);
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, "0")).join("");
}

/** The size a picture is scaled to so its long edge is at most `max` (never enlarged). */
export function fitWithin(width: number, height: number, max = MAX_PHOTO_EDGE_PX): { width: number; height: number } {
  const long = Math.max(width, height);
  if (long <= max) return { width, height };
  const scale = max / long;
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

async function measure(blob: Blob): Promise<{ width: number; height: number }> {
  const bitmap = await createImageBitmap(blob);
  try {
    return { width: bitmap.width, height: bitmap.height };
  } finally {
    bitmap.close();
  }
}

/**
 * Downscale a photo to ≤ 1600 px JPEG and hash it. Errors come back as a message to show; the caller keeps
 * everything else the tech entered.
 */
export async function preparePhoto(
  file: Blob,
  options: { maxEdgePx?: number; quality?: number; signal?: AbortSignal } = {},
): Promise<Result<PreparedPhoto>> {
  if (file.type && !file.type.startsWith("image/")) return err("That file is not a photo. Take or choose a picture.");
  if (file.size === 0) return err("The photo came through empty. Take it again.");
  if (file.size > MAX_INPUT_BYTES) return err("That picture is too large to use. Take it again with the phone's camera.");
  const input = file instanceof File ? file : new File([file], "photo", { type: file.type || "image/jpeg" });
  let out: Blob;
  try {
    const { default: imageCompression } = await import("browser-image-compression");
    out = await imageCompression(input, {
      maxWidthOrHeight: options.maxEdgePx ?? MAX_PHOTO_EDGE_PX,
      fileType: PHOTO_MIME,
      initialQuality: options.quality ?? 0.82,
      useWebWorker: false,
      ...(options.signal ? { signal: options.signal } : {}),
    });
  } catch {
    return err("This picture could not be read. Take it again, or choose another photo.");
  }
  const blob = out.type === PHOTO_MIME ? out : new Blob([out], { type: PHOTO_MIME });
  try {
    const [{ width, height }, sha256] = await Promise.all([measure(blob), sha256Hex(blob)]);
    return ok({ blob, sha256, width, height, mime: PHOTO_MIME, bytes: blob.size });
  } catch {
    return err("This picture could not be read. Take it again, or choose another photo.");
  }
}
