// Import a model version: a JSON definition or a CSV table, stored inactive until activated.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import {
  MODEL_KIND_LABELS,
  modelImportSchema,
  REGISTRY_MODEL_KINDS,
  type ModelImport,
  type ModelImportValues,
  type ModelVersionView,
} from "@/lib/schemas/models";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";
import { ModelParamsFields } from "./ModelParamsFields";

const DEFAULTS: ModelImportValues = {
  format: "json",
  key: "",
  version: "",
  kind: "mcintosh-poisson",
  name: "",
  provenance: "",
  params: "",
  csv: "",
  correctionFactor: "",
  windowHours: "",
};

const DIRECT_FIELDS = new Set(Object.keys(DEFAULTS));

export function ModelImportForm({ onImported }: { onImported: (model: ModelVersionView) => void }) {
  const form = useForm<ModelImportValues, unknown, ModelImport>({
    resolver: zodResolver(modelImportSchema),
    defaultValues: DEFAULTS,
  });
  const { register, handleSubmit, formState, setError, setValue, watch, reset } = form;
  const [status, setStatus] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const [cellErrors, setCellErrors] = useState<[string, string][]>([]);
  const { errors, isSubmitting } = formState;
  const format = watch("format");

  const readFile = (file: File) => {
    const reader = new FileReader();
    reader.onerror = () => setStatus({ tone: "error", text: `${file.name} could not be read.` });
    reader.onload = () => {
      const text = String(reader.result ?? "");
      if (format === "csv") return setValue("csv", text);
      try {
        const parsed = JSON.parse(text) as Record<string, unknown>;
        const isDefinition = typeof parsed === "object" && parsed !== null && "params" in parsed;
        for (const f of ["key", "version", "kind", "name", "provenance"] as const)
          if (isDefinition && typeof parsed[f] === "string") setValue(f, parsed[f] as never);
        setValue("params", JSON.stringify(isDefinition ? parsed.params : parsed, null, 2));
      } catch (err) {
        setStatus({
          tone: "error",
          text: `${file.name} is not valid JSON: ${(err as Error).message}`,
        });
      }
    };
    reader.readAsText(file, "utf-8");
  };

  const onSubmit = handleSubmit(async (values) => {
    setStatus(null);
    setCellErrors([]);
    try {
      const model = await fetchJson<ModelVersionView>("/api/admin/models", {
        method: "POST",
        json: values,
      });
      reset({ ...DEFAULTS, format: values.format });
      setStatus({
        tone: "success",
        text: `${model.key} ${model.version} is stored, inactive. Activate it in the list when you have checked it.`,
      });
      onImported(model);
    } catch (err) {
      if (err instanceof ApiError) {
        const nested = Object.entries(err.fields).filter(([f]) => !DIRECT_FIELDS.has(f));
        for (const [f, m] of Object.entries(err.fields))
          if (DIRECT_FIELDS.has(f)) setError(f as keyof ModelImportValues, { message: m });
        setCellErrors(nested);
      }
      setStatus({ tone: "error", text: (err as Error).message });
    }
  });

  const input = (name: "key" | "version" | "name", label: string, hint?: string) => (
    <Field id={`model-${name}`} label={label} error={errors[name]?.message} hint={hint}>
      <input
        className="field-input"
        {...describedBy(`model-${name}`, errors[name]?.message, !!hint)}
        {...register(name)}
      />
    </Field>
  );
  return (
    <form className="card space-y-4" onSubmit={onSubmit} noValidate aria-labelledby="model-import">
      <h2 id="model-import">Import a version</h2>
      {status && <FormAlert tone={status.tone}>{status.text}</FormAlert>}
      <fieldset className="flex gap-4 text-sm">
        <legend className="field-label">Parameters come as</legend>
        <label className="flex items-center gap-1">
          <input type="radio" value="json" {...register("format")} /> JSON
        </label>
        <label className="flex items-center gap-1">
          <input type="radio" value="csv" {...register("format")} /> CSV table
        </label>
      </fieldset>
      <div>
        <label htmlFor="model-file" className="field-label">
          File (optional: fills the fields below)
        </label>
        <input
          id="model-file"
          type="file"
          accept={format === "csv" ? ".csv,text/csv,text/plain" : ".json,application/json"}
          className="block text-sm"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) readFile(f);
            e.target.value = "";
          }}
        />
      </div>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {input("key", "Model key", "Versions of one key replace each other, e.g. mcintosh-poisson")}
        {input("version", "Version")}
        <Field id="model-kind" label="Kind" error={errors.kind?.message}>
          <select
            className="field-input"
            {...describedBy("model-kind", errors.kind?.message)}
            {...register("kind")}
          >
            {REGISTRY_MODEL_KINDS.map((k) => (
              <option key={k} value={k}>
                {MODEL_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </Field>
        {input("name", "Name shown with its guidance")}
      </div>
      <Field
        id="model-provenance"
        label="Provenance"
        error={errors.provenance?.message}
        hint="Where the numbers come from: the paper and table, the data and period, or who fitted them. Shown exactly as written."
      >
        <textarea
          rows={2}
          className="field-input"
          {...describedBy("model-provenance", errors.provenance?.message, true)}
          {...register("provenance")}
        />
      </Field>
      <ModelParamsFields form={form} cellErrors={cellErrors} />
      <button type="submit" className="btn-primary" disabled={isSubmitting}>
        Import, inactive
      </button>
    </form>
  );
}
