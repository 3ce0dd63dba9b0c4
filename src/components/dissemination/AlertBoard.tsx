// The duty officers' alert board: every alert's acknowledgement state per contact, live (polled),
// filterable by bulletin and state, with the chase list of those not yet acknowledged.
import { QueryClientProvider, useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { getQueryClient } from "@/lib/query/client";
import { alertBoardQuery } from "@/lib/query/dissemination";
import { ALERT_STATES, describeThreshold, type AlertState } from "@/lib/schemas/subscriptions";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { STATE_CHIPS, STATE_LABELS, VIA_LABELS } from "./alert-labels";
import { ChaseList } from "./ChaseList";

function Board({ initialBulletin }: { initialBulletin?: number }) {
  const [bulletin, setBulletin] = useState<number | undefined>(initialBulletin);
  const [state, setState] = useState<AlertState | undefined>(undefined);
  const board = useQuery(alertBoardQuery({ bulletin, state }));
  const data = board.data;
  const now = data ? new Date(data.generatedAt) : new Date();
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-3" role="search">
        <label className="text-sm">
          Bulletin
          <select
            className="field-input mt-1"
            value={bulletin ?? ""}
            onChange={(e) => setBulletin(e.target.value ? Number(e.target.value) : undefined)}
          >
            <option value="">All recent bulletins</option>
            {data?.bulletins.map((b) => (
              <option key={b.id} value={b.id}>
                {b.forecastDay} v{b.version}
                {b.issueTime ? `, issued ${formatUtc(b.issueTime)}` : ""} ({b.alertCount} alerts)
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          State
          <select
            className="field-input mt-1"
            value={state ?? ""}
            onChange={(e) => setState((e.target.value || undefined) as AlertState | undefined)}
          >
            <option value="">Any state</option>
            {ALERT_STATES.map((s) => (
              <option key={s} value={s}>
                {STATE_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        {data && (
          <p className="text-xs text-ink-700" aria-live="polite">
            Updated {formatUtc(data.generatedAt, true)}
          </p>
        )}
      </div>
      {board.isError && <FormAlert tone="error">{board.error.message}</FormAlert>}
      {data && (
        <>
          <ul className="flex flex-wrap gap-2" aria-label="Alerts by state">
            {ALERT_STATES.map((s) => (
              <li key={s} className={`chip ${STATE_CHIPS[s]}`}>
                {STATE_LABELS[s]}:{" "}
                <span className="num ml-1" data-testid={`state-${s}`}>
                  {data.counts[s]}
                </span>
              </li>
            ))}
          </ul>
          <section className="card">
            <h2 className="mb-2">To chase</h2>
            <ChaseList alerts={data.chase} now={now} />
          </section>
          <section className="card overflow-x-auto">
            <h2 className="mb-3">Alerts</h2>
            {data.isTruncated && (
              <p className="mb-2 text-xs text-ink-700">
                Showing the latest 500 alerts; choose a bulletin to see all of its alerts.
              </p>
            )}
            <table className="data-table">
              <thead>
                <tr>
                  <th>Alert</th>
                  <th>Contact</th>
                  <th>Threshold</th>
                  <th className="text-right">Forecast</th>
                  <th>Raised</th>
                  <th>State</th>
                  <th>E-mail</th>
                </tr>
              </thead>
              <tbody>
                {data.alerts.map((a) => (
                  <tr key={a.id} data-testid={`alert-${a.id}`}>
                    <td className="num text-xs">
                      {a.reference}
                      <div>
                        {a.forecastDay} v{a.bulletinVersion}
                      </div>
                    </td>
                    <td>
                      {a.contactName}
                      <div className="text-xs text-ink-700">{a.organisationName}</div>
                    </td>
                    <td className="text-xs">
                      {describeThreshold(a.level, a.windowHours, a.thresholdProbability)}
                    </td>
                    <td className="num text-right">{Math.round(a.probability * 100)} %</td>
                    <td className="text-xs">{formatUtc(a.raisedAt)}</td>
                    <td>
                      <span className={`chip ${STATE_CHIPS[a.state]}`}>
                        {STATE_LABELS[a.state]}
                      </span>
                      {a.acknowledgedAt && (
                        <div className="text-xs text-ink-700">
                          {formatUtc(a.acknowledgedAt)} via{" "}
                          {VIA_LABELS[a.acknowledgedVia ?? ""] ?? a.acknowledgedVia}
                        </div>
                      )}
                    </td>
                    <td className="text-xs">{a.mailStatus ?? "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            {data.alerts.length === 0 && (
              <p className="py-3 text-sm text-ink-700">No alerts match.</p>
            )}
          </section>
        </>
      )}
    </div>
  );
}

export function AlertBoard({ initialBulletin }: { initialBulletin?: number }) {
  return (
    <QueryClientProvider client={getQueryClient()}>
      <Board initialBulletin={initialBulletin} />
    </QueryClientProvider>
  );
}
