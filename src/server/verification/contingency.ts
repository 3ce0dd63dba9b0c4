// Scores of a 2×2 contingency table of yes/no warnings against observed events.

import {
  REASON_EMPTY,
  REASON_NO_EVENTS,
  divideScore,
  undefinedScore,
  type ScoreValue,
} from "./score-value";

export interface ContingencyTable {
  hits: number;
  falseAlarms: number;
  misses: number;
  correctNegatives: number;
}

export interface ContingencyScores {
  pod: ScoreValue;
  far: ScoreValue;
  pofd: ScoreValue;
  csi: ScoreValue;
  bias: ScoreValue;
  pc: ScoreValue;
  tss: ScoreValue;
  hss: ScoreValue;
  gss: ScoreValue;
  apss: ScoreValue;
}

const REASON_NO_NON_EVENTS = "no observed non-events in the sample";
const REASON_NO_VARIATION = "forecasts and observations do not vary across the table";

function assertCount(name: string, value: number): void {
  if (!Number.isInteger(value) || value < 0) {
    throw new Error(`Contingency count ${name} must be a whole number ≥ 0; got ${String(value)}`);
  }
}

/**
 * With a = hits, b = false alarms, c = misses, d = correct negatives, n = a + b + c + d
 * (Wilks, Statistical Methods in the Atmospheric Sciences, ch. forecast verification, 2×2 tables):
 * POD = a/(a+c); FAR (false alarm ratio) = b/(a+b); POFD = b/(b+d); CSI = a/(a+b+c);
 * bias = (a+b)/(a+c); PC = (a+d)/n; TSS (Peirce, Hanssen–Kuipers) = POD − POFD
 * = (ad − bc)/((a+c)(b+d)); HSS = 2(ad − bc)/((a+c)(c+d) + (a+b)(b+d));
 * GSS (equitable threat score) = (a − aᵣ)/(a + b + c − aᵣ) with aᵣ = (a+b)(a+c)/n.
 * APSS (Appleman 1960) is PC measured against always forecasting the more common outcome:
 * (PC − PCᵣ)/(1 − PCᵣ) with PCᵣ = max(a+c, b+d)/n, which reduces to (a − b)/(a + c) when events
 * are the minority and (d − c)/(b + d) otherwise (form as in Woodcock 1976, Mon. Wea. Rev. 104,
 * 1209, and Barnes et al. 2016, ApJ 829, 89 — from memory; the reduction is derived here).
 */
export function contingencyScores(table: ContingencyTable): ContingencyScores {
  const { hits: a, falseAlarms: b, misses: c, correctNegatives: d } = table;
  assertCount("hits", a);
  assertCount("falseAlarms", b);
  assertCount("misses", c);
  assertCount("correctNegatives", d);
  const n = a + b + c + d;
  const observedYes = a + c;
  const observedNo = b + d;
  const forecastYes = a + b;
  // GSS multiplied through by n keeps numerator and denominator in exact integer arithmetic.
  const gssNumerator = a * n - forecastYes * observedYes;
  const gssDenominator = (a + b + c) * n - forecastYes * observedYes;
  const tss =
    observedYes === 0
      ? undefinedScore(REASON_NO_EVENTS)
      : divideScore(a * d - b * c, observedYes * observedNo, REASON_NO_NON_EVENTS);
  const hssDenominator = observedYes * (c + d) + forecastYes * observedNo;
  let apss: ScoreValue;
  if (n === 0) apss = undefinedScore(REASON_EMPTY);
  else if (observedYes < observedNo) apss = divideScore(a - b, observedYes, REASON_NO_EVENTS);
  else apss = divideScore(d - c, observedNo, REASON_NO_NON_EVENTS);
  return {
    pod: divideScore(a, observedYes, REASON_NO_EVENTS),
    far: divideScore(b, forecastYes, "no warnings were issued (no hits or false alarms)"),
    pofd: divideScore(b, observedNo, REASON_NO_NON_EVENTS),
    csi: divideScore(a, a + b + c, "no events were observed or forecast"),
    bias: divideScore(forecastYes, observedYes, REASON_NO_EVENTS),
    pc: divideScore(a + d, n, REASON_EMPTY),
    tss,
    hss:
      n === 0
        ? undefinedScore(REASON_EMPTY)
        : divideScore(2 * (a * d - b * c), hssDenominator, REASON_NO_VARIATION),
    gss:
      n === 0
        ? undefinedScore(REASON_EMPTY)
        : divideScore(gssNumerator, gssDenominator, REASON_NO_VARIATION),
    apss,
  };
}
