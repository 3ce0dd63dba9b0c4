// Live delivery progress of one bulletin: counts that update every 1.5 s, the messages waiting
// to be retried, the failures, and a way to put failures back in the queue.
import { QueryClientProvider, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { getQueryClient } from "@/lib/query/client";
import {
  deliveryProgressQuery,
  disseminationKeys,
  LIVE_INTERVAL_MS,
  type DeliveryProgress as Progress,
} from "@/lib/query/dissemination";
import { fetchJson } from "@/lib/query/fetch-json";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { CountsBar, KIND_LABELS } from "./DeliveryCounts";

function Progress({ bulletinId, initial }: { bulletinId: number; initial: Progress }) {
  const queryClient = useQueryClient();
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const query = deliveryProgressQuery(bulletinId);
  const progress = useQuery({
    ...query,
    initialData: initial,
    // Fast while anything is pending; slow once the bulletin is fully out.
    refetchInterval: (q) =>
      (q.state.data?.counts.queued ?? 1) + (q.state.data?.counts.sending ?? 0) > 0
        ? LIVE_INTERVAL_MS
        : 10_000,
  });
  const retry = useMutation({
    mutationFn: (body: { bulletinId: number } | { ids: number[] }) =>
      fetchJson<{ requeued: number }>("/api/deliveries/retry", { method: "POST", json: body }),
    onSuccess: (r) => {
      setMessage({ tone: "success", text: `${r.requeued} deliveries are back in the queue.` });
      void queryClient.invalidateQueries({ queryKey: disseminationKeys.delivery(bulletinId) });
    },
    onError: (e) => setMessage({ tone: "error", text: e.message }),
  });
  const data = progress.data;
  return (
    <div className="space-y-6">
      <section className="card space-y-4">
        <CountsBar counts={data.counts} />
        <table className="data-table">
          <thead>
            <tr>
              <th>Kind</th>
              <th className="text-right">Sent</th>
              <th className="text-right">Pending</th>
              <th className="text-right">Failed</th>
            </tr>
          </thead>
          <tbody>
            {Object.entries(data.byKind).map(([kind, c]) => (
              <tr key={kind}>
                <td>{KIND_LABELS[kind] ?? kind}</td>
                <td className="num text-right">{c.sent}</td>
                <td className="num text-right">{c.queued + c.sending}</td>
                <td className="num text-right">{c.failed}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="text-xs text-ink-700">
          Updated {formatUtc(data.generatedAt, true)}
          {progress.isError ? " — the last update failed; retrying." : ""}
        </p>
      </section>
      {message && <FormAlert tone={message.tone}>{message.text}</FormAlert>}
      {data.retrying.length > 0 && (
        <section className="card">
          <h2 className="mb-3">Waiting to be retried</h2>
          <table className="data-table">
            <thead>
              <tr>
                <th>Recipient</th>
                <th>Kind</th>
                <th className="text-right">Attempts</th>
                <th>Next attempt</th>
                <th>Last answer</th>
              </tr>
            </thead>
            <tbody>
              {data.retrying.map((r) => (
                <tr key={r.id}>
                  <td className="break-all">{r.toEmail}</td>
                  <td>{KIND_LABELS[r.kind] ?? r.kind}</td>
                  <td className="num text-right">{r.attempts}</td>
                  <td>{formatUtc(r.nextAttemptAt, true)}</td>
                  <td className="text-xs">{r.lastError}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      )}
      <section className="card">
        <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
          <h2>Failures</h2>
          <button
            type="button"
            className="btn-accent"
            disabled={data.failures.length === 0 || retry.isPending}
            onClick={() => retry.mutate({ bulletinId })}
          >
            Retry all failed
          </button>
        </div>
        {data.failures.length === 0 ? (
          <p className="text-sm text-ink-700">No failed deliveries.</p>
        ) : (
          <table className="data-table">
            <thead>
              <tr>
                <th>Recipient</th>
                <th>Kind</th>
                <th className="text-right">Attempts</th>
                <th>Reason</th>
                <th>
                  <span className="sr-only">Retry</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {data.failures.map((f) => (
                <tr key={f.id} data-testid={`failure-${f.toEmail}`}>
                  <td className="break-all">{f.toEmail}</td>
                  <td>{KIND_LABELS[f.kind] ?? f.kind}</td>
                  <td className="num text-right">{f.attempts}</td>
                  <td className="text-xs">{f.lastError}</td>
                  <td>
                    <button
                      type="button"
                      className="btn-quiet px-3 py-1"
                      disabled={retry.isPending}
                      onClick={() => retry.mutate({ ids: [f.id] })}
                    >
                      Retry
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}

export function DeliveryProgress(props: { bulletinId: number; initial: Progress }) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <Progress {...props} />
    </QueryClientProvider>
  );
}
