// The files a verifier uploads in the browser test (demo — invented for the scenario), and the
// scores worked out from them independently of the desk.
import fs from "node:fs";
import path from "node:path";

// Demo data — invented for the scenario. Sixty days of full-disk M+ 24 h forecasts issued at
// 00:00 UTC; an M flare at 12:00 UTC on every fourth day (and a C flare on the others, which
// counts for nothing at M+). Series A leans the right way, series B says 30 % every day.
export const DAYS = 60;
const START = Date.UTC(2031, 2, 1);
export const isFlareDay = (d: number) => d % 4 === 0;
export const pA = (d: number) => (isFlareDay(d) ? 0.55 + (d % 3) * 0.1 : 0.1 + (d % 5) * 0.04);
export const pB = () => 0.3;
const iso = (ms: number) => `${new Date(ms).toISOString().slice(0, 16)}Z`;

export function writeFiles(dir: string) {
  const series = (p: (d: number) => number) =>
    [
      "issue time,level,window,probability",
      ...Array.from(
        { length: DAYS },
        (_, d) => `${iso(START + d * 86_400_000)},M+,24,${p(d).toFixed(2)}`,
      ),
    ].join("\n");
  const events = [
    "start,peak,end,class,region",
    ...Array.from({ length: DAYS }, (_, d) => {
      const peak = START + d * 86_400_000 + 12 * 3_600_000;
      return `${iso(peak - 600_000)},${iso(peak)},${iso(peak + 1_200_000)},${isFlareDay(d) ? "M2.4" : "C3.1"},HR-05${String(d % 10).padStart(2, "0")}`;
    }),
  ].join("\n");
  const bad = [
    "start,peak,end,class",
    "2031-03-02T06:00Z,2031-03-02T06:10Z,2031-03-02T06:20Z,Q1.0",
  ].join("\n");
  const files = {
    a: path.join(dir, "partner.csv"),
    b: path.join(dir, "flat.csv"),
    events: path.join(dir, "events.csv"),
    bad: path.join(dir, "bad.csv"),
  };
  fs.writeFileSync(files.a, series(pA));
  fs.writeFileSync(files.b, series(pB));
  fs.writeFileSync(files.events, events);
  fs.writeFileSync(files.bad, bad);
  return files;
}

/** The Brier score worked out here from the same days, independently of the desk (Brier 1950). */
export const brierOf = (p: (d: number) => number) =>
  Array.from({ length: DAYS }, (_, d) => (p(d) - (isFlareDay(d) ? 1 : 0)) ** 2).reduce(
    (s, v) => s + v,
    0,
  ) / DAYS;
