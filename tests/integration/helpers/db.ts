import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase, type Db } from "@/db/client";

/** A fresh, migrated SQLite database in its own temporary DATA_DIR. */
export function tempDb(): { db: Db; dir: string; cleanup: () => void } {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "benchwright-test-"));
  process.env.DATA_DIR = dir;
  const db = openDatabase(path.join(dir, "benchwright.sqlite"));
  return {
    db,
    dir,
    cleanup: () => {
      db.$client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
