// The CSV import's state: the loaded file, the remembered mapping, preview and commit requests.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Papa from "papaparse";
import { useMemo, useState } from "react";
import {
  suggestColumnMapping,
  type ColumnMapping,
  type ImportCommitted,
  type ImportField,
  type ImportPreview,
} from "@/lib/schemas/csv-import";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { postJsonWithProgress, type UploadProgress } from "./send-with-progress";

const MAPPING_URL = "/api/assessments/import-mapping";
const MAPPING_KEY = ["assessments", "import-mapping"] as const;

export interface LoadedSource {
  text: string;
  name: string;
  headers: string[];
  suggested: ColumnMapping;
}

function readHeaders(text: string): string[] {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), {
    preview: 1,
    skipEmptyLines: "greedy",
  });
  return (parsed.data[0] ?? []).map((h) => h.trim());
}

/** Server field messages about the mapping, keyed by field ("mapping.areaMsh" → "areaMsh"). */
export function mappingFieldErrors(err: unknown): Partial<Record<ImportField, string>> {
  if (!(err instanceof ApiError)) return {};
  const entries = Object.entries(err.fields).filter(([k]) => k.startsWith("mapping."));
  return Object.fromEntries(entries.map(([k, m]) => [k.slice("mapping.".length), m]));
}

function describeFailure(err: Error, mode: "preview" | "commit"): string {
  if (!(err instanceof ApiError)) return err.message;
  if (mode === "commit" && err.status === 422) {
    return `${err.message} Check the file again to see each row's problem.`;
  }
  return err.fields.csv ? `${err.message} ${err.fields.csv}` : err.message;
}

export function useCsvImport(day: string, initialMapping: ColumnMapping) {
  const queryClient = useQueryClient();
  const remembered = useQuery({
    queryKey: MAPPING_KEY,
    queryFn: () => fetchJson<{ mapping: ColumnMapping }>(MAPPING_URL),
    initialData: { mapping: initialMapping },
  });
  const [source, setSource] = useState<LoadedSource | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping>({});
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [upload, setUpload] = useState<UploadProgress | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  const saveMapping = useMutation({
    mutationFn: (m: ColumnMapping) =>
      fetchJson<{ mapping: ColumnMapping }>(MAPPING_URL, { method: "PUT", json: { mapping: m } }),
    onSuccess: (saved) => queryClient.setQueryData(MAPPING_KEY, saved),
  });
  const send = useMutation({
    mutationFn: ({ mode, m }: { mode: "preview" | "commit"; m: ColumnMapping }) =>
      postJsonWithProgress<ImportPreview | ImportCommitted>(
        "/api/assessments/import",
        { forecastDay: day, csv: source?.text ?? "", mapping: m, mode },
        setUpload,
      ),
    onMutate: () => {
      setMessage(null);
      setUpload({ fraction: 0 });
    },
    onSettled: () => setUpload(null),
    onSuccess: (answer, { mode }) => {
      if (mode === "preview") setPreview(answer as ImportPreview);
    },
    onError: (err, { mode }) => {
      if (Object.keys(mappingFieldErrors(err)).length > 0) setPreview(null);
      setMessage(describeFailure(err, mode));
    },
  });

  const loadSource = (text: string, name: string) => {
    const headers = readHeaders(text);
    if (headers.every((h) => h === "")) {
      return setMessage(`${name} has no header row: the first line must name the columns.`);
    }
    setMessage(null);
    setPreview(null);
    send.reset();
    const suggested = suggestColumnMapping(headers, remembered.data.mapping);
    setSource({ text, name, headers, suggested });
  };
  const checkRows = async (m: ColumnMapping, remember: boolean) => {
    setMapping(m);
    if (remember) await saveMapping.mutateAsync(m).catch(() => undefined);
    send.mutate({ mode: "preview", m });
  };
  const restart = () => {
    setSource(null);
    setPreview(null);
    setMessage(null);
    send.reset();
    saveMapping.reset();
  };
  const mappingErrors = useMemo(() => mappingFieldErrors(send.error), [send.error]);
  const committed =
    send.isSuccess && send.variables?.mode === "commit" ? (send.data as ImportCommitted) : null;

  return {
    source,
    preview,
    upload,
    message,
    committed,
    saveMapping,
    isBusy: send.isPending,
    mappingErrors,
    loadSource,
    checkRows,
    recheck: () => send.mutate({ mode: "preview", m: mapping }),
    commit: () => send.mutate({ mode: "commit", m: mapping }),
    restart,
  };
}
