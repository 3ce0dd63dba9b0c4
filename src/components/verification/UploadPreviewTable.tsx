// The rows of an upload as the desk read them: problems first, each with its message.
import type { UploadPreview } from "@/lib/schemas/verification";

interface Props {
  preview: UploadPreview;
  columns: { key: string; label: string }[];
  /** Label of the row note (e.g. the class in true flux); omitted when rows have none. */
  noteLabel?: string;
}

export function UploadPreviewTable({ preview, columns, noteLabel }: Props) {
  const { counts } = preview;
  return (
    <div className="space-y-3" aria-label="Upload preview">
      <p className="text-sm" data-testid="preview-counts">
        {counts.rows} rows: <strong className="text-calm-600">{counts.valid} ready</strong>
        {counts.withErrors > 0 && (
          <>
            , <strong className="text-warn-700">{counts.withErrors} with errors</strong>
          </>
        )}
        {counts.duplicates > 0 && (
          <>
            , <strong className="text-gold-600">{counts.duplicates} duplicates</strong>
          </>
        )}
        {preview.period.first && preview.period.last && (
          <span className="text-ink-700">
            {" "}
            · {preview.period.first.slice(0, 16).replace("T", " ")} to{" "}
            {preview.period.last.slice(0, 16).replace("T", " ")} UTC
          </span>
        )}
      </p>
      {preview.isTruncated && (
        <p className="text-xs text-ink-700">
          Showing the rows with problems and the first ready rows of {counts.rows}.
        </p>
      )}
      <div className="max-h-96 overflow-auto">
        <table className="data-table">
          <thead>
            <tr>
              <th>Row</th>
              {columns.map((c) => (
                <th key={c.key}>{c.label}</th>
              ))}
              {noteLabel && <th>{noteLabel}</th>}
              <th>Check</th>
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((r) => {
              const problems = Object.entries(r.errors);
              return (
                <tr
                  key={r.row}
                  className={
                    problems.length
                      ? r.isDuplicate
                        ? "bg-gold-100/50"
                        : "bg-warn-100/50"
                      : undefined
                  }
                >
                  <td className="num">{r.row}</td>
                  {columns.map((c) => (
                    <td key={c.key} className="num text-xs">
                      {r.values[c.key] ?? ""}
                    </td>
                  ))}
                  {noteLabel && <td className="num text-xs">{r.note ?? ""}</td>}
                  <td className="text-xs">
                    {problems.length === 0 ? (
                      <span className="text-calm-600">Ready</span>
                    ) : (
                      <ul>
                        {problems.map(([field, message]) => (
                          <li
                            key={field}
                            className={r.isDuplicate ? "text-gold-600" : "text-warn-700"}
                          >
                            {message}
                          </li>
                        ))}
                      </ul>
                    )}
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
