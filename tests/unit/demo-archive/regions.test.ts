import { describe, expect, it } from "vitest";
import { isBeyondLimbThreshold, parseLocation } from "@/lib/domain/location";
import { isValidMcIntosh, MCINTOSH_CLASSES } from "@/lib/domain/mcintosh";
import { hasDelta, isValidMountWilson } from "@/lib/domain/mount-wilson";
import { classifyMcIntosh, classifyMountWilson } from "@/server/demo/archive/classification";
import { computeSmoothArea, SYNODIC_DEG_PER_DAY } from "@/server/demo/archive/evolution";
import type { SpotGroup } from "@/server/demo/archive/groups";
import { getArchive } from "./archive-fixture";

const archive = getArchive();
const byRegion = new Map<string, typeof archive.regionDays>();
for (const r of archive.regionDays)
  byRegion.set(r.regionNumber, [...(byRegion.get(r.regionNumber) ?? []), r]);

function pearson(x: number[], y: number[]): number {
  const mean = (v: number[]) => v.reduce((s, a) => s + a, 0) / v.length;
  const [mx, my] = [mean(x), mean(y)];
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  x.forEach((xi, i) => {
    const dx = xi - mx;
    const dy = (y[i] as number) - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  });
  return sxy / Math.sqrt(sxx * syy);
}

