// Owns reading a contact roster CSV into checked rows (pure: the known organisations and e-mail
// addresses come in as arguments). Columns: organisation, name, email, and optionally bulletins
// (yes/no) and thresholds ("M+ 24h 40%; X 24h 10%").
import Papa from "papaparse";
import {
  CONTACT_IMPORT_MAX_ROWS,
  contactSchema,
  thresholdSchema,
  type ThresholdInput,
} from "@/lib/schemas/subscriptions";

export interface ImportRow {
  line: number;
  organisationName: string;
  organisationId: number | null;
  name: string;
  email: string;
  wantsBulletins: boolean;
  thresholds: ThresholdInput[];
  errors: string[];
}

export interface ImportPreview {
  rows: ImportRow[];
  fileErrors: string[];
  validCount: number;
  invalidCount: number;
}

export interface ImportContext {
  /** Organisation ids by lower-cased name. */
  organisations: ReadonlyMap<string, number>;
  /** Lower-cased e-mail addresses already on the list. */
  existingEmails: ReadonlySet<string>;
  maxRows?: number;
}

const HEADER_ALIASES: Record<string, string> = {
  organization: "organisation",
  org: "organisation",
  "e-mail": "email",
  mail: "email",
  every_bulletin: "bulletins",
  wants_bulletins: "bulletins",
  bulletin: "bulletins",
};
const REQUIRED = ["organisation", "name", "email"] as const;
const YES = new Set(["", "yes", "y", "true", "1"]);
const NO = new Set(["no", "n", "false", "0"]);
const THRESHOLD_PATTERN = /^(C\+|M\+|X)\s*(24|48|72)\s*h\s*(\d{1,3})\s*%?$/i;

function normaliseHeader(header: string): string {
  const key = header.trim().toLowerCase().replace(/\s+/g, "_");
  return HEADER_ALIASES[key] ?? key;
}

export function parseThresholdList(raw: string): {
  thresholds: ThresholdInput[];
  errors: string[];
} {
  const thresholds: ThresholdInput[] = [];
  const errors: string[] = [];
  for (const part of raw
    .split(";")
    .map((p) => p.trim())
    .filter(Boolean)) {
    const match = THRESHOLD_PATTERN.exec(part);
    const checked =
      match &&
      thresholdSchema.safeParse({
        level: match[1]?.toUpperCase(),
        windowHours: match[2],
        probabilityPercent: match[3],
      });
    if (!checked || !checked.success) {
      errors.push(
        `Threshold "${part}" is not like "M+ 24h 40%" (level C+, M+ or X; 24, 48 or 72 h; 1–100 %).`,
      );
    } else if (
      thresholds.some(
        (t) => t.level === checked.data.level && t.windowHours === checked.data.windowHours,
      )
    ) {
      errors.push(`Threshold "${part}" repeats a level and window already given.`);
    } else thresholds.push(checked.data);
  }
  return { thresholds, errors };
}

function checkRow(
  record: Record<string, string>,
  line: number,
  ctx: ImportContext,
  seen: Map<string, number>,
): ImportRow {
  const errors: string[] = [];
  const organisationName = (record.organisation ?? "").trim();
  const organisationId = ctx.organisations.get(organisationName.toLowerCase()) ?? null;
  if (!organisationName) errors.push("Organisation is missing.");
  else if (organisationId === null)
    errors.push(`Organisation "${organisationName}" does not exist: add it first.`);
  const person = contactSchema
    .pick({ name: true, email: true })
    .safeParse({ name: record.name ?? "", email: record.email ?? "" });
  if (!person.success) errors.push(...person.error.issues.map((i) => i.message));
  const email = (record.email ?? "").trim();
  const key = email.toLowerCase();
  if (email && ctx.existingEmails.has(key)) errors.push(`${email} is already a contact.`);
  else if (email && seen.has(key)) errors.push(`${email} is also on line ${seen.get(key)}.`);
  if (email && !seen.has(key)) seen.set(key, line);
  const flag = (record.bulletins ?? "").trim().toLowerCase();
  if (!YES.has(flag) && !NO.has(flag))
    errors.push(`Bulletins must be yes or no, not "${record.bulletins}".`);
  const parsed = parseThresholdList(record.thresholds ?? "");
  errors.push(...parsed.errors);
  return {
    line,
    organisationName,
    organisationId,
    name: (record.name ?? "").trim(),
    email,
    wantsBulletins: !NO.has(flag),
    thresholds: parsed.thresholds,
    errors,
  };
}

export function previewContactCsv(csv: string, ctx: ImportContext): ImportPreview {
  const maxRows = ctx.maxRows ?? CONTACT_IMPORT_MAX_ROWS;
  const parsed = Papa.parse<Record<string, string>>(csv.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: normaliseHeader,
  });
  const headers = parsed.meta.fields ?? [];
  const missing = REQUIRED.filter((h) => !headers.includes(h));
  const fileErrors: string[] = [];
  if (missing.length)
    fileErrors.push(
      `The header row lacks ${missing.join(", ")} (expected: organisation, name, email, bulletins, thresholds).`,
    );
  if (parsed.data.length === 0) fileErrors.push("The file has no contact rows.");
  if (parsed.data.length > maxRows)
    fileErrors.push(
      `The file has ${parsed.data.length} rows; import at most ${maxRows} at a time.`,
    );
  if (fileErrors.length) return { rows: [], fileErrors, validCount: 0, invalidCount: 0 };
  const seen = new Map<string, number>();
  // Line numbers count the header as line 1, as a spreadsheet shows them.
  const rows = parsed.data.map((record, i) => checkRow(record, i + 2, ctx, seen));
  for (const error of parsed.errors) {
    const row = rows[error.row ?? -1];
    if (row) row.errors.push(`CSV: ${error.message}.`);
  }
  const invalidCount = rows.filter((r) => r.errors.length).length;
  return { rows, fileErrors, validCount: rows.length - invalidCount, invalidCount };
}
