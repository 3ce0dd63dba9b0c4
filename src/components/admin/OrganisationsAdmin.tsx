// Subscriber organisations: add one, see how many contacts each has.
import { zodResolver } from "@hookform/resolvers/zod";
import { QueryClientProvider, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { organisationSchema, type OrganisationInput } from "@/lib/schemas/users";
import { getQueryClient } from "@/lib/query/client";
import { adminKeys, organisationsQuery } from "@/lib/query/admin";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { describedBy, Field } from "@/components/ui/Field";
import { FormAlert } from "@/components/ui/FormAlert";

export const SECTOR_LABELS: Record<OrganisationInput["sector"], string> = {
  "power-grid": "Power grid",
  "hf-radio": "HF radio (aviation / maritime)",
  gnss: "GNSS / positioning",
  "satellite-ops": "Satellite operations",
  other: "Other",
};

function Organisations() {
  const queryClient = useQueryClient();
  const list = useQuery(organisationsQuery());
  const { register, handleSubmit, formState, setError, reset } = useForm<OrganisationInput>({ resolver: zodResolver(organisationSchema), defaultValues: { sector: "power-grid" } });
  const create = useMutation({
    mutationFn: (v: OrganisationInput) => fetchJson<{ id: number }>("/api/admin/organisations", { method: "POST", json: v }),
    onSuccess: () => { reset({ name: "", sector: "power-grid" }); void queryClient.invalidateQueries({ queryKey: adminKeys.organisations }); },
    onError: (err) => { if (err instanceof ApiError) for (const [f, m] of Object.entries(err.fields)) setError(f as keyof OrganisationInput, { message: m }); },
  });
  const { errors } = formState;
  return (
    <div className="grid gap-6 md:grid-cols-[1fr_2fr]">
      <form className="card space-y-4" onSubmit={handleSubmit((v) => create.mutate(v))} noValidate aria-label="Add an organisation">
        <h2>Add an organisation</h2>
        {create.isError && <FormAlert tone="error">{create.error.message}</FormAlert>}
        {create.isSuccess && <FormAlert tone="success">Organisation added.</FormAlert>}
        <Field id="org-name" label="Name" error={errors.name?.message}><input className="field-input" {...describedBy("org-name", errors.name?.message)} {...register("name")} /></Field>
        <Field id="org-sector" label="Sector" error={errors.sector?.message}>
          <select className="field-input" {...describedBy("org-sector", errors.sector?.message)} {...register("sector")}>
            {Object.entries(SECTOR_LABELS).map(([k, l]) => <option key={k} value={k}>{l}</option>)}
          </select>
        </Field>
        <button className="btn-primary" type="submit" disabled={create.isPending}>Add organisation</button>
      </form>
      <section className="card overflow-x-auto">
        <h2 className="mb-3">Organisations</h2>
        <table className="data-table">
          <thead><tr><th>Name</th><th>Sector</th><th className="text-right">People</th></tr></thead>
          <tbody>
            {list.data?.organisations.map((o) => (
              <tr key={o.id}><td>{o.name}</td><td>{SECTOR_LABELS[o.sector as OrganisationInput["sector"]] ?? o.sector}</td><td className="num text-right">{o.memberCount}</td></tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}

export function OrganisationsAdmin() {
  return <QueryClientProvider client={getQueryClient()}><Organisations /></QueryClientProvider>;
}
