import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { dataDir } from "../../db/config";

/**
 * AUTH_SECRET from the environment, or one generated once and kept in DATA_DIR (never committed),
 * so a fresh machine needs no manual step.
 */
export function authSecret(): string {
  if (process.env.AUTH_SECRET) return process.env.AUTH_SECRET;
  const file = path.join(dataDir(), "auth-secret");
  try {
    const existing = fs.readFileSync(file, "utf8").trim();
    if (existing.length >= 32) return existing;
  } catch {
    // not there yet
  }
  const secret = crypto.randomBytes(32).toString("base64url");
  fs.writeFileSync(file, secret + "\n", { mode: 0o600 });
  return secret;
}
