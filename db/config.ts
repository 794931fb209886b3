import fs from "node:fs";
import path from "node:path";

/** The folder that holds the database, photos and generated secrets. Never committed. */
export function dataDir(): string {
  const dir = path.resolve(process.env.DATA_DIR || "./data");
  fs.mkdirSync(dir, { recursive: true });
  return dir;
}

export function databaseFile(): string {
  return path.join(dataDir(), "benchwright.sqlite");
}

export const MIGRATIONS_FOLDER = path.resolve(process.cwd(), "db/migrations");
