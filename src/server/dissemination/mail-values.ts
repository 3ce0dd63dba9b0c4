// Owns how numbers and times are written into e-mails: whole percentages and UTC minutes.

/**
 * Whole percent, as flare bulletins commonly publish them (common practice); values that would
 * round to 0 or 100 but are not exactly that say "<1%" / ">99%" so a small risk never reads as none.
 */
export function formatMailPercent(p: number): string {
  if (!Number.isFinite(p)) return "n/a";
  if (p > 0 && p < 0.005) return "<1%";
  if (p < 1 && p > 0.995) return ">99%";
  return `${Math.round(p * 100)}%`;
}

/** "2026-05-04 09:30"; the templates add the " UTC" suffix. */
export function formatMailTime(value: Date): string {
  return value.toISOString().slice(0, 16).replace("T", " ");
}

/** Blank lines separate paragraphs; single line breaks stay inside a paragraph. */
export function splitParagraphs(text: string): string[] {
  return text
    .split(/\r?\n\s*\r?\n/)
    .map((p) => p.replace(/\s*\r?\n\s*/g, " ").trim())
    .filter((p) => p.length > 0);
}
