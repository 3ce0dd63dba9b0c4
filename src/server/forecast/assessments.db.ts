// Drizzle access for regions and assessments; returns the assessment as the API shows it.
import { and, asc, desc, eq, lt, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { assessments, guidance, regions, type GridJson } from "@/db/schema";

export type AssessmentRow = typeof assessments.$inferSelect;

export interface AssessmentView {
  id: number;
  region: string;
  forecastDay: string;
  location: string;
  latitudeDeg: number;
  longitudeDeg: number;
  isLimbFlagged: boolean;
  areaMsh: number | null;
  spotCount: number | null;
  mcintosh: string | null;
  mountWilson: string | null;
  unsignedFluxMx: number | null;
  pilLengthMm: number | null;
  logR: number | null;
  meanShearDeg: number | null;
  freeEnergyProxy: number | null;
  flares24h: { C: number; M: number; X: number };
  notes: string;
  blended: GridJson | null;
  finals: GridJson | null;
  finalReasons: Record<string, string>;
  isDemo: boolean;
  updatedAt: string;
}

export function toView(row: AssessmentRow, regionNumber: string): AssessmentView {
  return {
    id: row.id,
    region: regionNumber,
    forecastDay: row.forecastDay,
    location: row.location,
    latitudeDeg: row.latitudeDeg,
    longitudeDeg: row.longitudeDeg,
    isLimbFlagged: row.isLimbFlagged,
    areaMsh: row.areaMsh,
    spotCount: row.spotCount,
    mcintosh: row.mcintosh,
    mountWilson: row.mountWilson,
    unsignedFluxMx: row.unsignedFluxMx,
    pilLengthMm: row.pilLengthMm,
    logR: row.logR,
    meanShearDeg: row.meanShearDeg,
    freeEnergyProxy: row.freeEnergyProxy,
    flares24h: { C: row.flaresC, M: row.flaresM, X: row.flaresX },
    notes: row.notes,
    blended: row.blended ?? null,
    finals: row.finals ?? null,
    finalReasons: row.finalReasons ?? {},
    isDemo: row.isDemo,
    updatedAt: row.updatedAt.toISOString(),
  };
}

export async function findOrCreateRegion(tx: Db | Tx, number: string, isDemo = false): Promise<number> {
  const upper = number.toUpperCase();
  const [existing] = await tx.select({ id: regions.id }).from(regions).where(sql`upper(${regions.number}) = ${upper}`);
  if (existing) return existing.id;
  const [created] = await tx.insert(regions).values({ number: upper, isDemo }).returning({ id: regions.id });
  if (!created) throw new Error("region insert returned nothing");
  return created.id;
}

export async function getAssessment(id: number, tx: Db | Tx = getDb()): Promise<AssessmentView | null> {
  const [row] = await tx.select({ a: assessments, number: regions.number }).from(assessments).innerJoin(regions, eq(assessments.regionId, regions.id)).where(eq(assessments.id, id));
  return row ? toView(row.a, row.number) : null;
}

export async function listDay(day: string): Promise<AssessmentView[]> {
  const rows = await getDb().select({ a: assessments, number: regions.number }).from(assessments).innerJoin(regions, eq(assessments.regionId, regions.id)).where(eq(assessments.forecastDay, day)).orderBy(asc(regions.number));
  return rows.map((r) => toView(r.a, r.number));
}

export async function findAssessment(tx: Db | Tx, regionId: number, day: string): Promise<AssessmentRow | null> {
  const [row] = await tx.select().from(assessments).where(and(eq(assessments.regionId, regionId), eq(assessments.forecastDay, day)));
  return row ?? null;
}

/** The region's most recent assessment before a day, to start the next day's from. */
export async function findPreviousAssessment(regionNumber: string, beforeDay: string): Promise<AssessmentView | null> {
  const [row] = await getDb()
    .select({ a: assessments, number: regions.number })
    .from(assessments)
    .innerJoin(regions, eq(assessments.regionId, regions.id))
    .where(and(sql`upper(${regions.number}) = ${regionNumber.toUpperCase()}`, lt(assessments.forecastDay, beforeDay)))
    .orderBy(desc(assessments.forecastDay))
    .limit(1);
  return row ? toView(row.a, row.number) : null;
}

export async function listRegionHistory(regionNumber: string, limit = 120): Promise<AssessmentView[]> {
  const rows = await getDb()
    .select({ a: assessments, number: regions.number })
    .from(assessments)
    .innerJoin(regions, eq(assessments.regionId, regions.id))
    .where(sql`upper(${regions.number}) = ${regionNumber.toUpperCase()}`)
    .orderBy(desc(assessments.forecastDay))
    .limit(limit);
  return rows.map((r) => toView(r.a, r.number)).reverse();
}

export async function listGuidanceFor(assessmentId: number) {
  return getDb().select().from(guidance).where(eq(guidance.assessmentId, assessmentId)).orderBy(asc(guidance.modelKey));
}

export async function listDays(limit = 60, offset = 0): Promise<{ day: string; regions: number; withFinals: number }[]> {
  return getDb()
    .select({ day: assessments.forecastDay, regions: sql<number>`count(*)::int`, withFinals: sql<number>`count(${assessments.finals})::int` })
    .from(assessments)
    .groupBy(assessments.forecastDay)
    .orderBy(desc(assessments.forecastDay))
    .limit(limit)
    .offset(offset);
}

export async function listRegions(q: string | undefined, limit: number, offset: number) {
  const where = q ? sql`upper(${regions.number}) like ${`%${q.toUpperCase()}%`}` : undefined;
  return getDb()
    .select({
      number: regions.number,
      isDemo: regions.isDemo,
      firstDay: sql<string>`min(${assessments.forecastDay})::text`,
      lastDay: sql<string>`max(${assessments.forecastDay})::text`,
      days: sql<number>`count(${assessments.id})::int`,
    })
    .from(regions)
    .leftJoin(assessments, eq(assessments.regionId, regions.id))
    .where(where)
    .groupBy(regions.id)
    .orderBy(desc(sql`max(${assessments.forecastDay})`), asc(regions.number))
    .limit(limit)
    .offset(offset);
}
