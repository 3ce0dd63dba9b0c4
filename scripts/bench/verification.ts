// Benchmark of the verification scores on 66,000 synthetic forecast pairs, with scikit-learn beside.

import { execFile } from "node:child_process";
import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { promisify } from "node:util";
import {
  bootstrapInterval,
  brierScore,
  brierSkillScore,
  createMulberry32,
  murphyDecomposition,
  reliabilityCurve,
  rocCurve,
  thresholdSweep,
} from "../../src/server/verification/scores";

export interface BenchFigure {
  name: string;
  value: number;
  unit: string;
  limit?: number;
}

const PAIR_COUNT = 66_000;
const REPORT_LIMIT_MS = 1_000;
const BOOTSTRAP_RESAMPLES = 1_000;
const BOOTSTRAP_LIMIT_MS = 5_000;
const PYTHON = "/usr/bin/python3";

/** Skewed, continuous forecasts (most near 0, as for M+ flares) with outcomes drawn from them. */
function buildSyntheticPairs(count: number, seed: number): { p: Float64Array; o: Uint8Array } {
  const random = createMulberry32(seed);
  const p = new Float64Array(count);
  const o = new Uint8Array(count);
  for (let i = 0; i < count; i++) {
    const chance = random() ** 3;
    p[i] = chance;
    o[i] = random() < chance ? 1 : 0;
  }
  return { p, o };
}

/** Median of a few timed runs after one warm-up, in milliseconds. */
function timeMedianMs(run: () => void, repeats = 3): number {
  run();
  const times = Array.from({ length: repeats }, () => {
    const start = performance.now();
    run();
    return performance.now() - start;
  }).sort((a, b) => a - b);
  return Math.round((times[Math.floor(repeats / 2)] as number) * 10) / 10;
}

function runFullReport(p: Float64Array, o: Uint8Array): void {
  brierScore(p, o);
  brierSkillScore(p, o);
  murphyDecomposition(p, o);
  murphyDecomposition(p, o, 10);
  reliabilityCurve(p, o, 10);
  rocCurve(p, o);
  thresholdSweep(p, o);
}

// Times only the computations, after loading the data and one warm-up call (as the TS side does).
const SKLEARN_SNIPPET = `
import json, sys, time
import numpy as np
from sklearn.metrics import brier_score_loss, roc_auc_score, roc_curve
data = json.load(open(sys.argv[1]))
p = np.asarray(data["p"], dtype=float); o = np.asarray(data["o"], dtype=int)
def run():
    brier_score_loss(o, p); roc_curve(o, p, drop_intermediate=False); roc_auc_score(o, p)
run()
times = []
for _ in range(3):
    t0 = time.perf_counter(); run(); times.append((time.perf_counter() - t0) * 1000)
import sklearn
print(json.dumps({"ms": sorted(times)[1], "version": sklearn.__version__}))
`;

async function timeSklearn(p: Float64Array, o: Uint8Array): Promise<BenchFigure> {
  if (!existsSync(PYTHON)) {
    return {
      name: `scikit-learn reference: unavailable (${PYTHON} not found)`,
      value: 0,
      unit: "n/a",
    };
  }
  const dir = mkdtempSync(join(tmpdir(), "facula-bench-"));
  try {
    const file = join(dir, "pairs.json");
    writeFileSync(file, JSON.stringify({ p: Array.from(p), o: Array.from(o) }));
    const { stdout } = await promisify(execFile)(PYTHON, ["-c", SKLEARN_SNIPPET, file], {
      timeout: 120_000,
    });
    const result = JSON.parse(stdout) as { ms: number; version: string };
    return {
      name: `scikit-learn ${result.version}: brier_score_loss + roc_curve + roc_auc_score, ${PAIR_COUNT.toLocaleString("en")} pairs`,
      value: Math.round(result.ms * 10) / 10,
      unit: "ms",
    };
  } catch (error) {
    const reason = error instanceof Error ? error.message.split("\n")[0] : String(error);
    return { name: `scikit-learn reference: unavailable (${reason})`, value: 0, unit: "n/a" };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export async function benchVerification(): Promise<BenchFigure[]> {
  const { p, o } = buildSyntheticPairs(PAIR_COUNT, 1884);
  const pairs = PAIR_COUNT.toLocaleString("en");
  const reportMs = timeMedianMs(() => runFullReport(p, o));
  const brierRocMs = timeMedianMs(() => {
    brierScore(p, o);
    rocCurve(p, o);
  });
  const bootstrapStart = performance.now();
  const interval = bootstrapInterval(p, o, brierScore, {
    resamples: BOOTSTRAP_RESAMPLES,
    seed: 7,
    level: 0.95,
  });
  const bootstrapMs = Math.round((performance.now() - bootstrapStart) * 10) / 10;
  if (interval.lower.value === null)
    throw new Error(`bootstrap gave no interval: ${interval.lower.reason}`);
  return [
    {
      name: `verification: full report (Brier, BSS, decompositions, reliability, ROC, 99-threshold sweep), ${pairs} pairs`,
      value: reportMs,
      unit: "ms",
      limit: REPORT_LIMIT_MS,
    },
    {
      name: `verification: bootstrap of the Brier score, ${BOOTSTRAP_RESAMPLES.toLocaleString("en")} resamples of ${pairs} pairs`,
      value: bootstrapMs,
      unit: "ms",
      limit: BOOTSTRAP_LIMIT_MS,
    },
    {
      name: `verification: Brier + ROC curve and area, ${pairs} pairs`,
      value: brierRocMs,
      unit: "ms",
    },
    await timeSklearn(p, o),
  ];
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const figure of await benchVerification()) {
    const limit = figure.limit === undefined ? "" : ` (limit ${figure.limit} ${figure.unit})`;
    console.log(`${figure.name}: ${figure.value} ${figure.unit}${limit}`);
  }
}
