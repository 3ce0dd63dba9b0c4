// CSV import of contacts: choose a file, see every row with its problems, then import all rows
// or none. The server checks the same rules again when importing.
import { useState } from "react";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { CONTACT_IMPORT_MAX_BYTES, CONTACT_IMPORT_MAX_ROWS } from "@/lib/schemas/subscriptions";
import { FormAlert } from "@/components/ui/FormAlert";

interface PreviewRow {
  line: number;
  organisationName: string;
  name: string;
  email: string;
  wantsBulletins: boolean;
  thresholds: { level: string; windowHours: number; probabilityPercent: number }[];
  errors: string[];
}

interface Preview {
  rows: PreviewRow[];
  fileErrors: string[];
  validCount: number;
  invalidCount: number;
}

type Outcome =
  | { committed: false; preview: Preview }
  | { committed: true; created: number; thresholds: number; preview: Preview };

const countOf = (n: number, noun: string) => `${n} ${noun}${n === 1 ? "" : "s"}`;

export function ContactImport() {
  const [csv, setCsv] = useState<string | null>(null);
  const [fileName, setFileName] = useState("");
  const [preview, setPreview] = useState<Preview | null>(null);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const [isBusy, setBusy] = useState(false);

  async function send(mode: "preview" | "commit", text: string) {
    setBusy(true);
    setMessage(null);
    try {
      const outcome = await fetchJson<Outcome>("/api/contacts/import", {
        method: "POST",
        json: { csv: text, mode },
      });
      setPreview(outcome.preview);
      if (outcome.committed) {
        setMessage({
          tone: "success",
          text: `Imported ${countOf(outcome.created, "contact")} with ${countOf(outcome.thresholds, "threshold")}.`,
        });
        setCsv(null);
      }
    } catch (err) {
      setMessage({
        tone: "error",
        text: err instanceof ApiError && err.fields.csv ? err.fields.csv : (err as Error).message,
      });
    } finally {
      setBusy(false);
    }
  }

  async function choose(file: File | undefined) {
    setPreview(null);
    setMessage(null);
    if (!file) return;
    if (file.size > CONTACT_IMPORT_MAX_BYTES)
      return setMessage({
        tone: "error",
        text: `The file is larger than ${CONTACT_IMPORT_MAX_BYTES / 1024} KiB.`,
      });
    const text = await file.text();
    setFileName(file.name);
    setCsv(text);
    await send("preview", text);
  }

  const canImport =
    !!csv &&
    !!preview &&
    preview.fileErrors.length === 0 &&
    preview.invalidCount === 0 &&
    preview.validCount > 0;
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-700">
        Columns: <code>organisation, name, email, bulletins, thresholds</code> — bulletins is yes or
        no (yes when empty); thresholds like <code>M+ 24h 40%; X 24h 10%</code>. At most{" "}
        {CONTACT_IMPORT_MAX_ROWS} rows and {CONTACT_IMPORT_MAX_BYTES / 1024} KiB. Organisations must
        exist already.
      </p>
      <label className="field-label" htmlFor="contact-csv">
        CSV file
      </label>
      <input
        id="contact-csv"
        type="file"
        accept=".csv,text/csv"
        className="text-sm"
        onChange={(e) => {
          const file = e.target.files?.[0];
          // Cleared so choosing the same file again, once corrected, is read again.
          e.target.value = "";
          void choose(file);
        }}
      />
      {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
      {preview &&
        preview.fileErrors.map((e) => (
          <FormAlert key={e} tone="error">
            {e}
          </FormAlert>
        ))}
      {preview && preview.rows.length > 0 && (
        <>
          <p className="text-sm" role="status">
            {fileName}: {countOf(preview.validCount, "row")} ready, {preview.invalidCount} with
            problems
            {preview.invalidCount ? " — nothing is imported until every row is right." : "."}
          </p>
          <div className="max-h-[28rem] overflow-auto">
            <table className="data-table">
              <thead>
                <tr>
                  <th>Row</th>
                  <th>Organisation</th>
                  <th>Name</th>
                  <th>E-mail</th>
                  <th>Bulletins</th>
                  <th>Thresholds</th>
                  <th>Problems</th>
                </tr>
              </thead>
              <tbody>
                {preview.rows.map((r) => (
                  <tr key={r.line} className={r.errors.length ? "bg-warn-100/60" : undefined}>
                    <td className="num">{r.line}</td>
                    <td>{r.organisationName}</td>
                    <td>{r.name}</td>
                    <td className="break-all">{r.email}</td>
                    <td>{r.wantsBulletins ? "yes" : "no"}</td>
                    <td className="text-xs">
                      {r.thresholds
                        .map((t) => `${t.level} ${t.windowHours} h ≥ ${t.probabilityPercent} %`)
                        .join("; ")}
                    </td>
                    <td className="text-xs text-warn-700">{r.errors.join(" ")}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
      <button
        type="button"
        className="btn-primary"
        disabled={!canImport || isBusy}
        onClick={() => csv && void send("commit", csv)}
      >
        {isBusy
          ? "Working…"
          : canImport
            ? `Import ${countOf(preview.validCount, "contact")}`
            : "Import"}
      </button>
    </div>
  );
}
