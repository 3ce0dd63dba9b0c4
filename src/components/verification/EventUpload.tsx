// Upload of an observed event list: name, flux convention, file; a checked preview, then one
// all-or-nothing commit.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { verificationKeys } from "@/lib/query/verification";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import {
  EVENT_UPLOAD_LIMITS,
  FLUX_CONVENTION_LABELS,
  FLUX_CONVENTIONS,
  type EventUploadCommitted,
  type FluxConventionName,
  type UploadPreview,
} from "@/lib/schemas/verification";
import { FormAlert } from "@/components/ui/FormAlert";
import { readChosenFile } from "./read-file";
import { UploadPreviewTable } from "./UploadPreviewTable";
import { useHydrated } from "./use-hydrated";

const COLUMNS = [
  { key: "start", label: "Start" },
  { key: "peak", label: "Peak" },
  { key: "end", label: "End" },
  { key: "goesClass", label: "Class" },
  { key: "region", label: "Region" },
];

export function EventUpload() {
  const isHydrated = useHydrated();
  const queryClient = useQueryClient();
  const [name, setName] = useState("");
  const [convention, setConvention] = useState<FluxConventionName | "">("");
  const [file, setFile] = useState<File | null>(null);
  const [isSkippingDuplicates, setSkippingDuplicates] = useState(false);
  const [preview, setPreview] = useState<UploadPreview | null>(null);
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);

  const send = useMutation({
    mutationFn: async (mode: "preview" | "commit") => {
      if (!file) throw new Error("Choose a file first.");
      if (!convention) throw new Error("Choose the flux convention of the list.");
      const content = await readChosenFile(file, EVENT_UPLOAD_LIMITS.maxBytes);
      const format = file.name.toLowerCase().endsWith(".json") ? "json" : "csv";
      const body = {
        name: name || file.name,
        convention,
        format,
        content,
        mode,
        skipDuplicates: isSkippingDuplicates,
      };
      return {
        mode,
        answer: await fetchJson<UploadPreview | EventUploadCommitted>("/api/events/uploads", {
          method: "POST",
          json: body,
        }),
      };
    },
    onSuccess: ({ mode, answer }) => {
      if (mode === "preview") {
        setPreview(answer as UploadPreview);
        setMessage(null);
        return;
      }
      const done = answer as EventUploadCommitted;
      setPreview(null);
      setFile(null);
      setMessage({
        tone: "success",
        text: `Stored ${done.stored} events${done.skippedDuplicates ? `; ${done.skippedDuplicates} already stored were left out` : ""}.`,
      });
      void queryClient.invalidateQueries({ queryKey: verificationKeys.allEvents });
    },
    onError: (err) =>
      setMessage({
        tone: "error",
        text:
          err instanceof ApiError && Object.keys(err.fields).length
            ? `${err.message} ${Object.values(err.fields).slice(0, 3).join(" ")}`
            : err.message,
      }),
  });

  const isReady =
    preview !== null &&
    preview.counts.valid > 0 &&
    preview.counts.withErrors === 0 &&
    (preview.counts.duplicates === 0 || isSkippingDuplicates);
  return (
    <form
      className="space-y-4"
      aria-label="Upload an event list"
      onSubmit={(e) => {
        e.preventDefault();
        send.mutate("preview");
      }}
    >
      <div className="grid gap-4 md:grid-cols-2">
        <label className="text-sm">
          List name
          <input
            className="field-input mt-1"
            value={name}
            onChange={(e) => setName(e.target.value)}
            placeholder="e.g. Office flare list 2031 Q2"
          />
        </label>
        <label className="text-sm">
          File (CSV with a header row, or JSON)
          <input
            type="file"
            accept=".csv,.json,text/csv,application/json"
            className="field-input mt-1"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setPreview(null);
            }}
          />
        </label>
      </div>
      <fieldset className="text-sm">
        <legend className="field-label">Flux convention of the classes in the file</legend>
        {FLUX_CONVENTIONS.map((c) => (
          <label key={c} className="mr-6 inline-flex items-center gap-2">
            <input
              type="radio"
              name="convention"
              value={c}
              checked={convention === c}
              onChange={() => {
                setConvention(c);
                setPreview(null);
              }}
            />
            {FLUX_CONVENTION_LABELS[c]}
          </label>
        ))}
        <p className="field-hint">
          Columns: start, peak, end (UTC ISO-8601), class (e.g. M2.5), region (optional).
          Legacy-scaled classes are divided by 0.7 to true flux.
        </p>
      </fieldset>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={isSkippingDuplicates}
          onChange={(e) => setSkippingDuplicates(e.target.checked)}
        />
        Skip events already stored (same peak time and peak flux)
      </label>
      {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
      <div className="flex gap-3">
        <button type="submit" className="btn-quiet" disabled={!isHydrated || send.isPending}>
          {send.isPending && !preview ? "Checking…" : "Check the file"}
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!isReady || send.isPending}
          onClick={() => send.mutate("commit")}
        >
          {preview ? `Store ${preview.counts.valid} events` : "Store events"}
        </button>
      </div>
      {preview && (
        <UploadPreviewTable preview={preview} columns={COLUMNS} noteLabel="True-flux class" />
      )}
    </form>
  );
}
