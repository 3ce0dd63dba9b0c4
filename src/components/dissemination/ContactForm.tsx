// Adds a contact to an organisation: name, e-mail and whether they get every bulletin.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { contactOrganisationsQuery, disseminationKeys } from "@/lib/query/dissemination";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { contactSchema, type ContactInput } from "@/lib/schemas/subscriptions";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";

type Values = z.input<typeof contactSchema>;

export function ContactForm() {
  const queryClient = useQueryClient();
  const orgs = useQuery(contactOrganisationsQuery());
  const { register, handleSubmit, formState, setError, reset } = useForm<
    Values,
    unknown,
    ContactInput
  >({
    resolver: zodResolver(contactSchema),
    defaultValues: { name: "", email: "", wantsBulletins: true },
  });
  const create = useMutation({
    mutationFn: (v: ContactInput) =>
      fetchJson<{ id: number; userId: number | null }>("/api/contacts", {
        method: "POST",
        json: v,
      }),
    onSuccess: () => {
      reset({ name: "", email: "", wantsBulletins: true });
      void queryClient.invalidateQueries({ queryKey: disseminationKeys.contacts });
    },
    onError: (err) => {
      if (err instanceof ApiError)
        for (const [f, m] of Object.entries(err.fields))
          setError(f as keyof Values, { message: m });
    },
  });
  const { errors } = formState;
  return (
    <form
      className="space-y-4"
      onSubmit={handleSubmit((v) => create.mutate(v))}
      noValidate
      aria-label="Add a contact"
    >
      {create.isError && <FormAlert tone="error">{create.error.message}</FormAlert>}
      {create.isSuccess && (
        <FormAlert tone="success">
          Contact added
          {create.data.userId ? " and linked to the subscriber account with the same address" : ""}.
        </FormAlert>
      )}
      <Field
        id="contact-org"
        label="Organisation"
        error={errors.organisationId?.message}
        hint={
          orgs.data?.organisations.length === 0
            ? "An administrator adds organisations first."
            : undefined
        }
      >
        <select
          className="field-input"
          {...describedBy("contact-org", errors.organisationId?.message)}
          {...register("organisationId")}
        >
          <option value="">Choose…</option>
          {orgs.data?.organisations.map((o) => (
            <option key={o.id} value={o.id}>
              {o.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="contact-name" label="Name" error={errors.name?.message}>
        <input
          className="field-input"
          {...describedBy("contact-name", errors.name?.message)}
          {...register("name")}
        />
      </Field>
      <Field id="contact-email" label="E-mail address" error={errors.email?.message}>
        <input
          type="email"
          className="field-input"
          {...describedBy("contact-email", errors.email?.message)}
          {...register("email")}
        />
      </Field>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" {...register("wantsBulletins")} /> Sends every bulletin (otherwise
        alerts only)
      </label>
      <button className="btn-primary" type="submit" disabled={create.isPending}>
        Add contact
      </button>
    </form>
  );
}
