// The model registry in the database: versions, activation, and the compiled active set
// (cached, recompiled whenever the registry changes).
import { and, asc, desc, eq, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { models } from "@/db/schema";
import { DEMO_MODELS } from "@/server/scoring/demo-models";
import { compileModel, type CompiledModel, type ModelDefinition } from "@/server/scoring/models";

export interface RegisteredModel {
  id: number;
  key: string;
  version: string;
  kind: string;
  name: string;
  provenance: string;
  params: unknown;
  isActive: boolean;
  isDemo: boolean;
  createdAt: Date;
}

export interface ActiveModel {
  id: number;
  compiled: CompiledModel;
}

let cache: { stamp: string; active: ActiveModel[]; checkedAt: number } | null = null;
// Registry changes in this process call forgetCompiledModels(); the short re-check interval only
// guards against changes made behind the service's back (e.g. by hand in SQL).
const RECHECK_MS = 2_000;

export async function seedDemoModels(tx: Db | Tx = getDb()): Promise<void> {
  for (const def of DEMO_MODELS) {
    await tx
      .insert(models)
      .values({ key: def.key, version: def.version, kind: def.kind, name: def.name, provenance: def.provenance, params: def.params, isActive: def.active, isDemo: true })
      .onConflictDoNothing();
  }
}

export async function listModels(): Promise<RegisteredModel[]> {
  return getDb().select().from(models).orderBy(asc(models.key), desc(models.createdAt));
}

export async function findModel(id: number, tx: Db | Tx = getDb()): Promise<RegisteredModel | null> {
  const [row] = await tx.select().from(models).where(eq(models.id, id));
  return row ?? null;
}

export async function findModelVersion(key: string, version: string): Promise<RegisteredModel | null> {
  const [row] = await getDb().select().from(models).where(and(eq(models.key, key), eq(models.version, version)));
  return row ?? null;
}

/** The active models compiled once per registry state; a cheap stamp query detects changes. */
export async function getActiveModels(now = Date.now()): Promise<ActiveModel[]> {
  if (cache && now - cache.checkedAt < RECHECK_MS) return cache.active;
  const [stampRow] = await getDb()
    .select({ stamp: sql<string>`coalesce(string_agg(${models.id}::text || ':' || ${models.isActive}::text, ',' order by ${models.id}), '')` })
    .from(models);
  const stamp = stampRow?.stamp ?? "";
  if (cache && cache.stamp === stamp) {
    cache.checkedAt = now;
    return cache.active;
  }
  const rows = await getDb().select().from(models).where(eq(models.isActive, true)).orderBy(asc(models.key));
  const active = rows.map((row) => ({ id: row.id, compiled: compileModel(toDefinition(row)) }));
  cache = { stamp, active, checkedAt: now };
  return active;
}

export function toDefinition(row: RegisteredModel): ModelDefinition {
  return { key: row.key, version: row.version, kind: row.kind, name: row.name, provenance: row.provenance, params: row.params, active: row.isActive } as ModelDefinition;
}

export function forgetCompiledModels(): void {
  cache = null;
}
