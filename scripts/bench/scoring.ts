// Benchmark of the scoring engine: 10,000 synthetic regions through every demo model.

import { pathToFileURL } from "node:url";
import type { AssessmentInput } from "../../src/lib/domain/assessment-input";
import { MCINTOSH_CLASSES } from "../../src/lib/domain/mcintosh";
import { MOUNT_WILSON_CLASSES } from "../../src/lib/domain/mount-wilson";
import { DEMO_MODELS } from "../../src/server/scoring/demo-models";
import { compileModel, type CompiledModel } from "../../src/server/scoring/models";

export interface BenchFigure {
  name: string;
  value: number;
  unit: string;
  limit?: number;
}

const REGION_COUNT = 10_000;
const LIMIT_MS = 200;

// mulberry32: a small seeded generator, so every run scores the same synthetic regions.
function createRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function pick<T>(list: readonly T[], random: () => number): T {
  return list[Math.floor(random() * list.length)] as T;
}

function buildSyntheticRegions(count: number, random: () => number): AssessmentInput[] {
  const pad = (n: number) => String(n).padStart(2, "0");
  return Array.from({ length: count }, (_, i) => ({
    region: `BENCH-${i}`,
    location: `${random() < 0.5 ? "N" : "S"}${pad(Math.floor(random() * 40))}${random() < 0.5 ? "E" : "W"}${pad(Math.floor(random() * 90))}`,
    areaMsh: Math.round(random() * 1500),
    spotCount: 1 + Math.floor(random() * 60),
    mcintosh: pick(MCINTOSH_CLASSES, random),
    mountWilson: pick(MOUNT_WILSON_CLASSES, random),
    unsignedFluxMx: 10 ** (20 + random() * 3),
    pilLengthMm: random() * 200,
    logR: random() * 5.5,
    meanShearDeg: random() * 90,
    freeEnergyProxy: 10 ** (29 + random() * 4),
    flares24h: {
      C: Math.floor(random() * 5),
      M: Math.floor(random() * 2),
      X: random() < 0.02 ? 1 : 0,
    },
  }));
}

/** Scores every region with every model; returns the elapsed milliseconds. */
function timeScoring(
  regions: readonly AssessmentInput[],
  models: readonly CompiledModel[],
): number {
  let scored = 0;
  const start = performance.now();
  for (const region of regions) {
    for (const model of models) {
      if (model.score(region).probabilities) scored++;
    }
  }
  const elapsedMs = performance.now() - start;
  // Every synthetic region is complete, so a missing score means the engine broke.
  if (scored !== regions.length * models.length) {
    throw new Error(
      `only ${scored} of ${regions.length * models.length} scorings gave probabilities`,
    );
  }
  return elapsedMs;
}

function roundMs(ms: number): number {
  return Math.round(ms * 10) / 10;
}

/**
 * The first pass runs on cold (unoptimised) code and is reported as it is; the limit applies to
 * a second pass over the same regions, the steady state a running server is in.
 */
export async function benchScoring(): Promise<BenchFigure[]> {
  const regions = buildSyntheticRegions(REGION_COUNT, createRandom(412));
  const compileStart = performance.now();
  const models = DEMO_MODELS.map(compileModel);
  const compileMs = performance.now() - compileStart;
  const coldMs = timeScoring(regions, models);
  const warmMs = timeScoring(regions, models);
  const label = `${REGION_COUNT.toLocaleString("en")} regions × ${models.length} demo models`;
  return [
    { name: `scoring: ${label}`, value: roundMs(warmMs), unit: "ms", limit: LIMIT_MS },
    { name: `scoring: ${label}, first (cold) pass`, value: roundMs(coldMs), unit: "ms" },
    { name: "scoring: compile demo models", value: roundMs(compileMs), unit: "ms" },
  ];
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const figure of await benchScoring()) {
    const limit = figure.limit === undefined ? "" : ` (limit ${figure.limit} ${figure.unit})`;
    console.log(`${figure.name}: ${figure.value} ${figure.unit}${limit}`);
  }
}
