// Applies the committed migrations to $DATABASE_URL (run by the start and test scripts).
import { migrate } from "drizzle-orm/postgres-js/migrator";
import { fileURLToPath } from "node:url";
import { createDatabase, databaseUrl } from "./client";

const { db, client } = createDatabase(databaseUrl(), { max: 1 });
try {
  await migrate(db, { migrationsFolder: fileURLToPath(new URL("./migrations", import.meta.url)) });
  console.log("migrations applied");
} finally {
  await client.end();
}
