// The delivery counts of one bulletin as a bar and a legend, and the words for each kind of e-mail.
import type { StatusCounts } from "@/lib/query/dissemination";

export const KIND_LABELS: Record<string, string> = {
  bulletin: "Bulletin",
  alert: "Alert",
  "alert-reminder": "Reminder",
  "alert-escalation": "Escalation",
};
const SEGMENTS: { key: keyof StatusCounts; label: string; className: string }[] = [
  { key: "sent", label: "Sent", className: "bg-calm-600" },
  { key: "sending", label: "Sending", className: "bg-gold-500" },
  { key: "queued", label: "Queued", className: "bg-ink-100" },
  { key: "failed", label: "Failed", className: "bg-warn-700" },
];

export function CountsBar({ counts }: { counts: StatusCounts }) {
  return (
    <div>
      <div className="flex h-4 w-full overflow-hidden rounded border" aria-hidden="true">
        {SEGMENTS.map(
          (s) =>
            counts[s.key] > 0 && (
              <div
                key={s.key}
                className={s.className}
                style={{ width: `${(counts[s.key] / Math.max(1, counts.total)) * 100}%` }}
              />
            ),
        )}
      </div>
      <dl className="mt-2 flex flex-wrap gap-x-6 gap-y-1 text-sm" aria-live="polite">
        {SEGMENTS.map((s) => (
          <div key={s.key} className="flex gap-2">
            <dt>{s.label}</dt>
            <dd className="num font-semibold" data-testid={`count-${s.key}`}>
              {counts[s.key]}
            </dd>
          </div>
        ))}
        <div className="flex gap-2">
          <dt>Total</dt>
          <dd className="num">{counts.total}</dd>
        </div>
      </dl>
    </div>
  );
}
