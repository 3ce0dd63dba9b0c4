// Benchmark of POST /api/guidance on the built server: p50 and p95 latency over sequential calls.
import { pathToFileURL } from "node:url";
import { signInOverHttp } from "../../tests/support/http-session";
import { startServer } from "../../tests/support/server";
import type { BenchFigure } from "./scoring";

const CALLS = 400;
const P95_LIMIT_MS = 50;

function percentile(sorted: number[], q: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i] ?? Number.NaN;
}

export async function benchGuidanceHttp(): Promise<BenchFigure[]> {
  const server = await startServer({ env: { FACULA_DEMO_ARCHIVE: "off" } });
  try {
    const { session } = await signInOverHttp(server.baseUrl, "ines.marlow@halden-ridge.example", "sunspot-forecast-1");
    const times: number[] = [];
    for (let i = 0; i < CALLS + 20; i++) {
      const body = {
        region: "HR-0412",
        location: `N12E${String(10 + (i % 60)).padStart(2, "0")}`,
        areaMsh: 100 + (i % 400),
        spotCount: 14,
        mcintosh: i % 2 ? "Dkc" : "Eai",
        mountWilson: "beta-gamma-delta",
        unsignedFluxMx: 2.1e22,
        pilLengthMm: 45,
        logR: 4.6,
        meanShearDeg: 38,
        flares24h: { C: 3, M: i % 3, X: 0 },
      };
      const t0 = performance.now();
      const res = await session.fetch("/api/guidance", { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) });
      await res.arrayBuffer();
      if (res.status !== 200) throw new Error(`guidance answered ${res.status}`);
      if (i >= 20) times.push(performance.now() - t0); // the first calls warm the server up
    }
    times.sort((a, b) => a - b);
    return [
      { name: `POST /api/guidance p50 (${CALLS} calls)`, value: round(percentile(times, 0.5)), unit: "ms" },
      { name: `POST /api/guidance p95 (${CALLS} calls)`, value: round(percentile(times, 0.95)), unit: "ms", limit: P95_LIMIT_MS },
    ];
  } finally {
    await server.stop();
  }
}

const round = (v: number) => Math.round(v * 10) / 10;

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  for (const f of await benchGuidanceHttp()) console.log(`${f.name}: ${f.value} ${f.unit}${f.limit ? ` (limit ${f.limit})` : ""}`);
}
