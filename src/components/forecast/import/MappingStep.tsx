// Step 2 of the CSV import: pick the file's column for each field (pre-filled), optionally remembered.
import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useState } from "react";
import { useForm } from "react-hook-form";
import {
  completeMappingSchema,
  IMPORT_FIELD_LABELS,
  IMPORT_FIELDS,
  REQUIRED_IMPORT_FIELDS,
  type ColumnMapping,
  type ImportField,
} from "@/lib/schemas/csv-import";
import { describedBy, Field } from "@/components/ui/Field";

interface MappingStepProps {
  fileName: string;
  headers: string[];
  initial: ColumnMapping;
  /** Field messages from the server (keys without the "mapping." prefix). */
  serverErrors: Partial<Record<ImportField, string>>;
  isBusy: boolean;
  onSubmit: (mapping: ColumnMapping, remember: boolean) => void;
  onBack: () => void;
}

export function MappingStep({
  fileName,
  headers,
  initial,
  serverErrors,
  isBusy,
  onSubmit,
  onBack,
}: MappingStepProps) {
  const [isRemembered, setRemembered] = useState(false);
  const { register, handleSubmit, formState, setError } = useForm<ColumnMapping>({
    resolver: zodResolver(completeMappingSchema),
    defaultValues: Object.fromEntries(IMPORT_FIELDS.map((f) => [f, initial[f] ?? ""])),
  });
  useEffect(() => {
    for (const [field, message] of Object.entries(serverErrors))
      setError(field as ImportField, { message });
  }, [serverErrors, setError]);
  const submit = handleSubmit((mapping) => onSubmit(mapping, isRemembered));
  const errors = formState.errors;

  return (
    <form className="card space-y-4" onSubmit={submit} noValidate aria-labelledby="import-mapping">
      <h2 id="import-mapping">2 · Match the columns</h2>
      <p className="text-sm text-ink-700">
        {fileName}: {headers.length} columns. Fields marked * are needed; the others may stay empty.
      </p>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {IMPORT_FIELDS.map((field) => {
          const id = `map-${field}`;
          const error = errors[field]?.message;
          const isRequired = REQUIRED_IMPORT_FIELDS.includes(field);
          return (
            <Field
              key={field}
              id={id}
              label={`${IMPORT_FIELD_LABELS[field]}${isRequired ? " *" : ""}`}
              error={error}
            >
              <select className="field-input" {...describedBy(id, error)} {...register(field)}>
                <option value="">{isRequired ? "Choose a column" : "Not in this file"}</option>
                {headers
                  .filter((h) => h !== "")
                  .map((h) => (
                    <option key={h} value={h}>
                      {h}
                    </option>
                  ))}
              </select>
            </Field>
          );
        })}
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={isRemembered}
          onChange={(e) => setRemembered(e.target.checked)}
        />{" "}
        Remember this mapping for the office
      </label>
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={isBusy}>
          Check the rows
        </button>
        <button type="button" className="btn-quiet" onClick={onBack} disabled={isBusy}>
          Choose another file
        </button>
      </div>
    </form>
  );
}
