// The hand-checkable report sample (demo — invented): four full-disk M+ 24 h forecasts a day apart,
// worked by hand in tests/unit/verification-desk/report-scores.test.ts (p = 0.9, 0.6, 0.3, 0.1 with
// outcomes 1, 0, 1, 0 → BS 0.2175, BSS 0.13), a constant 0.5 model beside them, and region rows.
import { getDb } from "@/db/client";
import { eventLists, flareEvents, forecastRecords } from "@/db/schema";

const HOUR = 3_600_000;
export const MODEL = "model:mcintosh-poisson@demo-1";
export const ISSUES = [
  "2031-07-01T06:00Z",
  "2031-07-02T06:00Z",
  "2031-07-03T06:00Z",
  "2031-07-04T06:00Z",
].map((t) => Date.parse(t));
const P = [0.9, 0.6, 0.3, 0.1];
const REF = [0.5, 0.5, 0.5, 0.5];

export function reportQuery(extra: Record<string, string> = {}): string {
  return new URLSearchParams({
    source: "forecaster",
    reference: MODEL,
    level: "M+",
    window: "24",
    scope: "full-disk",
    threshold: "0.5",
    ...extra,
  }).toString();
}

const flare = (
  listId: number,
  peakMs: number,
  originalClass: string,
  peakFluxTrue: number,
  regionNumber: string | null,
) => ({
  listId,
  startTime: new Date(peakMs - HOUR),
  peakTime: new Date(peakMs),
  endTime: new Date(peakMs + HOUR),
  originalClass,
  peakFluxTrue,
  regionNumber,
});

export async function insertReportSample(): Promise<void> {
  const db = getDb();
  const base = { level: "M+", windowHours: 24 };
  const rows = ISSUES.flatMap((t, i) => [
    {
      ...base,
      source: "forecaster",
      issueTime: new Date(t),
      regionNumber: null,
      probability: P[i]!,
    },
    { ...base, source: MODEL, issueTime: new Date(t), regionNumber: null, probability: REF[i]! },
    {
      ...base,
      source: "forecaster",
      issueTime: new Date(t),
      regionNumber: "HR-0700",
      probability: 0.2,
    },
  ]);
  await db.insert(forecastRecords).values(rows);
  const [list] = await db
    .insert(eventLists)
    .values({ name: "Report test list", convention: "true" })
    .returning();
  // M1.2 five hours after issue 1 (region HR-0701), M3 at the very start of issue 3's window.
  // A C8 after issue 2 and an M1.1 exactly 24 h after issue 4 (outside its window) count for nothing.
  await db
    .insert(flareEvents)
    .values([
      flare(list!.id, ISSUES[0]! + 5 * HOUR, "M1.2", 1.2e-5, "HR-0701"),
      flare(list!.id, ISSUES[1]! + 2 * HOUR, "C8.0", 8e-6, "HR-0700"),
      flare(list!.id, ISSUES[2]!, "M3.0", 3e-5, "HR-0700"),
      flare(list!.id, ISSUES[3]! + 24 * HOUR, "M1.1", 1.1e-5, null),
    ]);
}
