// Builds the verification cases of a report: the scored source's records, the reference's
// probability for the same case where it has one, and the observed outcome (pure).
import type { FlareLevel } from "@/lib/domain/flare-levels";
import { matchForecasts, normaliseRegion, type MatchConvention, type MatchEvent } from "./matching";
import type { RecordRow } from "./records.db";

export interface VerificationCases {
  issueTimeMs: Float64Array;
  regionNumber: (string | null)[];
  p: Float64Array;
  /** The reference's probability for the same case; NaN where it has none. */
  pRef: Float64Array;
  o: Uint8Array;
  /** Records of one source for an already-seen case, left out (the later record is kept). */
  collapsedDuplicates: number;
}

const caseKey = (r: RecordRow) => `${r.issueTimeMs}|${normaliseRegion(r.regionNumber) ?? ""}`;

function isSortedByTime(rows: readonly RecordRow[]): boolean {
  for (let i = 1; i < rows.length; i++)
    if ((rows[i] as RecordRow).issueTimeMs < (rows[i - 1] as RecordRow).issueTimeMs) return false;
  return true;
}

/**
 * A case is one issue time × region (or full disk) of the scored source, for the report's level
 * and window. Records of a source repeated for one case (a re-issued bulletin) collapse to the
 * later one so no case is counted twice; rows are expected in issue-time order (records.db) and
 * sorted here only when they are not. One pass with a key → case map, so 66,000 records cost
 * milliseconds beyond the matching.
 */
export function buildCases(
  rows: readonly RecordRow[],
  options: {
    source: string;
    reference: string | null;
    level: FlareLevel;
    windowHours: number;
    convention: MatchConvention;
  },
  events: readonly MatchEvent[],
): VerificationCases {
  const ordered = isSortedByTime(rows)
    ? rows
    : [...rows].sort((a, b) => a.issueTimeMs - b.issueTimeMs);
  const indexOf = new Map<string, number>();
  const times: number[] = [];
  const regions: (string | null)[] = [];
  const probabilities: number[] = [];
  let collapsedDuplicates = 0;
  for (const r of ordered) {
    if (r.source !== options.source) continue;
    const key = caseKey(r);
    const existing = indexOf.get(key);
    if (existing !== undefined) {
      probabilities[existing] = r.probability;
      collapsedDuplicates += 1;
      continue;
    }
    indexOf.set(key, times.length);
    times.push(r.issueTimeMs);
    regions.push(r.regionNumber);
    probabilities.push(r.probability);
  }
  const pRef = new Float64Array(times.length).fill(Number.NaN);
  if (options.reference) {
    for (const r of ordered) {
      if (r.source !== options.reference) continue;
      const i = indexOf.get(caseKey(r));
      if (i !== undefined) pRef[i] = r.probability;
    }
  }
  const forecasts = times.map((issueTimeMs, i) => ({
    issueTimeMs,
    regionNumber: regions[i] as string | null,
    level: options.level,
    windowHours: options.windowHours,
  }));
  return {
    issueTimeMs: Float64Array.from(times),
    regionNumber: regions,
    p: Float64Array.from(probabilities),
    pRef,
    o: matchForecasts(forecasts, events, options.convention),
    collapsedDuplicates,
  };
}

/** The cases the reference also forecast: its p, the source's p and the outcomes, aligned. */
export function sharedCases(c: VerificationCases): {
  p: Float64Array;
  pRef: Float64Array;
  o: Uint8Array;
  index: Int32Array;
} {
  const index: number[] = [];
  for (let i = 0; i < c.p.length; i++) if (!Number.isNaN(c.pRef[i] as number)) index.push(i);
  const pick = <T extends Float64Array | Uint8Array>(from: T, make: (n: number) => T) => {
    const out = make(index.length);
    index.forEach((k, j) => (out[j] = from[k] as number));
    return out;
  };
  return {
    p: pick(c.p, (n) => new Float64Array(n)),
    pRef: pick(c.pRef, (n) => new Float64Array(n)),
    o: pick(c.o, (n) => new Uint8Array(n)),
    index: Int32Array.from(index),
  };
}
