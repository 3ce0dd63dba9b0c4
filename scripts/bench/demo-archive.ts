// Benchmark of the demo archive: generation alone, then a full load into a fresh in-memory PGlite.

import { pathToFileURL } from "node:url";
import { closeDatabase, getDb, openDatabase } from "../../src/db/client";
import { generateDemoArchive } from "../../src/server/demo/archive/generate";
import {
  DEMO_ARCHIVE_DAYS,
  DEMO_ARCHIVE_SEED,
  loadDemoArchive,
} from "../../src/server/demo/archive/load";
import { seedDemoOffice } from "../../src/server/demo/seed";

export interface BenchFigure {
  name: string;
  value: number;
  unit: string;
  limit?: number;
}

const LOAD_LIMIT_MS = 15_000;

export async function benchDemoArchive(): Promise<BenchFigure[]> {
  const genStart = performance.now();
  const archive = generateDemoArchive({
    seed: DEMO_ARCHIVE_SEED,
    startDay: "2024-01-01",
    days: DEMO_ARCHIVE_DAYS,
  });
  const generateMs = Math.round(performance.now() - genStart);
  await openDatabase({ location: "memory" });
  try {
    await seedDemoOffice();
    // CPU time beside wall time: PGlite runs in this process, so CPU time is the machine-independent
    // share of the load when other work competes for the two cores.
    const cpuStart = process.cpuUsage();
    const result = await loadDemoArchive(getDb(), { endDay: "2026-01-01" });
    const cpu = process.cpuUsage(cpuStart);
    if (!result.loaded) throw new Error(`the archive was not loaded: ${result.reason}`);
    const c = result.counts;
    const rows = c.regions + c.assessments + c.guidance + c.flareEvents + c.forecastRecords;
    return [
      {
        name: `demo archive: generate ${DEMO_ARCHIVE_DAYS} days (${archive.regionDays.length.toLocaleString("en")} region-days)`,
        value: generateMs,
        unit: "ms",
      },
      {
        name: `demo archive: generate + load into fresh in-memory PGlite (${rows.toLocaleString("en")} rows: ${c.assessments} assessments, ${c.guidance} guidance, ${c.flareEvents} flares, ${c.forecastRecords} forecast records)`,
        value: result.elapsedMs,
        unit: "ms",
        limit: LOAD_LIMIT_MS,
      },
      {
        name: "demo archive: CPU time of the same load (user + system)",
        value: Math.round((cpu.user + cpu.system) / 1000),
        unit: "ms",
      },
    ];
  } finally {
    await closeDatabase();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const figure of await benchDemoArchive()) {
    const limit = figure.limit === undefined ? "" : ` (limit ${figure.limit} ${figure.unit})`;
    console.log(`${figure.name}: ${figure.value} ${figure.unit}${limit}`);
  }
}
