// Step 3 of the CSV import: every row as the desk read it, errors highlighted, warnings listed.
import { useState } from "react";
import {
  IMPORT_FIELD_LABELS,
  type ImportField,
  type ImportPreview,
  type ImportRowPreview,
} from "@/lib/schemas/csv-import";
import { formatPercent } from "@/lib/ui/format";

const SHOWN: readonly ImportField[] = [
  "region",
  "location",
  "areaMsh",
  "spotCount",
  "mcintosh",
  "mountWilson",
];

function labelOf(field: string): string {
  return field === "row" ? "Row" : (IMPORT_FIELD_LABELS[field as ImportField] ?? field);
}

function RowChecks({ row }: { row: ImportRowPreview }) {
  const errors = Object.entries(row.errors);
  if (errors.length === 0 && row.warnings.length === 0)
    return <span className="text-calm-600">Ready</span>;
  return (
    <ul className="space-y-0.5">
      {errors.map(([field, message]) => (
        <li key={field} className="text-warn-700">
          <strong>{labelOf(field)}:</strong> {message}
        </li>
      ))}
      {row.warnings.map((w) => (
        <li key={w.field + w.message} className="text-gold-600">
          Check: {w.message}
        </li>
      ))}
    </ul>
  );
}

export function PreviewTable({ preview }: { preview: ImportPreview }) {
  const [isProblemsOnly, setProblemsOnly] = useState(false);
  const { counts } = preview;
  const rows = isProblemsOnly
    ? preview.rows.filter((r) => Object.keys(r.errors).length > 0 || r.warnings.length > 0)
    : preview.rows;
  return (
    <div className="space-y-3">
      <p className="text-sm" role="status">
        <span className="num">{counts.rows}</span> rows:{" "}
        <span className="num text-calm-600">{counts.valid}</span> ready,{" "}
        <span className="num text-warn-700">{counts.withErrors}</span> with errors,{" "}
        <span className="num text-gold-600">{counts.withWarnings}</span> with warnings.
      </p>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={isProblemsOnly}
          onChange={(e) => setProblemsOnly(e.target.checked)}
        />{" "}
        Show only rows with errors or warnings
      </label>
      <div className="max-h-[32rem] overflow-auto rounded-md border">
        <table className="data-table">
          <caption className="sr-only">Rows of the file as read for {preview.forecastDay}</caption>
          <thead className="sticky top-0 bg-white">
            <tr>
              <th scope="col">Row</th>
              {SHOWN.map((f) => (
                <th key={f} scope="col">
                  {IMPORT_FIELD_LABELS[f]}
                </th>
              ))}
              <th scope="col">M+ 24 h guidance</th>
              <th scope="col">Checks</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => {
              const hasErrors = Object.keys(r.errors).length > 0;
              return (
                <tr
                  key={r.row}
                  className={hasErrors ? "bg-warn-100/60" : undefined}
                  aria-invalid={hasErrors || undefined}
                >
                  <td className="num">{r.row}</td>
                  {SHOWN.map((f) => (
                    <td
                      key={f}
                      className={
                        r.errors[f]
                          ? "font-semibold text-warn-700 underline decoration-wavy"
                          : undefined
                      }
                    >
                      {r.values[f] || <span className="text-ink-700/60">—</span>}
                    </td>
                  ))}
                  <td className="num" title={r.guidance.reason ?? undefined}>
                    {r.guidance.mPlus24h === null ? (
                      <span className="font-sans text-xs text-ink-700">{r.guidance.reason}</span>
                    ) : (
                      formatPercent(r.guidance.mPlus24h)
                    )}
                  </td>
                  <td className="text-xs">
                    <RowChecks row={r} />
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