describe("active regions of the demo archive", () => {
  it("keep about 4–8 regions on the disk per day (brief), never an impossible crowd", () => {
    const perDay = archive.dayRecords.map((d) => d.regionNumbers.length);
    const mean = perDay.reduce((s, n) => s + n, 0) / perDay.length;
    expect(mean).toBeGreaterThanOrEqual(4);
    expect(mean).toBeLessThanOrEqual(8);
    expect(Math.max(...perDay)).toBeLessThan(25);
  });

  it("use only valid McIntosh classes (McIntosh 1990), and a wide range of them", () => {
    const classes = new Set(archive.regionDays.map((r) => r.input.mcintosh));
    for (const cls of classes) expect(isValidMcIntosh(cls), String(cls)).toBe(true);
    expect(classes.size).toBeGreaterThanOrEqual(25);
    // The check can fail: it rejects a combination McIntosh rules out.
    expect(isValidMcIntosh("Drc")).toBe(false);
    expect(MCINTOSH_CLASSES).toHaveLength(60);
  });

  it("classify by the documented area thresholds and phase (docs/demo-archive.md)", () => {
    const look = {
      areaMsh: 5,
      peakAreaMsh: 500,
      isDecaying: false,
      complexity: 0.1,
      isAsymmetric: false,
    };
    expect(classifyMcIntosh(look)).toBe("Axx");
    expect(classifyMcIntosh({ ...look, areaMsh: 15 })).toBe("Bxo");
    expect(classifyMcIntosh({ ...look, areaMsh: 15, complexity: 0.5 })).toBe("Bxi");
    expect(classifyMcIntosh({ ...look, areaMsh: 50 })).toBe("Cso");
    expect(classifyMcIntosh({ ...look, areaMsh: 50, isAsymmetric: true })).toBe("Cao");
    expect(classifyMcIntosh({ ...look, areaMsh: 400, complexity: 0.8, isAsymmetric: true })).toBe(
      "Ekc",
    );
    expect(classifyMcIntosh({ ...look, areaMsh: 900, complexity: 0.4 })).toBe("Fhi");
    // The same 100 MSH is a D group while growing and the leading spot alone (H) late in decay.
    expect(classifyMcIntosh({ ...look, areaMsh: 100 })).toBe("Dso");
    expect(classifyMcIntosh({ ...look, areaMsh: 100, isDecaying: true })).toBe("Hsx");
  });

  it("use only valid Mount Wilson classes, with delta spots only in large complex groups", () => {
    for (const r of archive.regionDays) expect(isValidMountWilson(r.input.mountWilson)).toBe(true);
    const deltas = archive.regionDays.filter((r) => hasDelta(r.input.mountWilson as never));
    expect(deltas.length).toBeGreaterThan(0);
    expect(deltas.every((r) => (r.input.areaMsh ?? 0) >= 100)).toBe(true);
    const unipolar = archive.regionDays.filter((r) => /^[AH]/.test(r.input.mcintosh ?? ""));
    expect(unipolar.every((r) => r.input.mountWilson === "alpha")).toBe(true);
    const look = {
      areaMsh: 400,
      peakAreaMsh: 900,
      isDecaying: false,
      complexity: 0.8,
      isAsymmetric: true,
    };
    expect(classifyMountWilson("E", look)).toBe("beta-gamma-delta");
    expect(classifyMountWilson("E", { ...look, complexity: 0.1 })).toBe("beta");
  });

  it("rotate about 13.2° a day at fixed latitude, within E90–W90", () => {
    const steps: number[] = [];
    for (const days of byRegion.values()) {
      for (let i = 1; i < days.length; i++) {
        const [a, b] = [days[i - 1]!, days[i]!];
        // Positions are whole degrees, so a 13.2° step shows as 13° or 14°.
        expect([13, 14]).toContain(b.longitudeDeg - a.longitudeDeg);
        expect(b.latitudeDeg).toBe(a.latitudeDeg);
        steps.push(b.longitudeDeg - a.longitudeDeg);
      }
    }
    expect(steps.length).toBeGreaterThan(2000);
    const meanStep = steps.reduce((s, x) => s + x, 0) / steps.length;
    expect(Math.abs(meanStep - SYNODIC_DEG_PER_DAY)).toBeLessThan(0.05);
    for (const r of archive.regionDays) {
      expect(Math.abs(r.longitudeDeg)).toBeLessThanOrEqual(90);
      expect(Math.abs(r.latitudeDeg)).toBeGreaterThanOrEqual(2);
      expect(Math.abs(r.latitudeDeg)).toBeLessThanOrEqual(40);
    }
    const firstLongitudes = [...byRegion.values()].map((d) => d[0]!.longitudeDeg);
    const fromEastLimb = firstLongitudes.filter((lon) => lon <= -77).length;
    // Most regions rotate on at the east limb; the rest emerge on the disk.
    expect(fromEastLimb / firstLongitudes.length).toBeGreaterThan(0.35);
    expect(fromEastLimb).toBeLessThan(firstLongitudes.length);
  });

  it("flag, but keep the data of, regions beyond 60° from disk centre", () => {
    for (const r of archive.regionDays) {
      const parsed = parseLocation(r.input.location);
      if (!parsed.ok) throw new Error(parsed.error);
      expect(r.isLimbFlagged).toBe(isBeyondLimbThreshold(parsed.location, 60, 0));
    }
    const flagged = archive.regionDays.filter((r) => r.isLimbFlagged);
    expect(flagged.length).toBeGreaterThan(0);
    expect(flagged.length).toBeLessThan(archive.regionDays.length);
    expect(flagged.filter((r) => r.input.unsignedFluxMx !== null).length).toBeGreaterThan(
      flagged.length / 2,
    );
  });

  it("grow, then decay, in their smooth evolution", () => {
    const group: SpotGroup = {
      id: 0,
      emergedAt: 10,
      emergenceLongitudeDeg: -60,
      latitudeDeg: 12,
      peakAreaMsh: 400,
      riseDays: 4,
      lifetimeDays: 40,
      complexity: 0.5,
      isAsymmetric: false,
    };
    expect(computeSmoothArea(group, 9.9)).toBe(0);
    expect(computeSmoothArea(group, 12)).toBeCloseTo(200, 9);
    expect(computeSmoothArea(group, 14)).toBeCloseTo(400, 9);
    expect(computeSmoothArea(group, 32)).toBeCloseTo(200, 9); // halfway through the 36-day decay
    expect(computeSmoothArea(group, 50.1)).toBe(0);
  });

  it("change Zurich class gradually from day to day", () => {
    const rank: Record<string, number> = { A: 0, B: 1, C: 2, H: 2, D: 3, E: 4, F: 5 };
    let jumps = 0;
    let changes = 0;
    for (const days of byRegion.values()) {
      for (let i = 1; i < days.length; i++) {
        const d = Math.abs(
          rank[days[i]!.input.mcintosh![0]!]! - rank[days[i - 1]!.input.mcintosh![0]!]!,
        );
        if (d > 0) changes++;
        if (d > 2) jumps++;
      }
    }
    expect(changes).toBeGreaterThan(100);
    expect(jumps / changes).toBeLessThan(0.02);
  });

  it("carry magnetic metrics that grow with size and complexity", () => {
    const rows = archive.regionDays;
    const logArea = rows.map((r) => Math.log10(r.input.areaMsh!));
    expect(
      pearson(
        logArea,
        rows.map((r) => Math.log10(r.latent.unsignedFluxMx)),
      ),
    ).toBeGreaterThan(0.8);
    expect(
      pearson(
        logArea,
        rows.map((r) => r.latent.logR),
      ),
    ).toBeGreaterThan(0.6);
    expect(
      pearson(
        logArea,
        rows.map((r) => Math.log10(r.latent.pilLengthMm + 1)),
      ),
    ).toBeGreaterThan(0.6);
    const meanShear = (pick: (cls: string) => boolean) => {
      const s = rows.filter((r) => pick(r.input.mountWilson!)).map((r) => r.latent.meanShearDeg);
      return s.reduce((a, b) => a + b, 0) / s.length;
    };
    expect(meanShear((c) => c.endsWith("delta"))).toBeGreaterThan(
      meanShear((c) => c === "alpha") + 10,
    );
    // Not collinear: the flux–log R correlation leaves room to tell their effects apart.
    expect(
      pearson(
        rows.map((r) => Math.log10(r.latent.unsignedFluxMx)),
        rows.map((r) => r.latent.logR),
      ),
    ).toBeLessThan(0.95);
  });

  it("leave some measurements out, never the generating values", () => {
    const missing = (key: "unsignedFluxMx" | "logR" | "meanShearDeg" | "pilLengthMm") =>
      archive.regionDays.filter((r) => r.input[key] === null).length / archive.regionDays.length;
    for (const key of ["unsignedFluxMx", "logR", "meanShearDeg", "pilLengthMm"] as const) {
      expect(missing(key), key).toBeGreaterThan(0.005);
      expect(missing(key), key).toBeLessThan(0.15);
    }
    for (const r of archive.regionDays) {
      expect(Number.isFinite(r.latent.unsignedFluxMx) && Number.isFinite(r.latent.logR)).toBe(true);
      if (r.input.logR !== null) expect(r.input.logR).toBe(r.latent.logR);
    }
  });
});
