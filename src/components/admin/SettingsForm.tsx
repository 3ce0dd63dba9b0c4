// Office settings form (name, contact line, public bulletins, guidance margin, alert reminder).
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { officeSettingsSchema, type OfficeSettings } from "@/lib/schemas/settings";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";

type Values = z.input<typeof officeSettingsSchema>;

export function SettingsForm({ initial }: { initial: OfficeSettings }) {
  const [status, setStatus] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<Values, unknown, OfficeSettings>({ resolver: zodResolver(officeSettingsSchema), defaultValues: initial });
  const { errors, isSubmitting } = formState;
  const onSubmit = handleSubmit(async (values) => {
    setStatus(null);
    try {
      await fetchJson("/api/admin/settings", { method: "PUT", json: values });
      setStatus({ tone: "success", text: "Settings saved." });
    } catch (err) {
      if (err instanceof ApiError) for (const [f, m] of Object.entries(err.fields)) setError(f as keyof Values, { message: m });
      setStatus({ tone: "error", text: (err as Error).message });
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-2xl space-y-4" aria-label="Office settings">
      {status && <FormAlert tone={status.tone}>{status.text}</FormAlert>}
      <Field id="officeName" label="Office name" error={errors.officeName?.message}><input className="field-input" {...describedBy("officeName", errors.officeName?.message)} {...register("officeName")} /></Field>
      <Field id="contactLine" label="Contact line on bulletins" error={errors.contactLine?.message}><input className="field-input" {...describedBy("contactLine", errors.contactLine?.message)} {...register("contactLine")} /></Field>
      <Field id="guidanceMarginPoints" label="Reason required when a final differs from guidance by more than (percentage points)" error={errors.guidanceMarginPoints?.message}>
        <input type="number" step="1" className="field-input w-32" {...describedBy("guidanceMarginPoints", errors.guidanceMarginPoints?.message)} {...register("guidanceMarginPoints")} />
      </Field>
      <Field id="alertReminderMinutes" label="Remind a contact about an unacknowledged alert after (minutes)" error={errors.alertReminderMinutes?.message}>
        <input type="number" step="1" className="field-input w-32" {...describedBy("alertReminderMinutes", errors.alertReminderMinutes?.message)} {...register("alertReminderMinutes")} />
      </Field>
      <label className="flex items-center gap-2 text-sm"><input type="checkbox" {...register("isPublicBulletinsAllowed")} /> Issued bulletins may be read without signing in (print page and feed)</label>
      <button type="submit" className="btn-primary" disabled={isSubmitting}>Save settings</button>
    </form>
  );
}
