// Step 1 of the CSV import: choose a file (read with FileReader, with progress) or paste the text.
import { useState } from "react";
import { IMPORT_LIMITS } from "@/lib/schemas/csv-import";
import { FormAlert } from "@/components/ui/FormAlert";
import { ProgressBar } from "@/components/ui/ProgressBar";

interface SourceStepProps {
  onLoaded: (text: string, name: string) => void;
}

const LIMIT_TEXT = `${IMPORT_LIMITS.maxBytes / (1024 * 1024)} MiB`;

export function SourceStep({ onLoaded }: SourceStepProps) {
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [pasted, setPasted] = useState("");

  const readFile = (file: File) => {
    setError(null);
    if (file.size > IMPORT_LIMITS.maxBytes)
      return setError(
        `${file.name} is ${(file.size / (1024 * 1024)).toFixed(1)} MiB; import at most ${LIMIT_TEXT} at a time (split the file).`,
      );
    if (file.size === 0) return setError(`${file.name} is empty.`);
    const reader = new FileReader();
    reader.onprogress = (e) => setProgress(e.lengthComputable ? e.loaded / e.total : null);
    reader.onerror = () => {
      setProgress(null);
      setError(`${file.name} could not be read: ${reader.error?.message ?? "unknown error"}.`);
    };
    reader.onload = () => {
      setProgress(1);
      onLoaded(String(reader.result ?? ""), file.name);
    };
    setProgress(0);
    reader.readAsText(file, "utf-8");
  };

  const usePasted = () => {
    setError(null);
    if (pasted.trim() === "") return setError("Paste the CSV text first, header row included.");
    if (new Blob([pasted]).size > IMPORT_LIMITS.maxBytes)
      return setError(`The pasted text is larger than ${LIMIT_TEXT}; import it in parts.`);
    onLoaded(pasted, "pasted text");
  };

  return (
    <section className="card space-y-4" aria-labelledby="import-source">
      <h2 id="import-source">1 · Choose the file</h2>
      <p className="text-sm text-ink-700">
        A CSV file with a header row naming its columns, one region per row, at most{" "}
        {IMPORT_LIMITS.maxRows.toLocaleString("en")} rows and {LIMIT_TEXT}.
      </p>
      {error && <FormAlert tone="error">{error}</FormAlert>}
      <div>
        <label htmlFor="import-file" className="field-label">
          CSV file
        </label>
        <input
          id="import-file"
          type="file"
          accept=".csv,text/csv,text/plain"
          className="block text-sm"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) readFile(f);
            e.target.value = "";
          }}
        />
      </div>
      {progress !== null && <ProgressBar label="Reading the file" value={progress} />}
      <div>
        <label htmlFor="import-paste" className="field-label">
          …or paste the CSV text
        </label>
        <textarea
          id="import-paste"
          rows={5}
          className="field-input font-mono"
          value={pasted}
          onChange={(e) => setPasted(e.target.value)}
          placeholder="Region,Location,Area,Spots,McIntosh,Mount Wilson"
        />
        <button type="button" className="btn-quiet mt-2" onClick={usePasted}>
          Use the pasted text
        </button>
      </div>
    </section>
  );
}
