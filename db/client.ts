import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";

import { getEnv } from "@/lib/env";

import * as schema from "./schema";

function createDb() {
  const sql = postgres(getEnv().DATABASE_URL, { max: 10, onnotice: () => {} });
  return { sql, db: drizzle(sql, { schema, casing: "snake_case" }) };
}

type DbHandle = ReturnType<typeof createDb>;

// One pool per process, kept across Next's module reloads in development.
const globalForDb = globalThis as unknown as { saglineDb?: DbHandle };

function getHandle(): DbHandle {
  globalForDb.saglineDb ??= createDb();
  return globalForDb.saglineDb;
}

export type Db = DbHandle["db"];
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

export function getDb(): Db {
  return getHandle().db;
}

export function getSql() {
  return getHandle().sql;
}

export async function closeDb(): Promise<void> {
  const handle = globalForDb.saglineDb;
  globalForDb.saglineDb = undefined;
  await handle?.sql.end({ timeout: 5 });
}
