// Upload of an external forecast series: name, provenance and CSV; a checked preview, then one
// all-or-nothing commit. The series is then scored beside the office's own forecasts.
import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { type UploadPreview } from "@/lib/schemas/verification";
import {
  EXTERNAL_UPLOAD_LIMITS,
  type ExternalUploadCommitted,
} from "@/lib/schemas/verification-report";
import { FormAlert } from "@/components/ui/FormAlert";
import { readChosenFile } from "./read-file";
import { UploadPreviewTable } from "./UploadPreviewTable";
import { useHydrated } from "./use-hydrated";

const COLUMNS = [
  { key: "issueTime", label: "Issue time" },
  { key: "level", label: "Level" },
  { key: "window", label: "Window" },
  { key: "probability", label: "Probability" },
  { key: "region", label: "Region" },
];

export function ExternalUpload() {
  const isHydrated = useHydrated();
  const [name, setName] = useState("");
  const [provenance, setProvenance] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<UploadPreview | null>(null);
  const [committed, setCommitted] = useState<ExternalUploadCommitted | null>(null);
  const [error, setError] = useState<string | null>(null);

  const send = useMutation({
    mutationFn: async (mode: "preview" | "commit") => {
      if (!file) throw new Error("Choose a CSV file first.");
      const csv = await readChosenFile(file, EXTERNAL_UPLOAD_LIMITS.maxBytes);
      return {
        mode,
        answer: await fetchJson<UploadPreview | ExternalUploadCommitted>(
          "/api/verification/external",
          { method: "POST", json: { name, provenance, csv, mode } },
        ),
      };
    },
    onSuccess: ({ mode, answer }) => {
      setError(null);
      if (mode === "preview") setPreview(answer as UploadPreview);
      else {
        setCommitted(answer as ExternalUploadCommitted);
        setPreview(null);
      }
    },
    onError: (err) =>
      setError(
        err instanceof ApiError && Object.keys(err.fields).length
          ? `${err.message} ${Object.values(err.fields).slice(0, 3).join(" ")}`
          : err.message,
      ),
  });

  const isReady = preview !== null && preview.counts.valid > 0 && preview.counts.withErrors === 0;
  return (
    <form
      className="space-y-4"
      aria-label="Upload an external series"
      onSubmit={(e) => {
        e.preventDefault();
        setCommitted(null);
        send.mutate("preview");
      }}
    >
      <div className="grid gap-4 md:grid-cols-2">
        <label className="text-sm">
          Series name
          <input
            className="field-input mt-1"
            value={name}
            onChange={(e) => setName(e.target.value)}
            placeholder="e.g. Partner desk daily probabilities"
          />
        </label>
        <label className="text-sm">
          CSV file
          <input
            type="file"
            accept=".csv,text/csv"
            className="field-input mt-1"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setPreview(null);
            }}
          />
        </label>
        <label className="text-sm md:col-span-2">
          Provenance (who issued it, how it was obtained, any licence)
          <textarea
            className="field-input mt-1"
            rows={2}
            value={provenance}
            onChange={(e) => setProvenance(e.target.value)}
          />
        </label>
      </div>
      <p className="field-hint">
        Columns: issue time (UTC ISO-8601), level (C+, M+ or X), window (24, 48 or 72 h),
        probability (0.35 or 35%), region (empty for the full disk).
      </p>
      {error && <FormAlert tone="error">{error}</FormAlert>}
      {committed && (
        <FormAlert tone="success">
          Stored {committed.stored} forecasts.{" "}
          <a
            className="underline"
            href={`/verification?source=${encodeURIComponent(committed.source)}&reference=forecaster`}
          >
            Score this series against the forecasters
          </a>
          .
        </FormAlert>
      )}
      <div className="flex gap-3">
        <button type="submit" className="btn-quiet" disabled={!isHydrated || send.isPending}>
          Check the file
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!isReady || send.isPending}
          onClick={() => send.mutate("commit")}
        >
          {preview ? `Store ${preview.counts.valid} forecasts` : "Store forecasts"}
        </button>
      </div>
      {preview && <UploadPreviewTable preview={preview} columns={COLUMNS} />}
    </form>
  );
}
