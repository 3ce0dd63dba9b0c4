// The model registry's inputs: importing a version (a JSON definition or a CSV table) and
// switching a version on or off. Parameters themselves are checked on the server by model kind.
import { z } from "zod";

/** The kinds of src/server/scoring/model-params.ts (islands cannot import it; a test keeps them equal). */
export const MODEL_KIND_LABELS = {
  "mcintosh-poisson": "McIntosh-class Poisson rate table",
  logistic: "Logistic regression coefficients",
  persistence: "Flare history (persistence)",
} as const;
export type RegistryModelKind = keyof typeof MODEL_KIND_LABELS;
export const REGISTRY_MODEL_KINDS = Object.keys(MODEL_KIND_LABELS) as [
  RegistryModelKind,
  ...RegistryModelKind[],
];

/** Kinds that can come as a CSV table: rates per class, or coefficients per level and term. */
export const CSV_MODEL_KINDS: readonly RegistryModelKind[] = ["mcintosh-poisson", "logistic"];

export const MODEL_CSV_COLUMNS: Readonly<
  Record<"mcintosh-poisson" | "logistic", readonly string[]>
> = {
  "mcintosh-poisson": ["class", "C", "M", "X"],
  logistic: ["level", "term", "transform", "coefficient"],
};

/** Form number inputs arrive as text; "" means not given. */
const optionalFormNumber = z.preprocess(
  (v) =>
    v === "" || v === null || v === undefined || (typeof v === "number" && Number.isNaN(v))
      ? undefined
      : typeof v === "string"
        ? Number(v)
        : v,
  z.number({ error: "Enter a number." }).optional(),
);

export const modelImportSchema = z
  .object({
    format: z
      .enum(["json", "csv"], { error: "Say whether the parameters come as JSON or CSV." })
      .default("json"),
    key: z
      .string({ error: "Enter the model key." })
      .trim()
      .regex(/^[a-z0-9](?:[a-z0-9-]{0,38}[a-z0-9])?$/, {
        error: "Use lower-case letters, digits and dashes, e.g. mcintosh-poisson.",
      }),
    version: z
      .string({ error: "Enter the version." })
      .trim()
      .regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,31}$/, {
        error: "Use letters, digits, dots, dashes or underscores, e.g. 2031-1.",
      }),
    kind: z.enum(REGISTRY_MODEL_KINDS, { error: "Choose the model kind." }),
    name: z
      .string({ error: "Enter a name." })
      .trim()
      .min(3, { error: "Give the model a name of at least 3 characters." })
      .max(120, { error: "Keep the name under 120 characters." }),
    provenance: z
      .string({ error: "Say where these numbers come from." })
      .trim()
      .min(10, {
        error:
          "Say where these numbers come from (at least 10 characters): the paper and table, the data and period, or who fitted them.",
      })
      .max(2000, { error: "Keep the provenance under 2000 characters." }),
    /** The parameter object, or its JSON text (format "json"). */
    params: z.unknown().optional(),
    csv: z
      .string()
      .max(512 * 1024, { error: "Keep the table under 512 KiB." })
      .optional(),
    correctionFactor: optionalFormNumber,
    windowHours: optionalFormNumber,
  })
  .superRefine((v, ctx) => {
    const need = (path: string, message: string) =>
      ctx.addIssue({ code: "custom", path: [path], message });
    if (v.format === "json") {
      if (
        v.params === undefined ||
        v.params === null ||
        (typeof v.params === "string" && v.params.trim() === "")
      )
        need("params", "Give the parameters as JSON.");
      return;
    }
    if (!CSV_MODEL_KINDS.includes(v.kind))
      need(
        "kind",
        "A CSV table can hold a rate table or logistic coefficients; give other kinds as JSON.",
      );
    if (!v.csv?.trim()) need("csv", "Give the table as CSV, header row included.");
    if (v.kind === "mcintosh-poisson" && v.correctionFactor === undefined)
      need(
        "correctionFactor",
        "Give the correction factor (1 keeps the table's rates as they are).",
      );
    if (v.kind === "logistic" && v.windowHours === undefined)
      need("windowHours", "Give the window in hours the coefficients were fitted for.");
  });
export type ModelImportValues = z.input<typeof modelImportSchema>;
export type ModelImport = z.output<typeof modelImportSchema>;

export const modelActivationSchema = z.strictObject({
  isActive: z.boolean({ error: "Say true to activate or false to deactivate." }),
});

/** A registry row as the API shows it. */
export interface ModelVersionView {
  id: number;
  key: string;
  version: string;
  kind: string;
  name: string;
  provenance: string;
  params: unknown;
  isActive: boolean;
  isDemo: boolean;
  createdAt: string;
}
