// Starts the bulletin of a forecast day; if the day already has an open one, links to it.
import { QueryClientProvider, useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { createBulletin } from "@/lib/query/bulletins";
import { getQueryClient } from "@/lib/query/client";
import { ApiError } from "@/lib/query/fetch-json";
import { createBulletinSchema } from "@/lib/schemas/bulletins";
import { FormAlert } from "@/components/ui/FormAlert";

function Form({ today }: { today: string }) {
  const [day, setDay] = useState(today);
  const [error, setError] = useState<{ message: string; existingId?: string } | null>(null);
  const create = useMutation({
    mutationFn: (forecastDay: string) => createBulletin(forecastDay),
    onSuccess: (b) => window.location.assign(`/bulletins/${b.id}`),
    onError: (err) =>
      setError({
        message: err.message,
        existingId: err instanceof ApiError ? err.fields.existingId : undefined,
      }),
  });
  const submit = (e: { preventDefault(): void }) => {
    e.preventDefault();
    const parsed = createBulletinSchema.safeParse({ forecastDay: day });
    if (!parsed.success)
      return setError({ message: parsed.error.issues[0]?.message ?? "Check the day." });
    setError(null);
    create.mutate(parsed.data.forecastDay);
  };
  return (
    <form
      onSubmit={submit}
      className="flex flex-wrap items-end gap-2"
      aria-label="Start a bulletin"
    >
      <label className="text-sm">
        Forecast day (UTC)
        <input
          type="date"
          className="field-input mt-1"
          value={day}
          onChange={(e) => setDay(e.target.value)}
          required
        />
      </label>
      <button type="submit" className="btn-primary" disabled={create.isPending}>
        Start bulletin
      </button>
      {error && (
        <div className="basis-full">
          <FormAlert tone="error">
            {error.message}
            {error.existingId && (
              <>
                {" "}
                <a className="underline" href={`/bulletins/${error.existingId}`}>
                  Open bulletin #{error.existingId}
                </a>
              </>
            )}
          </FormAlert>
        </div>
      )}
    </form>
  );
}

export function NewBulletinForm(props: { today: string }) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <Form {...props} />
    </QueryClientProvider>
  );
}
