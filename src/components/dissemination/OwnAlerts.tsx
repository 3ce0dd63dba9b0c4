// A subscriber's alerts in the portal: open ones with an Acknowledge button, then recent ones.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { disseminationKeys, type AlertItem } from "@/lib/query/dissemination";
import { fetchJson } from "@/lib/query/fetch-json";
import { describeThreshold } from "@/lib/schemas/subscriptions";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { VIA_LABELS } from "./alert-labels";

function AlertLine({ alert }: { alert: AlertItem }) {
  return (
    <div className="text-sm">
      <div className="font-medium">
        {describeThreshold(alert.level, alert.windowHours, alert.thresholdProbability)}: forecast{" "}
        {Math.round(alert.probability * 100)} %
      </div>
      <div className="text-xs text-ink-700">
        {alert.reference} · bulletin {alert.forecastDay} v{alert.bulletinVersion}
        {alert.issueTime ? `, issued ${formatUtc(alert.issueTime)}` : ""}
        {alert.windowEndsAt ? ` · window ends ${formatUtc(alert.windowEndsAt)}` : ""}
      </div>
    </div>
  );
}

export function OpenAlerts({ alerts }: { alerts: AlertItem[] }) {
  const queryClient = useQueryClient();
  const ack = useMutation({
    mutationFn: (id: number) =>
      fetchJson(`/api/subscriptions/alerts/${id}/ack`, { method: "POST" }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: disseminationKeys.own }),
  });
  if (alerts.length === 0)
    return <p className="text-sm text-ink-700">No alert is waiting for your acknowledgement.</p>;
  return (
    <ul className="divide-y divide-line" aria-label="Alerts to acknowledge">
      {ack.isError && <FormAlert tone="error">{ack.error.message}</FormAlert>}
      {alerts.map((a) => (
        <li key={a.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
          <AlertLine alert={a} />
          <button
            type="button"
            className="btn-accent"
            disabled={ack.isPending}
            onClick={() => ack.mutate(a.id)}
          >
            Acknowledge {a.reference}
          </button>
        </li>
      ))}
    </ul>
  );
}

export function RecentAlerts({ alerts }: { alerts: AlertItem[] }) {
  if (alerts.length === 0) return <p className="text-sm text-ink-700">No earlier alerts.</p>;
  return (
    <ul className="divide-y divide-line">
      {alerts.map((a) => (
        <li key={a.id} className="flex flex-wrap items-center justify-between gap-3 py-2">
          <AlertLine alert={a} />
          <span className="text-xs text-ink-700">
            {a.acknowledgedAt
              ? `Acknowledged ${formatUtc(a.acknowledgedAt)} (${VIA_LABELS[a.acknowledgedVia ?? ""] ?? a.acknowledgedVia})`
              : "Window ended unacknowledged"}
          </span>
        </li>
      ))}
    </ul>
  );
}
