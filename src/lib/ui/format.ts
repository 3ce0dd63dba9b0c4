// Formatting shared by pages and islands: UTC times always carry the "UTC" suffix.

/** "2026-12-01 18:05 UTC" (minutes) or with seconds. */
export function formatUtc(value: Date | string | number, withSeconds = false): string {
  const iso = new Date(value).toISOString();
  return `${iso.slice(0, withSeconds ? 19 : 16).replace("T", " ")} UTC`;
}

export function formatUtcDate(value: Date | string | number): string {
  return new Date(value).toISOString().slice(0, 10);
}

export function formatPercent(p: number | null | undefined, digits = 0): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return "undefined";
  return `${(p * 100).toFixed(digits)} %`;
}
