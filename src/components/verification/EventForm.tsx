// Enter an observed event by hand, or correct a stored one (with a reason); both are audited.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { verificationKeys, type EventView } from "@/lib/query/verification";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import {
  eventCorrectionSchema,
  eventEntrySchema,
  FLUX_CONVENTION_LABELS,
  FLUX_CONVENTIONS,
} from "@/lib/schemas/verification";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";
import { toFormDefaults, toRequestBody, type EventFormValues } from "./event-form-values";
import { useHydrated } from "./use-hydrated";

const FIELDS = [
  ["start", "Start (UTC)"],
  ["peak", "Peak (UTC)"],
  ["end", "End (UTC)"],
] as const;

export function EventForm({ event, onDone }: { event: EventView | null; onDone: () => void }) {
  const isHydrated = useHydrated();
  const queryClient = useQueryClient();
  const [outcome, setOutcome] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const isCorrection = event !== null;
  const defaults = toFormDefaults(event);
  const form = useForm<EventFormValues>({
    resolver: zodResolver(
      isCorrection ? eventCorrectionSchema : eventEntrySchema,
    ) as unknown as Resolver<EventFormValues>,
    defaultValues: defaults,
  });
  const { register, handleSubmit, formState, setError, reset } = form;
  const save = useMutation({
    mutationFn: (v: EventFormValues) =>
      isCorrection
        ? fetchJson<EventView>(`/api/events/${event.id}`, {
            method: "PATCH",
            json: toRequestBody(v, true),
          })
        : fetchJson<EventView>("/api/events", { method: "POST", json: toRequestBody(v, false) }),
    onSuccess: (saved) => {
      void queryClient.invalidateQueries({ queryKey: verificationKeys.allEvents });
      setOutcome({
        tone: "success",
        text: `${isCorrection ? "Corrected" : "Stored"}: ${saved.originalClass} peaking ${saved.peakTime.slice(0, 16).replace("T", " ")} UTC.`,
      });
      if (!isCorrection) reset(defaults);
      else onDone();
    },
    onError: (err) => {
      if (err instanceof ApiError)
        for (const [field, message] of Object.entries(err.fields))
          setError(field as keyof EventFormValues, { message });
      setOutcome({ tone: "error", text: err.message });
    },
  });
  const { errors, isSubmitting } = formState;
  const title = isCorrection ? `Correct event #${event.id}` : "Enter an event by hand";
  return (
    <form
      aria-label={title}
      noValidate
      className="grid gap-4 md:grid-cols-3"
      onSubmit={handleSubmit((v) => {
        setOutcome(null);
        save.mutate(v);
      })}
    >
      <h3 className="font-semibold md:col-span-3">{title}</h3>
      {outcome && (
        <div className="md:col-span-3">
          <FormAlert tone={outcome.tone}>{outcome.text}</FormAlert>
        </div>
      )}
      {FIELDS.map(([name, label]) => (
        <Field
          key={name}
          id={`event-${name}`}
          label={label}
          error={errors[name]?.message}
          hint="e.g. 2031-05-01T06:24Z"
        >
          <input
            className="field-input num"
            autoComplete="off"
            {...describedBy(`event-${name}`, errors[name]?.message, true)}
            {...register(name)}
          />
        </Field>
      ))}
      <Field id="event-class" label="GOES class" error={errors.goesClass?.message}>
        <input
          className="field-input num"
          autoComplete="off"
          {...describedBy("event-class", errors.goesClass?.message)}
          {...register("goesClass")}
        />
      </Field>
      <Field id="event-region" label="Region (optional)" error={errors.regionNumber?.message}>
        <input
          className="field-input num"
          autoComplete="off"
          {...describedBy("event-region", errors.regionNumber?.message)}
          {...register("regionNumber")}
        />
      </Field>
      {isCorrection ? (
        <Field id="event-reason" label="Reason for the correction" error={errors.reason?.message}>
          <input
            className="field-input"
            autoComplete="off"
            {...describedBy("event-reason", errors.reason?.message)}
            {...register("reason")}
          />
        </Field>
      ) : (
        <Field
          id="event-convention"
          label="Flux convention of the class"
          error={errors.convention?.message}
        >
          <select
            className="field-input"
            {...describedBy("event-convention", errors.convention?.message)}
            {...register("convention")}
          >
            {FLUX_CONVENTIONS.map((c) => (
              <option key={c} value={c}>
                {FLUX_CONVENTION_LABELS[c]}
              </option>
            ))}
          </select>
        </Field>
      )}
      {isCorrection && (
        <p className="text-xs text-ink-700 md:col-span-3">
          The class stays in the list's convention ({FLUX_CONVENTION_LABELS[event.convention]}).
        </p>
      )}
      <div className="flex gap-3 md:col-span-3">
        <button
          type="submit"
          className="btn-primary"
          disabled={!isHydrated || isSubmitting || save.isPending}
        >
          {save.isPending ? "Saving…" : isCorrection ? "Save the correction" : "Store the event"}
        </button>
        {isCorrection && (
          <button type="button" className="btn-quiet" onClick={onDone}>
            Cancel
          </button>
        )}
      </div>
    </form>
  );
}
