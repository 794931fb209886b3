import { defineConfig } from "drizzle-kit";
import { databaseFile } from "./db/config";

export default defineConfig({
  dialect: "sqlite",
  schema: "./db/schema/index.ts",
  out: "./db/migrations",
  dbCredentials: { url: databaseFile() },
  strict: true,
  verbose: true,
});
