// Shapes the day page: table rows, and regions of the previous day still to carry over.
import type { DayRow } from "@/lib/ui/day-table";
import type { AssessmentView } from "./assessments.db";
import { listDay } from "./assessments.db";

export function toDayRow(a: AssessmentView): DayRow {
  return {
    id: a.id,
    region: a.region,
    location: a.location,
    isLimbFlagged: a.isLimbFlagged,
    areaMsh: a.areaMsh,
    mcintosh: a.mcintosh,
    mountWilson: a.mountWilson,
    unsignedFluxMx: a.unsignedFluxMx,
    flares: `${a.flares24h.C}C ${a.flares24h.M}M ${a.flares24h.X}X`,
    guidanceC: a.blended?.["C+"]["24h"] ?? null,
    guidanceM: a.blended?.["M+"]["24h"] ?? null,
    guidanceX: a.blended?.X["24h"] ?? null,
    finalC: a.finals?.["C+"]["24h"] ?? null,
    finalM: a.finals?.["M+"]["24h"] ?? null,
    finalX: a.finals?.X["24h"] ?? null,
    reasonCount: Object.values(a.finalReasons).filter((r) => r.trim()).length,
    isDemo: a.isDemo,
  };
}

export function previousDay(day: string): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) - 86_400_000).toISOString().slice(0, 10);
}

export async function loadDay(day: string) {
  const [today, yesterday] = await Promise.all([listDay(day), listDay(previousDay(day))]);
  const assessed = new Set(today.map((a) => a.region));
  // Regions near the west limb yesterday may have rotated off; the forecaster decides.
  const toCarry = yesterday.filter((a) => !assessed.has(a.region)).map((a) => ({ region: a.region, location: a.location }));
  return { rows: today.map(toDayRow), toCarry, withFinals: today.filter((a) => a.finals).length, total: today.length };
}
