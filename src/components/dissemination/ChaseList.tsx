// Contacts who have not acknowledged, oldest first, with a way to record an acknowledgement the
// duty officer took by phone or radio (a note says how).
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { disseminationKeys, type BoardAlert } from "@/lib/query/dissemination";
import { fetchJson } from "@/lib/query/fetch-json";
import { describeThreshold } from "@/lib/schemas/subscriptions";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { describeAge, STATE_CHIPS, STATE_LABELS } from "./alert-labels";

function RecordAck({ alert }: { alert: BoardAlert }) {
  const queryClient = useQueryClient();
  const [note, setNote] = useState("");
  const record = useMutation({
    mutationFn: () => fetchJson(`/api/alerts/${alert.id}/ack`, { method: "POST", json: { note } }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: disseminationKeys.board }),
  });
  const id = `ack-note-${alert.id}`;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={id} className="sr-only">
        How {alert.contactName} acknowledged
      </label>
      <input
        id={id}
        className="field-input w-48 py-1"
        placeholder="e.g. confirmed by phone"
        value={note}
        onChange={(e) => setNote(e.target.value)}
      />
      <button
        type="button"
        className="btn-quiet px-3 py-1"
        disabled={record.isPending || note.trim().length < 3}
        onClick={() => record.mutate()}
      >
        Record acknowledgement
      </button>
      {record.isError && <FormAlert tone="error">{record.error.message}</FormAlert>}
    </div>
  );
}

export function ChaseList({ alerts, now }: { alerts: BoardAlert[]; now: Date }) {
  if (alerts.length === 0)
    return (
      <p className="text-sm text-ink-700">
        Everyone alerted has acknowledged (or the alert's window has ended).
      </p>
    );
  return (
    <ul className="divide-y divide-line" aria-label="Contacts to chase">
      {alerts.map((a) => (
        <li
          key={a.id}
          className="flex flex-wrap items-start justify-between gap-3 py-3"
          data-testid={`chase-${a.contactEmail}`}
        >
          <div className="text-sm">
            <div className="font-medium">
              {a.contactName}{" "}
              <span className="font-normal text-ink-700">· {a.organisationName}</span>
            </div>
            <div className="text-xs break-all text-ink-700">{a.contactEmail}</div>
            <div className="mt-1">
              {describeThreshold(a.level, a.windowHours, a.thresholdProbability)} — forecast{" "}
              {Math.round(a.probability * 100)} %
            </div>
            <div className="text-xs text-ink-700">
              Raised {formatUtc(a.raisedAt)} ({describeAge(a.raisedAt, now)} ago) · {a.reference}
            </div>
          </div>
          <div className="flex flex-col items-end gap-2">
            <span className={`chip ${STATE_CHIPS[a.state]}`}>{STATE_LABELS[a.state]}</span>
            <RecordAck alert={a} />
          </div>
        </li>
      ))}
    </ul>
  );
}
