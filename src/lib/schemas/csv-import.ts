// The CSV import of a day's assessments: the importable fields, the column mapping (field → CSV
// header) with its automatic matching, the request schema, the limits and the preview shape.
import { z } from "zod";
import { forecastDaySchema } from "./assessment";

export const IMPORT_FIELDS = [
  "region",
  "location",
  "areaMsh",
  "spotCount",
  "mcintosh",
  "mountWilson",
  "unsignedFluxMx",
  "pilLengthMm",
  "logR",
  "meanShearDeg",
  "freeEnergyProxy",
  "flaresC",
  "flaresM",
  "flaresX",
  "notes",
] as const;
export type ImportField = (typeof IMPORT_FIELDS)[number];

/** The fields createAssessmentSchema cannot do without. */
export const REQUIRED_IMPORT_FIELDS: readonly ImportField[] = [
  "region",
  "location",
  "areaMsh",
  "spotCount",
  "mcintosh",
  "mountWilson",
];

export const IMPORT_FIELD_LABELS: Readonly<Record<ImportField, string>> = {
  region: "Region number",
  location: "Location",
  areaMsh: "Area (MSH)",
  spotCount: "Number of spots",
  mcintosh: "McIntosh class",
  mountWilson: "Mount Wilson class",
  unsignedFluxMx: "Unsigned flux (Mx)",
  pilLengthMm: "PIL length (Mm)",
  logR: "log R",
  meanShearDeg: "Mean shear (°)",
  freeEnergyProxy: "Free-energy proxy",
  flaresC: "C flares, last 24 h",
  flaresM: "M flares, last 24 h",
  flaresX: "X flares, last 24 h",
  notes: "Notes",
};

// Header spellings seen in office spreadsheets, compared after normalising (lower case, no
// spaces, dashes, underscores or dots). The field's own name and label always match too.
const ALIASES: Readonly<Record<ImportField, readonly string[]>> = {
  region: ["region", "regionnumber", "regionno", "ar", "activeregion"],
  location: ["location", "loc", "position", "pos", "latlon"],
  areaMsh: ["area", "areamsh", "msh"],
  spotCount: ["spots", "spotcount", "numberofspots", "nspots"],
  mcintosh: ["mcintosh", "mcintoshclass", "zpc", "class", "spotclass", "groupclass"],
  // "mag class" is the magnetic (Mount Wilson) class, not the McIntosh class.
  mountWilson: ["mountwilson", "mtwilson", "mw", "mwclass", "magclass", "magnetic", "hale"],
  unsignedFluxMx: ["flux", "fluxmx", "unsignedflux", "totalflux", "usflux"],
  pilLengthMm: ["pil", "pillength", "pilmm", "pillengthmm"],
  logR: ["logr", "r", "schrijverr"],
  meanShearDeg: ["shear", "meanshear", "shearangle", "sheardeg", "meansheardeg"],
  freeEnergyProxy: ["freeenergy", "energyproxy", "freeenergyproxy", "totpot"],
  flaresC: ["c", "flaresc", "cflares", "c24h", "cflares24h"],
  flaresM: ["m", "flaresm", "mflares", "m24h", "mflares24h"],
  flaresX: ["x", "flaresx", "xflares", "x24h", "xflares24h"],
  notes: ["notes", "note", "comment", "comments", "remarks"],
};

export function normaliseHeader(header: string): string {
  return header.toLowerCase().replace(/[\s_\-.()°/]+/g, "");
}

export type ColumnMapping = Partial<Record<ImportField, string>>;

/**
 * Fills each field with a header: the remembered choice when the file still has that header,
 * else the first header matching the field's name, label or aliases. A header is used once.
 */
export function suggestColumnMapping(
  headers: readonly string[],
  remembered: ColumnMapping = {},
): ColumnMapping {
  const mapping: ColumnMapping = {};
  const used = new Set<string>();
  for (const field of IMPORT_FIELDS) {
    const choice = remembered[field];
    if (choice && headers.includes(choice) && !used.has(choice)) {
      mapping[field] = choice;
      used.add(choice);
    }
  }
  for (const field of IMPORT_FIELDS) {
    if (mapping[field]) continue;
    const names = new Set([
      field.toLowerCase(),
      normaliseHeader(IMPORT_FIELD_LABELS[field]),
      ...ALIASES[field],
    ]);
    const match = headers.find((h) => !used.has(h) && names.has(normaliseHeader(h)));
    if (match) {
      mapping[field] = match;
      used.add(match);
    }
  }
  return mapping;
}

export const columnMappingSchema = z.partialRecord(
  z.enum(IMPORT_FIELDS),
  z.string().trim().max(200, { error: "Column names are at most 200 characters." }),
);

/** A mapping every required field has a column in; the form's resolver and the server use it. */
export const completeMappingSchema = columnMappingSchema.superRefine((mapping, ctx) => {
  for (const field of REQUIRED_IMPORT_FIELDS) {
    if (!mapping[field])
      ctx.addIssue({
        code: "custom",
        path: [field],
        message: `Choose a column for ${IMPORT_FIELD_LABELS[field]}.`,
      });
  }
});

/** Body of GET and PUT /api/assessments/import-mapping. */
export const rememberedMappingSchema = z.object({ mapping: columnMappingSchema });

export const IMPORT_LIMITS = { maxBytes: 2 * 1024 * 1024, maxRows: 2000 } as const;

export const csvImportRequestSchema = z.object({
  forecastDay: forecastDaySchema,
  csv: z.string({ error: "Send the CSV text." }).min(1, { error: "The file is empty." }),
  mapping: columnMappingSchema,
  mode: z.enum(["preview", "commit"], { error: 'Say "preview" or "commit".' }),
});
export type CsvImportRequest = z.infer<typeof csvImportRequestSchema>;

export interface ImportRowPreview {
  /** 1 = the first data row after the header. */
  row: number;
  values: Partial<Record<ImportField, string>>;
  errors: Partial<Record<ImportField | "row", string>>;
  warnings: { field: string; message: string }[];
  /** Blended guidance for M+ in 24 h, or null with the reason. */
  guidance: { mPlus24h: number | null; reason: string | null };
}

export interface ImportPreview {
  forecastDay: string;
  headers: string[];
  mapping: ColumnMapping;
  rows: ImportRowPreview[];
  counts: { rows: number; valid: number; withErrors: number; withWarnings: number };
}

export interface ImportCommitted {
  imported: number;
  ids: number[];
}
