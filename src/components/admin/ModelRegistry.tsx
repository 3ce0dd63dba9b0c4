// The model registry: every version grouped by key, activate one per key, import new versions.
import {
  QueryClientProvider,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from "@tanstack/react-query";
import { useState } from "react";
import {
  MODEL_KIND_LABELS,
  type ModelVersionView,
  type RegistryModelKind,
} from "@/lib/schemas/models";
import { getQueryClient } from "@/lib/query/client";
import { fetchJson } from "@/lib/query/fetch-json";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { ModelImportForm } from "./models/ModelImportForm";

const modelsQuery = (initial: ModelVersionView[]) =>
  queryOptions({
    queryKey: ["admin", "models"],
    queryFn: () => fetchJson<{ models: ModelVersionView[] }>("/api/admin/models"),
    initialData: { models: initial },
  });

function groupByKey(models: ModelVersionView[]): [string, ModelVersionView[]][] {
  const groups = new Map<string, ModelVersionView[]>();
  for (const m of models) groups.set(m.key, [...(groups.get(m.key) ?? []), m]);
  return [...groups.entries()];
}

function kindLabel(kind: string): string {
  return MODEL_KIND_LABELS[kind as RegistryModelKind] ?? kind;
}

function Registry({ initial }: { initial: ModelVersionView[] }) {
  const queryClient = useQueryClient();
  const query = modelsQuery(initial);
  const list = useQuery(query);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const toggle = useMutation({
    mutationFn: (v: { model: ModelVersionView; isActive: boolean }) =>
      fetchJson<{ versions: ModelVersionView[] }>(`/api/admin/models/${v.model.id}`, {
        method: "PATCH",
        json: { isActive: v.isActive },
      }),
    onSuccess: (_r, v) => {
      setMessage({
        tone: "success",
        text: v.isActive
          ? `${v.model.key} ${v.model.version} is now the active version; guidance uses it from the next scoring.`
          : `${v.model.key} ${v.model.version} is switched off; the key gives no guidance until a version is active.`,
      });
      void queryClient.invalidateQueries({ queryKey: query.queryKey });
    },
    onError: (err) => setMessage({ tone: "error", text: err.message }),
  });
  const refresh = () => void queryClient.invalidateQueries({ queryKey: query.queryKey });

  return (
    <div className="space-y-6">
      <div className="space-y-4">
        {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
        {list.isError && <FormAlert tone="error">{list.error.message}</FormAlert>}
        {groupByKey(list.data.models).map(([key, versions]) => (
          <section key={key} className="card overflow-x-auto" aria-labelledby={`key-${key}`}>
            <h2 id={`key-${key}`} className="mb-2 font-mono">
              {key}
            </h2>
            <table className="data-table">
              <thead>
                <tr>
                  <th>Version</th>
                  <th>Kind and name</th>
                  <th>Provenance</th>
                  <th>Created</th>
                  <th>Status</th>
                  <th>
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {versions.map((m) => (
                  <tr key={m.id}>
                    <td className="num">
                      {m.version}{" "}
                      {m.isDemo && (
                        <span
                          className="chip ml-1 border-gold-500 bg-gold-100 text-ink-900"
                          title="demo — invented for the scenario"
                        >
                          demo
                        </span>
                      )}
                    </td>
                    <td>
                      <span className="block text-xs text-ink-700">{kindLabel(m.kind)}</span>
                      {m.name}
                    </td>
                    <td className="max-w-xs text-xs whitespace-pre-wrap">{m.provenance}</td>
                    <td className="num text-xs whitespace-nowrap">{formatUtc(m.createdAt)}</td>
                    <td>
                      {m.isActive ? (
                        <span className="chip border-calm-600 bg-calm-100 text-calm-600">
                          active
                        </span>
                      ) : (
                        <span className="chip text-ink-700">inactive</span>
                      )}
                    </td>
                    <td className="text-right">
                      <button
                        type="button"
                        className="btn-quiet px-3 py-1"
                        disabled={toggle.isPending}
                        onClick={() => toggle.mutate({ model: m, isActive: !m.isActive })}
                        aria-label={`${m.isActive ? "Deactivate" : "Activate"} ${m.key} ${m.version}`}
                      >
                        {m.isActive ? "Deactivate" : "Activate"}
                      </button>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
        ))}
      </div>
      <ModelImportForm onImported={refresh} />
    </div>
  );
}

export function ModelRegistry({ initial }: { initial: ModelVersionView[] }) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <Registry initial={initial} />
    </QueryClientProvider>
  );
}
