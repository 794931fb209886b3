import { openDatabase } from "../db/client";
import { databaseFile } from "../db/config";
import { ensureShop } from "../db/seed";

const db = openDatabase(databaseFile());
ensureShop(db);
db.$client.close();
console.log(`[benchwright] migrated ${databaseFile()}`);
