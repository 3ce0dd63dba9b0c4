// The day's full-disk table: derived from the regions, adjustable cell by cell with a reason.
import { QueryClientProvider, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { FLARE_LEVELS, WINDOW_KEYS, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import { getQueryClient } from "@/lib/query/client";
import { ApiError, fetchJson } from "@/lib/query/fetch-json";
import { forecastKeys } from "@/lib/query/forecast";
import { pct } from "@/lib/ui/grid-format";
import { FormAlert } from "@/components/ui/FormAlert";

export interface FullDiskData {
  day: string;
  regionCount: number;
  regionsOnGuidance: string[];
  derived: ProbabilityGrid | null;
  guidance: ProbabilityGrid | null;
  adjustments: { values: Record<string, number>; reasons: Record<string, string> };
  final: ProbabilityGrid | null;
}

function Panel({ initial, canEdit }: { initial: FullDiskData; canEdit: boolean }) {
  const queryClient = useQueryClient();
  const { data } = useQuery({ queryKey: forecastKeys.fullDisk(initial.day), queryFn: () => fetchJson<FullDiskData>(`/api/days/${initial.day}/full-disk`), initialData: initial });
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState<Record<string, { value: string; reason: string }>>({});
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const save = useMutation({
    mutationFn: (body: { values: Record<string, number>; reasons: Record<string, string> }) => fetchJson<FullDiskData>(`/api/days/${initial.day}/full-disk`, { method: "PUT", json: body }),
    onSuccess: (next) => { queryClient.setQueryData(forecastKeys.fullDisk(initial.day), next); setEditing(false); setFieldErrors({}); },
    onError: (err) => setFieldErrors(err instanceof ApiError ? err.fields : {}),
  });
  const startEditing = () => {
    setDraft(Object.fromEntries(Object.entries(data.adjustments.values).map(([k, v]) => [k, { value: String(Math.round(v * 1000) / 10), reason: data.adjustments.reasons[k] ?? "" }])));
    setEditing(true);
  };
  const submit = () => {
    const values: Record<string, number> = {};
    const reasons: Record<string, string> = {};
    for (const [k, d] of Object.entries(draft)) {
      if (d.value.trim() === "") continue;
      values[k] = Math.round(Number(d.value) * 10) / 1000;
      reasons[k] = d.reason;
    }
    save.mutate({ values, reasons });
  };
  if (!data.derived) return <section className="card"><h2>Full disk</h2><p className="mt-2 text-sm text-ink-700">Appears once regions have probabilities.</p></section>;
  return (
    <section className="card" aria-labelledby="fd-title">
      <div className="flex items-baseline justify-between gap-3">
        <h2 id="fd-title">Full disk</h2>
        {canEdit && !editing && <button type="button" className="btn-quiet px-3 py-1" onClick={startEditing}>Adjust</button>}
      </div>
      <p className="mt-1 text-xs text-ink-700">1 − Π(1 − Pᵢ) over {data.regionCount} {data.regionCount === 1 ? "region" : "regions"}, treated as independent.{data.regionsOnGuidance.length > 0 && ` No finals yet for ${data.regionsOnGuidance.join(", ")}: counted with blended guidance.`}</p>
      {save.isError && <FormAlert tone="error">{save.error.message}</FormAlert>}
      <table className="data-table mt-3" data-testid="full-disk-table">
        <thead><tr><th>Level</th>{WINDOW_KEYS.map((w) => <th key={w} className="text-right">{w}</th>)}</tr></thead>
        <tbody>
          {FLARE_LEVELS.map((l) => (
            <tr key={l}>
              <th scope="row">{l}</th>
              {WINDOW_KEYS.map((w) => {
                const key = `${l}.${w}`;
                const adjusted = data.adjustments.values[key];
                const error = fieldErrors[`values.${key}`] ?? fieldErrors[`reasons.${key}`];
                return (
                  <td key={w} className="text-right">
                    {editing ? (
                      <div className="space-y-1">
                        <input aria-label={`Adjusted ${l} ${w} (%)`} inputMode="decimal" className="field-input num w-20 text-right" placeholder={pct(data.derived![l][w])} value={draft[key]?.value ?? ""} onChange={(e) => setDraft((d) => ({ ...d, [key]: { value: e.target.value, reason: d[key]?.reason ?? "" } }))} />
                        {(draft[key]?.value ?? "") !== "" && <input aria-label={`Reason for ${l} ${w}`} className="field-input text-xs" placeholder="Reason" value={draft[key]?.reason ?? ""} onChange={(e) => setDraft((d) => ({ ...d, [key]: { value: d[key]?.value ?? "", reason: e.target.value } }))} />}
                        {error && <p className="field-error text-xs" role="alert">{error}</p>}
                      </div>
                    ) : (
                      <>
                        <span className="num font-semibold">{pct(data.final![l][w])}</span>
                        {adjusted !== undefined && <div className="text-[11px] text-gold-600" title={data.adjustments.reasons[key]}>adjusted from {pct(data.derived![l][w])}</div>}
                        <div className="text-[11px] text-ink-700">guidance {data.guidance ? pct(data.guidance[l][w]) : "—"}</div>
                      </>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      {editing && <div className="mt-3 flex gap-2"><button type="button" className="btn-primary" onClick={submit} disabled={save.isPending}>Save adjustments</button><button type="button" className="btn-quiet" onClick={() => setEditing(false)}>Cancel</button></div>}
    </section>
  );
}

export function FullDiskPanel(props: { initial: FullDiskData; canEdit: boolean }) {
  return <QueryClientProvider client={getQueryClient()}><Panel {...props} /></QueryClientProvider>;
}
