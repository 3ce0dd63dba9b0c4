// Demo McIntosh rate table — demo, invented for the scenario; not a published table.

import {
  MCINTOSH_CLASSES,
  ZURICH_CLASSES,
  zurichClassOf,
  type DistributionClass,
  type McIntoshClass,
  type PenumbraClass,
  type ZurichClass,
} from "@/lib/domain/mcintosh";
import type { ClassRates } from "./poisson";

// Invented factors: C-class rate = Zurich × penumbra × distribution factor, so rates grow with
// group size, penumbra and compactness. M and X rates grow faster than C (power laws below), as
// complex groups make a larger share of big flares. None of these numbers comes from data.
const ZURICH_FACTOR: Record<ZurichClass, number> = {
  A: 0.02,
  B: 0.04,
  H: 0.06,
  C: 0.1,
  D: 0.25,
  E: 0.4,
  F: 0.5,
};
const PENUMBRA_FACTOR: Record<PenumbraClass, number> = {
  x: 1,
  r: 0.8,
  s: 1,
  a: 1.5,
  h: 1.6,
  k: 2.4,
};
const DISTRIBUTION_FACTOR: Record<DistributionClass, number> = { x: 1, o: 0.8, i: 1.5, c: 2.6 };

function roundRate(rate: number): number {
  return Number(rate.toPrecision(3));
}

function inventRates(cls: McIntoshClass): ClassRates {
  const [z, p, c] = [cls.charAt(0), cls.charAt(1), cls.charAt(2)] as [
    ZurichClass,
    PenumbraClass,
    DistributionClass,
  ];
  const rateC = ZURICH_FACTOR[z] * PENUMBRA_FACTOR[p] * DISTRIBUTION_FACTOR[c];
  return {
    C: roundRate(rateC),
    M: roundRate(0.1 * rateC ** 1.3),
    X: roundRate(0.015 * rateC ** 1.5),
  };
}

/** Demo rates (flares/day of exclusive C, M and X flares) for all 60 classes. */
export const DEMO_MCINTOSH_RATES: Readonly<Record<McIntoshClass, ClassRates>> = Object.fromEntries(
  MCINTOSH_CLASSES.map((cls) => [cls, inventRates(cls)]),
) as Record<McIntoshClass, ClassRates>;

function averageRates(classes: readonly McIntoshClass[]): ClassRates {
  const sum = (pick: (r: ClassRates) => number) =>
    roundRate(classes.reduce((s, cls) => s + pick(DEMO_MCINTOSH_RATES[cls]), 0) / classes.length);
  return { C: sum((r) => r.C), M: sum((r) => r.M), X: sum((r) => r.X) };
}

/** Demo Zurich-class fallback: the mean of that Zurich class's demo rows. */
export const DEMO_ZURICH_RATES: Readonly<Record<ZurichClass, ClassRates>> = Object.fromEntries(
  ZURICH_CLASSES.map((z) => [
    z,
    averageRates(MCINTOSH_CLASSES.filter((cls) => zurichClassOf(cls) === z)),
  ]),
) as Record<ZurichClass, ClassRates>;
