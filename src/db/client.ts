// Owns the one database connection of a process. Everything else asks getDb(); swapping PGlite
// for another PostgreSQL driver means changing this file only.
import { PGlite } from "@electric-sql/pglite";
import { drizzle, type PgliteDatabase } from "drizzle-orm/pglite";
import { migrate } from "drizzle-orm/pglite/migrator";
import path from "node:path";
import * as schema from "./schema";

export type Db = PgliteDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

interface OpenDatabase {
  db: Db;
  client: PGlite;
  location: string;
}

// Kept on globalThis so the start script, the bundled server and dev reloads share one instance.
const KEY = Symbol.for("facula.database");
type GlobalWithDb = typeof globalThis & { [KEY]?: OpenDatabase; [key: symbol]: unknown };
const store = globalThis as GlobalWithDb;

export interface OpenOptions {
  /** A directory for on-disk data, or "memory" for an in-memory database (tests). */
  location: string;
  migrationsFolder?: string;
}

export async function openDatabase(options: OpenOptions): Promise<OpenDatabase> {
  const existing = store[KEY];
  if (existing) return existing;
  const client =
    options.location === "memory" ? new PGlite() : new PGlite(path.resolve(options.location));
  await client.waitReady;
  const db = drizzle(client, { schema });
  await migrate(db, {
    migrationsFolder: options.migrationsFolder ?? path.resolve(process.cwd(), "drizzle"),
  });
  const opened = { db, client, location: options.location };
  store[KEY] = opened;
  return opened;
}

export function getDb(): Db {
  const opened = store[KEY];
  if (!opened) throw new Error("The database is not open: call openDatabase() at start-up");
  return opened.db;
}

export function isDatabaseOpen(): boolean {
  return store[KEY] !== undefined;
}

export async function closeDatabase(): Promise<void> {
  const opened = store[KEY];
  if (!opened) return;
  delete store[KEY];
  await opened.client.close();
}

export { schema };
