import path from "node:path";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { connectDatabase } from "./client";

export async function migrateDatabase(url: string): Promise<void> {
  const handle = connectDatabase(url);
  try {
    await migrate(handle.db, { migrationsFolder: path.resolve(import.meta.dirname, "../../drizzle") });
  } finally {
    await handle.close();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("Set DATABASE_URL (npm start sets it for the local cluster).");
  await migrateDatabase(url);
  console.log("migrations applied");
}
