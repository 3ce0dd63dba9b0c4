// CSV import of a day's assessments: file → column mapping → checked preview → one all-or-nothing import.
import { QueryClientProvider } from "@tanstack/react-query";
import type { ColumnMapping } from "@/lib/schemas/csv-import";
import { getQueryClient } from "@/lib/query/client";
import { FormAlert } from "@/components/ui/FormAlert";
import { MappingStep } from "./import/MappingStep";
import { PreviewStep } from "./import/PreviewStep";
import { ProgressBar } from "@/components/ui/ProgressBar";
import { SourceStep } from "./import/SourceStep";
import { useCsvImport } from "./import/use-csv-import";

interface CsvImportProps {
  day: string;
  initialMapping: ColumnMapping;
}

function Importer({ day, initialMapping }: CsvImportProps) {
  const flow = useCsvImport(day, initialMapping);
  const { source, preview, upload, committed, saveMapping } = flow;
  if (committed) {
    return (
      <div className="space-y-4">
        <FormAlert tone="success">
          Imported {committed.imported} regions for {day} UTC, each scored with the active models.
        </FormAlert>
        <p className="flex gap-2">
          <a className="btn-primary" href={`/days/${day}`}>
            Open the day
          </a>
          <button type="button" className="btn-quiet" onClick={flow.restart}>
            Import another file
          </button>
        </p>
      </div>
    );
  }
  return (
    <div className="space-y-5">
      {flow.message && <FormAlert tone="error">{flow.message}</FormAlert>}
      {saveMapping.isError && (
        <FormAlert tone="error">
          The mapping was not remembered: {saveMapping.error.message}
        </FormAlert>
      )}
      {saveMapping.isSuccess && (
        <FormAlert tone="success">Mapping remembered for the office.</FormAlert>
      )}
      {upload && (
        <ProgressBar
          label={upload.fraction === null ? "The desk is checking the rows" : "Sending the file"}
          value={upload.fraction}
        />
      )}
      {!source && <SourceStep onLoaded={flow.loadSource} />}
      {source && (
        <MappingStep
          key={source.name + source.text.length}
          fileName={source.name}
          headers={source.headers}
          initial={source.suggested}
          serverErrors={flow.mappingErrors}
          isBusy={flow.isBusy}
          onSubmit={(m, remember) => void flow.checkRows(m, remember)}
          onBack={flow.restart}
        />
      )}
      {source && preview && (
        <PreviewStep
          preview={preview}
          isBusy={flow.isBusy}
          onImport={flow.commit}
          onRecheck={flow.recheck}
        />
      )}
    </div>
  );
}

export function CsvImport(props: CsvImportProps) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <Importer {...props} />
    </QueryClientProvider>
  );
}
