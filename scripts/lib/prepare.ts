import { eq } from "drizzle-orm";
import { openDatabase } from "../../db/client";
import { databaseFile } from "../../db/config";
import { users } from "../../db/schema";
import { DEMO_PASSWORD, DEMO_USERS, ensureShop, seedDemo, seedDemoBenchWork } from "../../db/seed";
import { authSecret } from "../../lib/auth/secret";
import { ensureBuiltInProcedures } from "../../db/procedures";

/** Migrate, then seed the demo shop unless DEMO=0; makes sure AUTH_SECRET exists. */
export async function prepareData(): Promise<void> {
  process.env.AUTH_SECRET = authSecret();
  const file = databaseFile();
  const db = openDatabase(file); // applies migrations
  console.log(`[benchwright] database ready: ${file}`);
  const procedures = ensureBuiltInProcedures(db);
  if (procedures) console.log(`[benchwright] built-in bench sheets saved: ${procedures}`);
  if (process.env.DEMO === "0") {
    ensureShop(db);
    const owner = db.select({ id: users.id }).from(users).where(eq(users.role, "owner")).get();
    if (!owner) console.log("[benchwright] empty shop: create the first owner with  npm run create-owner");
  } else {
    const { created } = await seedDemo(db);
    seedDemoBenchWork(db);
    console.log(`[benchwright] demo shop ${created ? "seeded" : "already present"}. Demo sign-ins (password "${DEMO_PASSWORD}"):`);
    for (const u of DEMO_USERS) console.log(`    ${u.role.padEnd(8)} ${u.email}`);
  }
  db.$client.close();
}
