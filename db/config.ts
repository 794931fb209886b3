import fs from "node:fs";
import path from "node:path";

const made = new Set<string>();

/** The folder that holds the database, photos and generated secrets (created on first use). Never committed. */
export function dataDir(): string {
  const dir = path.resolve(process.env.DATA_DIR || "./data");
  if (!made.has(dir)) {
    fs.mkdirSync(dir, { recursive: true });
    made.add(dir);
  }
  return dir;
}

export function databaseFile(): string {
  return path.join(dataDir(), "benchwright.sqlite");
}

export const MIGRATIONS_FOLDER = path.resolve(process.cwd(), "db/migrations");
