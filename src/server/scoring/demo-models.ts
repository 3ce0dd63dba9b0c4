// The demo guidance models of the Halden Ridge scenario — demo, invented; not published models.

import type { LogisticLevelParams } from "./model-params";
import type { ModelDefinition } from "./models";
import { DEMO_MCINTOSH_RATES, DEMO_ZURICH_RATES } from "./demo-rate-table";

export const DEMO_PROVENANCE = "demo — invented for the scenario; not a published table";

// Invented coefficients on log10 Φ (Mx), log R, mean shear (°) and PIL length (Mm). They give
// P(C+) ≈ 0.5, P(M+) ≈ 0.1, P(X) ≈ 0.01 in 24 h for Φ = 1e22 Mx, log R = 4, shear 40°, PIL 50 Mm.
function buildDemoLevel(
  intercept: number,
  slopes: [number, number, number, number],
): LogisticLevelParams {
  const [flux, logR, shear, pil] = slopes;
  return {
    intercept,
    predictors: [
      { input: "unsignedFluxMx", transform: "log10", coefficient: flux },
      { input: "logR", transform: "identity", coefficient: logR },
      { input: "meanShearDeg", transform: "identity", coefficient: shear },
      { input: "pilLengthMm", transform: "identity", coefficient: pil },
    ],
  };
}

export const DEMO_MODELS: readonly ModelDefinition[] = [
  {
    key: "mcintosh-poisson",
    version: "demo-1",
    kind: "mcintosh-poisson",
    name: "McIntosh-class Poisson rates",
    provenance: DEMO_PROVENANCE,
    // A correction factor below 1 stands for a table built in a more active cycle (the
    // McCloskey et al. 2018 idea); the value 0.8 is invented.
    params: { rates: DEMO_MCINTOSH_RATES, zurichRates: DEMO_ZURICH_RATES, correctionFactor: 0.8 },
    active: true,
  },
  {
    key: "logistic-magnetic",
    version: "demo-1",
    kind: "logistic",
    name: "Logistic regression on magnetic metrics",
    provenance: DEMO_PROVENANCE,
    params: {
      windowHours: 24,
      levels: {
        "C+": buildDemoLevel(-25.05, [1.0, 0.5, 0.02, 0.005]),
        "M+": buildDemoLevel(-30.1, [1.1, 0.6, 0.025, 0.006]),
        X: buildDemoLevel(-35.35, [1.2, 0.7, 0.03, 0.007]),
      },
    },
    active: true,
  },
  {
    key: "flare-history",
    version: "demo-1",
    kind: "persistence",
    name: "Flare history (persistence)",
    provenance: DEMO_PROVENANCE,
    params: { priorRatesPerDay: { C: 0.3, M: 0.03, X: 0.003 }, priorWeight: 1 },
    active: true,
  },
];
