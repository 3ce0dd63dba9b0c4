// Validates the rows of an uploaded external forecast series: issue time (UTC), level, window,
// probability and optional region, with duplicates of one case refused (pure).
import type { FlareLevel } from "@/lib/domain/flare-levels";
import { REGION_NUMBER_PATTERN } from "@/lib/schemas/assessment";
import { parseUtcTimestamp } from "@/lib/schemas/verification";
import type { HeaderAliases, TextRow } from "./table-file";

export const EXTERNAL_FIELDS = ["issueTime", "level", "window", "probability", "region"] as const;
export type ExternalField = (typeof EXTERNAL_FIELDS)[number];
export const REQUIRED_EXTERNAL_FIELDS: readonly ExternalField[] = [
  "issueTime",
  "level",
  "window",
  "probability",
];

export const EXTERNAL_ALIASES: HeaderAliases<ExternalField> = {
  issueTime: ["issuetime", "issue", "issued", "issuetimeutc", "issuedat", "time"],
  level: ["level", "flarelevel", "class"],
  window: ["window", "windowhours", "windowh", "hours", "validity"],
  probability: ["probability", "prob", "p", "forecast"],
  region: ["region", "regionnumber", "regionno", "ar", "activeregion"],
};

export interface ExternalRecord {
  issueTime: Date;
  regionNumber: string | null;
  level: FlareLevel;
  windowHours: number;
  probability: number;
}

export interface ExternalRowCheck {
  row: number;
  values: TextRow<ExternalField>;
  errors: Partial<Record<ExternalField | "row", string>>;
  record: ExternalRecord | null;
}

// "C" and "C+" both mean at least one flare ≥ C1.0 in the window (product rule).
const LEVELS: Readonly<Record<string, FlareLevel>> = {
  "C+": "C+",
  C: "C+",
  "M+": "M+",
  M: "M+",
  X: "X",
  "X+": "X",
};

function readProbability(text: string): number | string {
  const percent = /^(\d+(?:\.\d+)?)\s*%$/.exec(text);
  const value = percent ? Number(percent[1]) / 100 : text === "" ? Number.NaN : Number(text);
  if (!Number.isFinite(value)) return `"${text}" is not a probability: write 0.35 or 35%.`;
  if (value < 0 || value > 1) return `${text} is outside 0–1: write 0.35, or 35% for a percentage.`;
  return value;
}

export function checkExternalValues(v: TextRow<ExternalField>): {
  record: ExternalRecord | null;
  errors: ExternalRowCheck["errors"];
} {
  const errors: ExternalRowCheck["errors"] = {};
  const time = parseUtcTimestamp(v.issueTime ?? "");
  if (!time.ok) errors.issueTime = v.issueTime ? time.message : "The issue time is missing.";
  const level = LEVELS[(v.level ?? "").trim().toUpperCase()];
  if (!level) errors.level = `"${v.level ?? ""}" is not a level: write C+, M+ or X.`;
  const windowMatch = /^(24|48|72)\s*h?$/i.exec((v.window ?? "").trim());
  if (!windowMatch)
    errors.window = `"${v.window ?? ""}" is not a window: write 24, 48 or 72 (hours).`;
  const probability = readProbability((v.probability ?? "").trim());
  if (typeof probability === "string") errors.probability = probability;
  const region = (v.region ?? "").trim().toUpperCase();
  if (region !== "" && !REGION_NUMBER_PATTERN.test(region))
    errors.region = `"${v.region}" is not a region number like HR-0412; leave it empty for the full disk.`;
  if (!time.ok || !level || !windowMatch || typeof probability === "string" || errors.region)
    return { record: null, errors };
  return {
    errors,
    record: {
      issueTime: new Date(time.ms),
      regionNumber: region === "" ? null : region,
      level,
      windowHours: Number(windowMatch[1]),
      probability,
    },
  };
}

const recordKey = (r: ExternalRecord) =>
  `${r.issueTime.getTime()}|${r.regionNumber ?? ""}|${r.level}|${r.windowHours}`;

/** Every row checked; a second row for the same issue time, region, level and window is refused. */
export function checkExternalRows(rows: readonly TextRow<ExternalField>[]): ExternalRowCheck[] {
  const firstRowOf = new Map<string, number>();
  return rows.map((values, i) => {
    const row = i + 1;
    const { record, errors } = checkExternalValues(values);
    if (record) {
      const key = recordKey(record);
      const earlier = firstRowOf.get(key);
      if (earlier !== undefined) {
        errors.row = `Row ${earlier} already forecasts this issue time, region, level and window.`;
        return { row, values, errors, record: null };
      }
      firstRowOf.set(key, row);
    }
    return { row, values, errors, record };
  });
}
