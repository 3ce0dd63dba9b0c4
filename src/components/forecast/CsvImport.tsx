// CSV import of a day's assessments: file → column mapping → checked preview → one all-or-nothing import.
import { QueryClientProvider, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Papa from "papaparse";
import { useState } from "react";
import { suggestColumnMapping, type ColumnMapping, type ImportCommitted, type ImportField, type ImportPreview } from "@/lib/schemas/csv-import";
import { getQueryClient } from "@/lib/query/client";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { FormAlert } from "@/components/ui/FormAlert";
import { MappingStep } from "./import/MappingStep";
import { PreviewTable } from "./import/PreviewTable";
import { ProgressBar } from "./import/ProgressBar";
import { postJsonWithProgress, type UploadProgress } from "./import/send-with-progress";
import { SourceStep } from "./import/SourceStep";

interface CsvImportProps {
  day: string;
  initialMapping: ColumnMapping;
}

const MAPPING_KEY = ["assessments", "import-mapping"] as const;
type Source = { text: string; name: string; headers: string[]; suggested: ColumnMapping };

function readHeaders(text: string): string[] {
  const first = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), { preview: 1, skipEmptyLines: "greedy" }).data[0] ?? [];
  return first.map((h) => h.trim());
}

function mappingFieldErrors(err: unknown): Partial<Record<ImportField, string>> {
  if (!(err instanceof ApiError)) return {};
  return Object.fromEntries(Object.entries(err.fields).filter(([k]) => k.startsWith("mapping.")).map(([k, m]) => [k.slice(8), m]));
}

function Importer({ day, initialMapping }: CsvImportProps) {
  const queryClient = useQueryClient();
  const remembered = useQuery({ queryKey: MAPPING_KEY, queryFn: () => fetchJson<{ mapping: ColumnMapping }>("/api/assessments/import-mapping"), initialData: { mapping: initialMapping } });
  const [source, setSource] = useState<Source | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping>({});
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [upload, setUpload] = useState<UploadProgress | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  const saveMapping = useMutation({
    mutationFn: (m: ColumnMapping) => fetchJson<{ mapping: ColumnMapping }>("/api/assessments/import-mapping", { method: "PUT", json: { mapping: m } }),
    onSuccess: (saved) => queryClient.setQueryData(MAPPING_KEY, saved),
  });
  const send = useMutation({
    mutationFn: ({ mode, m }: { mode: "preview" | "commit"; m: ColumnMapping }) =>
      postJsonWithProgress<ImportPreview | ImportCommitted>("/api/assessments/import", { forecastDay: day, csv: source?.text ?? "", mapping: m, mode }, setUpload),
    onMutate: () => { setMessage(null); setUpload({ fraction: 0 }); },
    onSettled: () => setUpload(null),
    onSuccess: (answer, { mode }) => { if (mode === "preview") setPreview(answer as ImportPreview); },
    onError: (err, { mode }) => {
      const hasMappingErrors = Object.keys(mappingFieldErrors(err)).length > 0;
      if (hasMappingErrors) setPreview(null);
      const extra = err instanceof ApiError && err.fields.csv ? ` ${err.fields.csv}` : "";
      setMessage(mode === "commit" && err instanceof ApiError && err.status === 422 ? `${err.message} Check the file again to see each row's problem.` : `${err.message}${extra}`);
    },
  });

  const loadSource = (text: string, name: string) => {
    const headers = readHeaders(text);
    if (headers.every((h) => h === "")) return setMessage(`${name} has no header row: the first line must name the columns.`);
    setMessage(null);
    setPreview(null);
    send.reset();
    setSource({ text, name, headers, suggested: suggestColumnMapping(headers, remembered.data.mapping) });
  };
  const checkRows = async (m: ColumnMapping, remember: boolean) => {
    setMapping(m);
    if (remember) await saveMapping.mutateAsync(m).catch(() => undefined);
    send.mutate({ mode: "preview", m });
  };
  const restart = () => { setSource(null); setPreview(null); setMessage(null); send.reset(); };

  const committed = send.isSuccess && send.variables?.mode === "commit" ? (send.data as ImportCommitted) : null;
  if (committed) {
    return (
      <div className="space-y-4">
        <FormAlert tone="success">Imported {committed.imported} regions for {day} UTC, each scored with the active models.</FormAlert>
        <p className="flex gap-2"><a className="btn-primary" href={`/days/${day}`}>Open the day</a><button type="button" className="btn-quiet" onClick={restart}>Import another file</button></p>
      </div>
    );
  }
  const isImportable = !!preview && preview.counts.withErrors === 0 && preview.counts.rows > 0;
  return (
    <div className="space-y-5">
      {message && <FormAlert tone="error">{message}</FormAlert>}
      {saveMapping.isError && <FormAlert tone="error">The mapping was not remembered: {saveMapping.error.message}</FormAlert>}
      {saveMapping.isSuccess && <FormAlert tone="success">Mapping remembered for the office.</FormAlert>}
      {upload && <ProgressBar label={upload.fraction === null ? "The desk is checking the rows" : "Sending the file"} value={upload.fraction} />}
      {!source && <SourceStep onLoaded={loadSource} />}
      {source && <MappingStep key={source.name + source.text.length} fileName={source.name} headers={source.headers} initial={source.suggested} serverErrors={mappingFieldErrors(send.error)} isBusy={send.isPending} onSubmit={(m, r) => void checkRows(m, r)} onBack={restart} />}
      {source && preview && (
        <section className="card space-y-4" aria-labelledby="import-preview">
          <h2 id="import-preview">3 · Check and import</h2>
          <PreviewTable preview={preview} />
          {preview.counts.withErrors > 0 && <p className="text-sm text-warn-700">Correct the rows with errors in the file and choose it again; nothing is imported while any row has an error.</p>}
          <div className="flex gap-2">
            <button type="button" className="btn-accent" disabled={!isImportable || send.isPending} onClick={() => send.mutate({ mode: "commit", m: mapping })}>Import {preview.counts.rows} regions</button>
            <button type="button" className="btn-quiet" disabled={send.isPending} onClick={() => send.mutate({ mode: "preview", m: mapping })}>Check again</button>
          </div>
        </section>
      )}
    </div>
  );
}

export function CsvImport(props: CsvImportProps) {
  return <QueryClientProvider client={getQueryClient()}><Importer {...props} /></QueryClientProvider>;
}
