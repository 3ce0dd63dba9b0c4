// The forecaster's final probabilities (percent) with a reason field wherever they leave guidance.
import { FLARE_LEVELS, WINDOW_KEYS, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import { cellKey } from "@/lib/domain/finals";
import type { PercentGrid } from "@/lib/ui/grid-format";
import { pct } from "@/lib/ui/grid-format";

interface Props {
  values: PercentGrid;
  reasons: Record<string, string>;
  blended: ProbabilityGrid | null;
  needsReason: Set<string>;
  errors: Record<string, string>;
  onValue: (level: string, window: string, value: string) => void;
  onReason: (key: string, value: string) => void;
  onCopyGuidance: () => void;
}

export function FinalsGrid({ values, reasons, blended, needsReason, errors, onValue, onReason, onCopyGuidance }: Props) {
  return (
    <section className="card" aria-labelledby="finals-title">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="finals-title">Final probabilities (%)</h2>
        <button type="button" className="btn-quiet px-3 py-1" onClick={onCopyGuidance} disabled={!blended}>Start from blended guidance</button>
      </div>
      <table className="data-table mt-3">
        <thead><tr><th>Level</th>{WINDOW_KEYS.map((w) => <th key={w}>{w}</th>)}</tr></thead>
        <tbody>
          {FLARE_LEVELS.map((l) => (
            <tr key={l}>
              <th scope="row" className="text-sm">{l}</th>
              {WINDOW_KEYS.map((w) => {
                const key = cellKey(l, w);
                const error = errors[`finals.${key}`];
                return (
                  <td key={w}>
                    <label className="sr-only" htmlFor={`final-${key}`}>Final {l} {w} (%)</label>
                    <input id={`final-${key}`} inputMode="decimal" className="field-input num w-20 text-right" value={values[l][w]} aria-invalid={error ? true : undefined} aria-describedby={error ? `final-${key}-error` : undefined} onChange={(e) => onValue(l, w, e.target.value)} />
                    <div className="mt-0.5 text-[11px] text-ink-700">guidance {blended ? pct(blended[l][w]) : "—"}</div>
                    {error && <p id={`final-${key}-error`} className="field-error text-xs" role="alert">{error}</p>}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      {needsReason.size > 0 && (
        <div className="mt-4 space-y-3">
          <p className="text-sm font-medium">Reasons for leaving the guidance</p>
          {[...needsReason].map((key) => {
            const error = errors[`finalReasons.${key}`];
            return (
              <div key={key}>
                <label className="field-label" htmlFor={`reason-${key}`}>Reason for {key.replace(".", " ")}</label>
                <input id={`reason-${key}`} className="field-input" value={reasons[key] ?? ""} aria-invalid={error ? true : undefined} aria-describedby={error ? `reason-${key}-error` : undefined} onChange={(e) => onReason(key, e.target.value)} />
                {error && <p id={`reason-${key}-error`} className="field-error" role="alert">{error}</p>}
              </div>
            );
          })}
        </div>
      )}
    </section>
  );
}
