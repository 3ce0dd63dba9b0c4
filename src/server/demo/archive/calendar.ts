// Forecast days (UTC calendar dates) and the archive's issue times.

const DAY_MS = 86_400_000;
const DAY_PATTERN = /^\d{4}-\d{2}-\d{2}$/;

/** Bulletins of the demo archive are issued at 00:30 UTC of their forecast day. */
export const ISSUE_MINUTES_AFTER_MIDNIGHT = 30;

/** Epoch milliseconds of 00:00 UTC of a YYYY-MM-DD day; throws on anything else. */
export function parseDay(day: string): number {
  if (!DAY_PATTERN.test(day)) throw new Error(`A day must be written YYYY-MM-DD; got "${day}"`);
  const ms = Date.parse(`${day}T00:00:00Z`);
  if (Number.isNaN(ms) || new Date(ms).toISOString().slice(0, 10) !== day) {
    throw new Error(`"${day}" is not a calendar date`);
  }
  return ms;
}

export function formatDay(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}

export function addDays(day: string, n: number): string {
  return formatDay(parseDay(day) + n * DAY_MS);
}

/** The issue time of forecast day `day`, as epoch milliseconds. */
export function computeIssueTimeMs(day: string): number {
  return parseDay(day) + ISSUE_MINUTES_AFTER_MIDNIGHT * 60_000;
}

/** Whole days from `from` to `to` (positive when `to` is later). */
export function countDaysBetween(from: string, to: string): number {
  return Math.round((parseDay(to) - parseDay(from)) / DAY_MS);
}

export { DAY_MS };
