// npm run bench: prints every performance figure the desk promises, with its limit and a verdict.
// Figures are measured, never asserted in tests. Needs a build (npm run build) for the HTTP part.
import fs from "node:fs";
import { benchScoring, type BenchFigure } from "./bench/scoring";
import { benchVerification } from "./bench/verification";
import { benchGuidanceHttp } from "./bench/guidance-http";

type Bench = { name: string; run: () => Promise<BenchFigure[]> };

const benches: Bench[] = [
  { name: "scoring engine", run: benchScoring },
  { name: "verification report", run: benchVerification },
  { name: "guidance endpoint", run: benchGuidanceHttp },
];

async function loadOptional(): Promise<void> {
  if (fs.existsSync(new URL("./bench/demo-archive.ts", import.meta.url))) {
    const mod = (await import("./bench/demo-archive")) as Record<string, unknown>;
    const run = Object.values(mod).find((v) => typeof v === "function" && /^bench/.test((v as { name: string }).name));
    if (run) benches.push({ name: "demo archive", run: run as () => Promise<BenchFigure[]> });
  }
  if (fs.existsSync(new URL("./bench/dissemination.ts", import.meta.url))) {
    const mod = (await import("./bench/dissemination")) as { benchDissemination: () => Promise<BenchFigure[]> };
    benches.push({ name: "dissemination", run: mod.benchDissemination });
  }
}

async function main(): Promise<void> {
  await loadOptional();
  const rows: string[] = [];
  for (const bench of benches) {
    console.log(`\n== ${bench.name}`);
    try {
      for (const f of await bench.run()) {
        const verdict = f.limit === undefined ? "" : f.value <= f.limit ? "  ✓ within limit" : "  ✗ over limit";
        const line = `${f.name}: ${f.value} ${f.unit}${f.limit === undefined ? "" : ` (limit ${f.limit} ${f.unit})`}${verdict}`;
        console.log(line);
        rows.push(line);
      }
    } catch (err) {
      console.log(`${bench.name} failed: ${(err as Error).message}`);
    }
  }
  console.log(`\n== summary\n${rows.join("\n")}`);
}

await main();
