// Applies the committed migrations under drizzle/. Safe to run on every start.
import { migrate } from "drizzle-orm/postgres-js/migrator";

import { closeDb, getDb } from "./client";

await migrate(getDb(), { migrationsFolder: "drizzle" });
await closeDb();
console.log("[sagline] migrations applied");
