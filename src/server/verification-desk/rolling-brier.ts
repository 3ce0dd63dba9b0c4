// Brier score over time: for each UTC day with forecasts, the score of the cases issued in the
// trailing window of days ending that day (pure, one pass with running sums).
import type { TimelinePointJson } from "@/lib/query/verification";

const DAY_MS = 86_400_000;

export interface TimelineInput {
  issueTimeMs: ArrayLike<number>;
  p: ArrayLike<number>;
  /** NaN where the reference has no forecast for the case. */
  pRef: ArrayLike<number>;
  o: ArrayLike<number>;
}

interface DayTotals {
  day: number;
  sq: number;
  n: number;
  sqRef: number;
  nRef: number;
}

function totalsPerDay(c: TimelineInput): DayTotals[] {
  const days = new Map<number, DayTotals>();
  for (let i = 0; i < c.p.length; i++) {
    const day = Math.floor((c.issueTimeMs[i] as number) / DAY_MS);
    let t = days.get(day);
    if (!t) days.set(day, (t = { day, sq: 0, n: 0, sqRef: 0, nRef: 0 }));
    const o = c.o[i] as number;
    t.sq += ((c.p[i] as number) - o) ** 2;
    t.n += 1;
    const r = c.pRef[i] as number;
    if (!Number.isNaN(r)) {
      t.sqRef += (r - o) ** 2;
      t.nRef += 1;
    }
  }
  return [...days.values()].sort((a, b) => a.day - b.day);
}

/**
 * BS over the cases issued in (d − windowDays, d] for every day d that has cases (Brier 1950;
 * a trailing mean is common practice for score time series). The reference's score uses only
 * the cases it forecast, and is null on days where the window holds none of them.
 */
export function rollingBrier(c: TimelineInput, windowDays = 30): TimelinePointJson[] {
  if (!Number.isInteger(windowDays) || windowDays < 1)
    throw new Error(`The window must be a whole number of days ≥ 1; got ${windowDays}`);
  const days = totalsPerDay(c);
  const points: TimelinePointJson[] = [];
  let left = 0;
  const sum = { sq: 0, n: 0, sqRef: 0, nRef: 0 };
  for (const t of days) {
    sum.sq += t.sq;
    sum.n += t.n;
    sum.sqRef += t.sqRef;
    sum.nRef += t.nRef;
    while ((days[left] as DayTotals).day <= t.day - windowDays) {
      const out = days[left++] as DayTotals;
      sum.sq -= out.sq;
      sum.n -= out.n;
      sum.sqRef -= out.sqRef;
      sum.nRef -= out.nRef;
    }
    points.push({
      day: new Date(t.day * DAY_MS).toISOString().slice(0, 10),
      // Running sums drift by rounding; a tiny negative is clamped, never shown.
      source: Math.max(0, sum.sq / sum.n),
      reference: sum.nRef > 0 ? Math.max(0, sum.sqRef / sum.nRef) : null,
      count: sum.n,
    });
  }
  return points;
}
