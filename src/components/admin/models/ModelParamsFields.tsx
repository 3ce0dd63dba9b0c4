// The parameter part of the model import form: JSON text, or a CSV table with its form-level number.
import type { UseFormReturn } from "react-hook-form";
import { MODEL_CSV_COLUMNS, type ModelImport, type ModelImportValues } from "@/lib/schemas/models";
import { describedBy, Field } from "@/components/ui/Field";

interface ModelParamsFieldsProps {
  form: UseFormReturn<ModelImportValues, unknown, ModelImport>;
  /** Server messages about cells and parameter paths ("csv.8.M", "params.rates.Dkc.M"). */
  cellErrors: [string, string][];
}

const CSV_HINTS = {
  "mcintosh-poisson": "a single Zurich letter gives fallback rates for its classes",
  logistic: 'the term "intercept" gives the level\'s intercept',
} as const;

function NumberField({
  form,
  name,
  id,
  label,
}: {
  form: ModelParamsFieldsProps["form"];
  name: "windowHours" | "correctionFactor";
  id: string;
  label: string;
}) {
  const error = form.formState.errors[name]?.message;
  return (
    <Field id={id} label={label} error={error}>
      <input
        type="number"
        step="any"
        className="field-input w-32"
        {...describedBy(id, error)}
        {...form.register(name)}
      />
    </Field>
  );
}

export function ModelParamsFields({ form, cellErrors }: ModelParamsFieldsProps) {
  const { register, formState, watch } = form;
  const { errors } = formState;
  const csvKind = watch("kind") === "logistic" ? "logistic" : "mcintosh-poisson";
  const csvHint = `Columns: ${MODEL_CSV_COLUMNS[csvKind].join(", ")}; ${CSV_HINTS[csvKind]}.`;
  return (
    <>
      {watch("format") === "json" ? (
        <Field id="model-params" label="Parameters (JSON)" error={errors.params?.message}>
          <textarea
            rows={8}
            className="field-input font-mono text-xs"
            {...describedBy("model-params", errors.params?.message)}
            {...register("params")}
          />
        </Field>
      ) : (
        <>
          <Field id="model-csv" label="Table (CSV)" error={errors.csv?.message} hint={csvHint}>
            <textarea
              rows={8}
              className="field-input font-mono text-xs"
              {...describedBy("model-csv", errors.csv?.message, true)}
              {...register("csv")}
            />
          </Field>
          {csvKind === "logistic" ? (
            <NumberField
              form={form}
              name="windowHours"
              id="model-window"
              label="Window the coefficients were fitted for (hours)"
            />
          ) : (
            <NumberField
              form={form}
              name="correctionFactor"
              id="model-correction"
              label="Correction factor applied to every rate"
            />
          )}
        </>
      )}
      {cellErrors.length > 0 && (
        <ul className="field-error list-disc pl-5" aria-label="Problems in the parameters">
          {cellErrors.map(([f, m]) => (
            <li key={f}>
              {f.startsWith("params.") && (
                <span className="num">{f.slice("params.".length)}: </span>
              )}
              {m}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
