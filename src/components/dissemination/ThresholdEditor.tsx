// A contact's alert thresholds: the list with change and remove, and a form to add one. Used by
// the desk (any contact) and the subscriber portal (one's own), through different endpoints.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { FLARE_LEVELS } from "@/lib/domain/flare-levels";
import type { ThresholdItem } from "@/lib/query/dissemination";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import {
  describeThreshold,
  THRESHOLD_WINDOWS,
  thresholdSchema,
  type ThresholdInput,
} from "@/lib/schemas/subscriptions";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";

type Values = z.input<typeof thresholdSchema>;

interface Props {
  /** e.g. /api/contacts/12/thresholds or /api/subscriptions/thresholds */
  baseUrl: string;
  thresholds: ThresholdItem[];
  idPrefix: string;
  onChanged: () => void;
}

function ThresholdRow({
  t,
  baseUrl,
  onChanged,
  onError,
}: {
  t: ThresholdItem;
  baseUrl: string;
  onChanged: () => void;
  onError: (m: string) => void;
}) {
  const [percent, setPercent] = useState(String(Math.round(t.probability * 100)));
  const save = useMutation({
    mutationFn: () =>
      fetchJson(`${baseUrl}/${t.id}`, {
        method: "PUT",
        json: { level: t.level, windowHours: t.windowHours, probabilityPercent: percent },
      }),
    onSuccess: onChanged,
    onError: (e) => onError(e.message),
  });
  const remove = useMutation({
    mutationFn: () => fetchJson(`${baseUrl}/${t.id}`, { method: "DELETE" }),
    onSuccess: onChanged,
    onError: (e) => onError(e.message),
  });
  const inputId = `threshold-${t.id}-percent`;
  return (
    <li className="flex flex-wrap items-center gap-2 py-1.5 text-sm">
      <span className="min-w-56">{describeThreshold(t.level, t.windowHours, t.probability)}</span>
      <label htmlFor={inputId} className="sr-only">
        New percentage for {t.level} within {t.windowHours} h
      </label>
      <input
        id={inputId}
        type="number"
        min={1}
        max={100}
        className="field-input w-20 py-1"
        value={percent}
        onChange={(e) => setPercent(e.target.value)}
      />
      <span>%</span>
      <button
        type="button"
        className="btn-quiet px-2 py-1"
        disabled={save.isPending}
        onClick={() => save.mutate()}
      >
        Save
      </button>
      <button
        type="button"
        className="btn-quiet px-2 py-1"
        disabled={remove.isPending}
        onClick={() => remove.mutate()}
      >
        Remove
      </button>
    </li>
  );
}

export function ThresholdEditor({ baseUrl, thresholds, idPrefix, onChanged }: Props) {
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<
    Values,
    unknown,
    ThresholdInput
  >({
    resolver: zodResolver(thresholdSchema),
    defaultValues: { level: "M+", windowHours: 24, probabilityPercent: 40 },
  });
  const add = useMutation({
    mutationFn: (v: ThresholdInput) => fetchJson(baseUrl, { method: "POST", json: v }),
    onSuccess: () => {
      setMessage(null);
      reset();
      onChanged();
    },
    onError: (err) => {
      if (err instanceof ApiError)
        for (const [f, m] of Object.entries(err.fields))
          setError(f as keyof Values, { message: m });
      setMessage(err.message);
    },
  });
  const { errors } = formState;
  const id = (name: string) => `${idPrefix}-${name}`;
  return (
    <div className="space-y-3">
      {message && <FormAlert tone="error">{message}</FormAlert>}
      {thresholds.length === 0 ? (
        <p className="text-sm text-ink-700">No alert thresholds: only bulletins are sent.</p>
      ) : (
        <ul className="divide-y divide-line" aria-label="Alert thresholds">
          {thresholds.map((t) => (
            <ThresholdRow
              key={`${t.id}-${t.probability}`}
              t={t}
              baseUrl={baseUrl}
              onChanged={() => {
                setMessage(null);
                onChanged();
              }}
              onError={setMessage}
            />
          ))}
        </ul>
      )}
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={handleSubmit((v) => add.mutate(v))}
        noValidate
        aria-label="Add an alert threshold"
      >
        <Field id={id("level")} label="Level" error={errors.level?.message}>
          <select
            className="field-input"
            {...describedBy(id("level"), errors.level?.message)}
            {...register("level")}
          >
            {FLARE_LEVELS.map((l) => (
              <option key={l} value={l}>
                {l}
              </option>
            ))}
          </select>
        </Field>
        <Field id={id("window")} label="Window" error={errors.windowHours?.message}>
          <select
            className="field-input"
            {...describedBy(id("window"), errors.windowHours?.message)}
            {...register("windowHours")}
          >
            {THRESHOLD_WINDOWS.map((h) => (
              <option key={h} value={h}>
                {h} h
              </option>
            ))}
          </select>
        </Field>
        <Field
          id={id("percent")}
          label="Alert at or above (%)"
          error={errors.probabilityPercent?.message}
        >
          <input
            type="number"
            min={1}
            max={100}
            className="field-input w-28"
            {...describedBy(id("percent"), errors.probabilityPercent?.message)}
            {...register("probabilityPercent")}
          />
        </Field>
        <button type="submit" className="btn-quiet" disabled={add.isPending}>
          Add threshold
        </button>
      </form>
    </div>
  );
}
