/**
 * Creates the shop's first (or another) owner account.
 *   npm run create-owner -- --email you@shop.example --name "Your Name" --password "a long password"
 * Any flag left out is asked for.
 */
import { createInterface } from "node:readline/promises";
import { parseArgs } from "node:util";
import { openDatabase } from "../db/client";
import { databaseFile } from "../db/config";
import { ensureShop } from "../db/seed";
import { createUser, newUserSchema } from "../lib/people/users";
import { AppError, zodFields } from "../lib/http/errors";

async function main() {
  const { values } = parseArgs({
    options: { email: { type: "string" }, name: { type: "string" }, password: { type: "string" } },
  });
  const rl = createInterface({ input: process.stdin, output: process.stdout });
  const ask = async (q: string, given?: string) => given ?? (await rl.question(q)).trim();
  const input = {
    name: await ask("Name: ", values.name),
    email: await ask("E-mail: ", values.email),
    password: await ask("Password (at least 10 characters): ", values.password),
    role: "owner" as const,
  };
  rl.close();
  const parsed = newUserSchema.safeParse(input);
  if (!parsed.success) {
    for (const [field, message] of Object.entries(zodFields(parsed.error))) console.error(`  ${field}: ${message}`);
    process.exit(2);
  }
  const db = openDatabase(databaseFile());
  ensureShop(db);
  try {
    await createUser(db, parsed.data, null);
    console.log(`Owner ${parsed.data.email} created. Sign in at /sign-in.`);
  } catch (err) {
    if (err instanceof AppError) {
      console.error(err.message);
      process.exit(2);
    }
    throw err;
  } finally {
    db.$client.close();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
