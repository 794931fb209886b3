import Database from "better-sqlite3";
import { drizzle, type BetterSQLite3Database } from "drizzle-orm/better-sqlite3";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import { MIGRATIONS_FOLDER, databaseFile } from "./config";
import * as schema from "./schema";

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

/** Opens a database file with the pragmas every connection needs. */
export function openDatabase(file: string, options: { migrate?: boolean } = {}): Db {
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  sqlite.pragma("synchronous = NORMAL");
  const db = drizzle(sqlite, { schema }) as Db;
  if (options.migrate !== false) migrate(db, { migrationsFolder: MIGRATIONS_FOLDER });
  return db;
}

const globalForDb = globalThis as unknown as { __benchwrightDb?: Db; __benchwrightDbFile?: string };

/**
 * The process-wide connection, opened lazily (never at import time, so a fresh clone builds) and
 * migrated on first use, so a server started on an empty DATA_DIR works without a manual step.
 */
export function getDb(): Db {
  const file = databaseFile();
  if (!globalForDb.__benchwrightDb || globalForDb.__benchwrightDbFile !== file) {
    globalForDb.__benchwrightDb?.$client.close();
    globalForDb.__benchwrightDb = openDatabase(file);
    globalForDb.__benchwrightDbFile = file;
  }
  return globalForDb.__benchwrightDb;
}

/** For tests: forget the cached connection (e.g. after pointing DATA_DIR elsewhere). */
export function closeDb(): void {
  globalForDb.__benchwrightDb?.$client.close();
  globalForDb.__benchwrightDb = undefined;
  globalForDb.__benchwrightDbFile = undefined;
}
