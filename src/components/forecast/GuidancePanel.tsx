// Live guidance: each active model's probabilities, the blend and the spread between models.
import { FLARE_LEVELS, WINDOW_KEYS, type ProbabilityGrid } from "@/lib/domain/flare-levels";
import type { GuidanceResponse } from "@/lib/query/forecast";
import { pct } from "@/lib/ui/grid-format";

interface Props {
  data: GuidanceResponse | undefined;
  isFetching: boolean;
  error: string | null;
  isInputComplete: boolean;
}

function Cells({ grid }: { grid: ProbabilityGrid | null }) {
  return (
    <>
      {FLARE_LEVELS.flatMap((l) =>
        WINDOW_KEYS.map((w) => (
          <td key={`${l}${w}`} className={`num text-right ${w === "24h" ? "border-l" : ""}`}>{grid ? pct(grid[l][w]) : ""}</td>
        )),
      )}
    </>
  );
}

export function GuidancePanel({ data, isFetching, error, isInputComplete }: Props) {
  return (
    <section className="card" aria-labelledby="guidance-title" aria-busy={isFetching}>
      <div className="flex items-baseline justify-between gap-3">
        <h2 id="guidance-title">Model guidance</h2>
        <span className="text-xs text-ink-700" role="status">{isFetching ? "Updating…" : data ? "Up to date" : ""}</span>
      </div>
      <p className="mt-1 text-xs text-ink-700">Probability (%) of at least one flare at or above the level within the window from issue time.</p>
      {!isInputComplete && <p className="mt-3 text-sm text-ink-700">Complete the region fields to see guidance.</p>}
      {error && <p className="field-error" role="alert">{error}</p>}
      {data && (
        <div className="mt-3 overflow-x-auto">
          <table className="data-table text-xs" data-testid="guidance-table">
            <thead>
              <tr><th rowSpan={2}>Model</th>{FLARE_LEVELS.map((l) => <th key={l} colSpan={3} className="border-l text-center">{l}</th>)}</tr>
              <tr>{FLARE_LEVELS.flatMap((l) => WINDOW_KEYS.map((w) => <th key={`${l}${w}`} className={`text-right ${w === "24h" ? "border-l" : ""}`}>{w}</th>))}</tr>
            </thead>
            <tbody>
              {data.models.map((m) => (
                <tr key={m.key} data-model={m.key}>
                  <td className="min-w-[9.5rem]">
                    <div className="font-medium" title={m.provenance}>{m.name}</div>
                    <div className="text-[11px] whitespace-nowrap text-ink-700">{m.key} · {m.version}</div>
                    {m.reason && <div className="text-[11px] text-warn-700">{m.reason}</div>}
                    {m.flags.map((f) => <div key={f} className="text-[11px] text-warn-700">⚑ {f}</div>)}
                  </td>
                  {m.probabilities ? <Cells grid={m.probabilities} /> : <td colSpan={9} className="text-ink-700">{m.missingInputs.length ? `Needs: ${m.missingInputs.join(", ")}` : "No answer"}</td>}
                </tr>
              ))}
              <tr className="bg-gold-100/60 font-semibold" data-testid="blended-row"><td>Blended guidance</td><Cells grid={data.blended} /></tr>
              <tr className="text-ink-700"><td>Spread (max − min)</td><Cells grid={data.spread} /></tr>
            </tbody>
          </table>
          {data.models.some((m) => m.provenance.startsWith("demo")) && <p className="mt-2 text-[11px] text-ink-700">Demo models: invented for the scenario, not published tables.</p>}
          {data.flags.map((f) => <p key={f} className="text-xs text-warn-700">⚑ {f}</p>)}
        </div>
      )}
    </section>
  );
}
