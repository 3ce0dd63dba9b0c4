// Step 3 of the CSV import: the checked rows and the one button that imports them all.
import type { ImportPreview } from "@/lib/schemas/csv-import";
import { PreviewTable } from "./PreviewTable";

interface PreviewStepProps {
  preview: ImportPreview;
  isBusy: boolean;
  onImport: () => void;
  onRecheck: () => void;
}

export function PreviewStep({ preview, isBusy, onImport, onRecheck }: PreviewStepProps) {
  const { rows, withErrors } = preview.counts;
  const isImportable = withErrors === 0 && rows > 0;
  return (
    <section className="card space-y-4" aria-labelledby="import-preview">
      <h2 id="import-preview">3 · Check and import</h2>
      <PreviewTable preview={preview} />
      {withErrors > 0 && (
        <p className="text-sm text-warn-700">
          Correct the rows with errors in the file and choose it again; nothing is imported while
          any row has an error.
        </p>
      )}
      <div className="flex gap-2">
        <button
          type="button"
          className="btn-accent"
          disabled={!isImportable || isBusy}
          onClick={onImport}
        >
          Import {rows} regions
        </button>
        <button type="button" className="btn-quiet" disabled={isBusy} onClick={onRecheck}>
          Check again
        </button>
      </div>
    </section>
  );
}
