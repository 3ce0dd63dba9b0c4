// The day's full-disk table: derived from the regions by 1 − Π(1 − Pᵢ) (independent regions,
// common practice), then adjusted cell by cell with a reason.
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { fullDiskAdjustments } from "@/db/schema";
import type { CurrentUser } from "@/lib/auth/roles";
import { buildGrid, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import { finalsOrderErrors } from "@/lib/domain/finals";
import type { FullDiskAdjustment } from "@/lib/schemas/full-disk";
import { recordAudit } from "@/server/audit/audit.db";
import { AppError } from "@/server/http/errors";
import { combineFullDisk } from "@/server/scoring/full-disk";
import { listDay } from "./assessments.db";

export interface FullDiskTable {
  day: string;
  regionCount: number;
  /** Regions without finals contribute their blended guidance; listed here. */
  regionsOnGuidance: string[];
  derived: ProbabilityGrid | null;
  guidance: ProbabilityGrid | null;
  adjustments: FullDiskAdjustment;
  final: ProbabilityGrid | null;
}

export async function getFullDisk(day: string): Promise<FullDiskTable> {
  const rows = await listDay(day);
  const grids: ProbabilityGrid[] = [];
  const guidanceGrids: ProbabilityGrid[] = [];
  const regionsOnGuidance: string[] = [];
  for (const r of rows) {
    if (r.blended) guidanceGrids.push(r.blended);
    if (r.finals) grids.push(r.finals);
    else if (r.blended) {
      grids.push(r.blended);
      regionsOnGuidance.push(r.region);
    }
  }
  const derived = grids.length ? combineFullDisk(grids) : null;
  const [adj] = await getDb().select().from(fullDiskAdjustments).where(eq(fullDiskAdjustments.forecastDay, day));
  const adjustments = { values: adj?.values ?? {}, reasons: adj?.reasons ?? {} };
  return {
    day,
    regionCount: rows.length,
    regionsOnGuidance,
    derived,
    guidance: guidanceGrids.length ? combineFullDisk(guidanceGrids) : null,
    adjustments,
    final: derived ? applyAdjustments(derived, adjustments.values) : null,
  };
}

export function applyAdjustments(derived: ProbabilityGrid, values: Record<string, number>): ProbabilityGrid {
  return buildGrid((level, window) => values[`${level}.${window}`] ?? derived[level][window]);
}

export async function saveFullDiskAdjustments(day: string, input: FullDiskAdjustment, actor: CurrentUser): Promise<FullDiskTable> {
  const current = await getFullDisk(day);
  if (!current.derived) throw new AppError("CONFLICT", "There are no regions with probabilities on this day yet.");
  const errors = finalsOrderErrors(applyAdjustments(current.derived, input.values));
  if (Object.keys(errors).length) {
    throw new AppError("BAD_REQUEST", "The adjusted table breaks the order rules.", { fields: Object.fromEntries(Object.entries(errors).map(([k, m]) => [k.replace("finals.", "values."), m])) });
  }
  const reasons = Object.fromEntries(Object.keys(input.values).map((k) => [k, input.reasons[k] ?? ""]));
  await getDb().transaction(async (tx) => {
    await tx
      .insert(fullDiskAdjustments)
      .values({ forecastDay: day, values: input.values, reasons, updatedBy: actor.id })
      .onConflictDoUpdate({ target: fullDiskAdjustments.forecastDay, set: { values: input.values, reasons, updatedBy: actor.id, updatedAt: new Date() } });
    await recordAudit({ actor: { id: actor.id, email: actor.email }, action: "full_disk.adjusted", targetType: "forecast_day", targetId: day, details: { values: input.values, reasons } }, tx);
  });
  return getFullDisk(day);
}
