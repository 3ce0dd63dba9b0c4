// Invite a person by e-mail with a role (and an organisation for subscribers).
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { ROLE_LABELS, ROLES } from "@/lib/auth/roles";
import { inviteSchema } from "@/lib/schemas/users";
import { adminKeys, organisationsQuery } from "@/lib/query/admin";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";

type InviteFormValues = z.input<typeof inviteSchema>;
type InviteResult = { userId: number; emailSent: boolean; emailError?: string };

export function InviteForm() {
  const queryClient = useQueryClient();
  const orgs = useQuery(organisationsQuery());
  const [outcome, setOutcome] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const form = useForm<InviteFormValues>({ resolver: zodResolver(inviteSchema), defaultValues: { role: "forecaster", email: "", name: "" } });
  const { register, handleSubmit, formState, setError, reset, watch } = form;
  const role = watch("role");

  const invite = useMutation({
    mutationFn: (values: InviteFormValues) => fetchJson<InviteResult>("/api/admin/users", { method: "POST", json: values }),
    onSuccess: (result, values) => {
      void queryClient.invalidateQueries({ queryKey: adminKeys.users });
      setOutcome(result.emailSent
        ? { tone: "success", text: `Invitation sent to ${values.email}. The link is valid for 72 hours.` }
        : { tone: "error", text: `The account was created but the e-mail failed: ${result.emailError}. Use "Resend invitation".` });
      reset({ role: values.role, email: "", name: "" });
    },
    onError: (err) => {
      if (err instanceof ApiError) for (const [field, message] of Object.entries(err.fields)) setError(field as keyof InviteFormValues, { message });
      setOutcome({ tone: "error", text: err.message });
    },
  });

  const { errors, isSubmitting } = formState;
  return (
    <form onSubmit={handleSubmit((v) => { setOutcome(null); invite.mutate(v); })} noValidate className="grid gap-4 md:grid-cols-2" aria-label="Invite a person">
      {outcome && <div className="md:col-span-2"><FormAlert tone={outcome.tone}>{outcome.text}</FormAlert></div>}
      <Field id="invite-name" label="Name" error={errors.name?.message}>
        <input className="field-input" autoComplete="off" {...describedBy("invite-name", errors.name?.message)} {...register("name")} />
      </Field>
      <Field id="invite-email" label="E-mail address" error={errors.email?.message}>
        <input type="email" className="field-input" autoComplete="off" {...describedBy("invite-email", errors.email?.message)} {...register("email")} />
      </Field>
      <Field id="invite-role" label="Role" error={errors.role?.message}>
        <select className="field-input" {...describedBy("invite-role", errors.role?.message)} {...register("role")}>
          {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
        </select>
      </Field>
      <Field id="invite-org" label="Organisation (subscribers)" error={errors.organisationId?.message} hint={role === "subscriber" ? "Required for subscribers." : "Only subscribers belong to an organisation."}>
        <select className="field-input" disabled={role !== "subscriber"} {...describedBy("invite-org", errors.organisationId?.message, true)}
          {...register("organisationId", { setValueAs: (v) => (v === "" || v === undefined ? null : Number(v)) })}>
          <option value="">—</option>
          {orgs.data?.organisations.map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
        </select>
      </Field>
      <div className="md:col-span-2">
        <button type="submit" className="btn-primary" disabled={isSubmitting || invite.isPending}>{invite.isPending ? "Sending invitation…" : "Send invitation"}</button>
      </div>
    </form>
  );
}
