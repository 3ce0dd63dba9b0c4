// A small seeded archive for recalibration tests: region-days with McIntosh classes and magnetic
// metrics, and flares drawn from a logistic model of those metrics (demo — invented).
import { getDb } from "@/db/client";
import { assessments, eventLists, flareEvents, regions } from "@/db/schema";
import { formatGoesClass } from "@/server/verification/goes";
import { createMulberry32 } from "@/server/verification/prng";

const DAY_MS = 86_400_000;
const CLASSES = ["Bxo", "Cso", "Dao", "Dkc", "Eki", "Fkc", "Hsx"];

/** Invented generating coefficients on log10 Φ, log R, shear and PIL length (not the demo model's). */
const TRUTH = {
  C: { intercept: -25.3, slopes: [1.0, 0.5, 0.02, 0.005] },
  M: { intercept: -29.6, slopes: [1.1, 0.6, 0.025, 0.006] },
  X: { intercept: -33.5, slopes: [1.2, 0.7, 0.03, 0.007] },
} as const;

const sigmoid = (z: number) => 1 / (1 + Math.exp(-z));

export interface GeneratedArchive {
  from: string;
  to: string;
  regionDays: number;
  flares: number;
}

/** Five regions assessed every second day from `from` for `days` days, with their flares. */
export async function insertGeneratedArchive(options: {
  from: string;
  days: number;
  seed: number;
}): Promise<GeneratedArchive> {
  const random = createMulberry32(options.seed);
  const db = getDb();
  const regionIds = await db
    .insert(regions)
    .values(Array.from({ length: 5 }, (_, i) => ({ number: `HR-${9000 + i}`, isDemo: true })))
    .returning({ id: regions.id, number: regions.number });
  const [list] = await db
    .insert(eventLists)
    .values({ name: "Generated flares (demo — invented)", convention: "true", isDemo: true })
    .returning();
  const start = Date.parse(`${options.from}T00:00:00Z`);
  const rows: (typeof assessments.$inferInsert)[] = [];
  const flares: (typeof flareEvents.$inferInsert)[] = [];
  let last = options.from;
  for (let d = 0; d < options.days; d += 2) {
    const dayMs = start + d * DAY_MS;
    const day = new Date(dayMs).toISOString().slice(0, 10);
    last = day;
    for (const region of regionIds) {
      const x = [21.5 + 1.3 * random(), 3 + 2 * random(), 15 + 55 * random(), 10 + 110 * random()];
      rows.push({
        regionId: region.id,
        forecastDay: day,
        location: "N10E10",
        latitudeDeg: 10,
        longitudeDeg: -10,
        areaMsh: 200,
        spotCount: 10,
        mcintosh: CLASSES[Math.floor(random() * CLASSES.length)]!,
        mountWilson: "beta",
        unsignedFluxMx: 10 ** x[0]!,
        logR: x[1]!,
        meanShearDeg: x[2]!,
        pilLengthMm: x[3]!,
        isDemo: true,
      });
      for (const [cls, flux] of [
        ["C", 3e-6],
        ["M", 2e-5],
        ["X", 2e-4],
      ] as const) {
        const t = TRUTH[cls];
        const z = t.intercept + t.slopes.reduce((s, b, j) => s + b * x[j]!, 0);
        if (random() >= sigmoid(z)) continue;
        const peak = dayMs + Math.floor(random() * (DAY_MS - 60_000));
        // A per-flare factor keeps peak fluxes distinct, as the (peak time, flux) key needs.
        const peakFluxTrue = flux * (1 + random());
        flares.push({
          listId: list!.id,
          startTime: new Date(peak - 600_000),
          peakTime: new Date(peak),
          endTime: new Date(peak + 600_000),
          originalClass: formatGoesClass(peakFluxTrue),
          peakFluxTrue,
          regionNumber: region.number,
          isDemo: true,
        });
      }
    }
  }
  for (let i = 0; i < rows.length; i += 500)
    await db.insert(assessments).values(rows.slice(i, i + 500));
  for (let i = 0; i < flares.length; i += 500)
    await db.insert(flareEvents).values(flares.slice(i, i + 500));
  return { from: options.from, to: last, regionDays: rows.length, flares: flares.length };
}
