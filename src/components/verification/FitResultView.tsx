// What a recalibration fit found: the archive, the fitted rates or coefficients with their
// uncertainty and convergence, and the held-out comparison with the active model.
import { useState } from "react";
import type { FitResultJson } from "@/lib/query/verification-recalibration";
import { formatScore } from "./format-score";
import { ReliabilityChart } from "./ReliabilityChart";

const num = (v: number | null, digits = 4) =>
  v === null
    ? "—"
    : Math.abs(v) >= 1e4 || (Math.abs(v) < 1e-3 && v !== 0)
      ? v.toExponential(3)
      : v.toFixed(digits);

function LogisticTable({ result }: { result: FitResultJson }) {
  if (!result.logistic) return null;
  return (
    <div className="space-y-4">
      {result.logistic.levels.map((l) => (
        <table key={l.level} className="data-table" aria-label={`Coefficients ${l.level}`}>
          <caption className="mb-1 text-left text-sm">
            <strong>{l.level}</strong> ·{" "}
            {l.converged ? (
              `converged in ${l.iterations} iterations, deviance ${num(l.deviance, 1)} (null ${num(l.nullDeviance, 1)})`
            ) : (
              <span className="text-warn-700">not converged: {l.reason}</span>
            )}{" "}
            · {l.n} region-days ({l.events} events)
            {l.skipped > 0 && `, ${l.skipped} left out for missing or out-of-domain inputs`}
          </caption>
          <thead>
            <tr>
              <th>Term</th>
              <th className="text-right">Fitted</th>
              <th className="text-right">Standard error</th>
              <th className="text-right">Active model</th>
            </tr>
          </thead>
          <tbody>
            {l.coefficients.map((c) => (
              <tr key={c.term}>
                <td className="num text-xs">{c.term}</td>
                <td className="num text-right">{num(c.estimate)}</td>
                <td className="num text-right">{num(c.standardError)}</td>
                <td className="num text-right text-ink-700">{num(c.current)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ))}
    </div>
  );
}

function PoissonTable({ result }: { result: FitResultJson }) {
  const p = result.poisson;
  if (!p) return null;
  return (
    <div className="max-h-96 overflow-auto">
      <p className="mb-2 text-sm text-ink-700">
        {p.regionDays} region-days
        {p.skipped > 0 && ` (${p.skipped} without a valid McIntosh class left out)`}; classes with
        fewer than {p.minRegionDays} take their Zurich class's rates
        {p.pooledClasses.length > 0 && ` (${p.pooledClasses.join(", ")})`}.
        {p.zurichFromArchive.length > 0 &&
          ` Zurich classes absent from the archive (${p.zurichFromArchive.join(", ")}) take the all-archive rate.`}
      </p>
      <table className="data-table" aria-label="Fitted rates">
        <thead>
          <tr>
            <th>Class</th>
            <th className="text-right">Region-days</th>
            <th>Rates from</th>
            <th className="text-right">C / day ± SE</th>
            <th className="text-right">M / day ± SE</th>
            <th className="text-right">X / day ± SE</th>
          </tr>
        </thead>
        <tbody>
          {p.rows.map((r) => (
            <tr key={r.mcintosh}>
              <td className="num">
                {r.mcintosh}
                {r.isSparse && <span className="chip ml-1 text-[10px] text-gold-600">sparse</span>}
              </td>
              <td className="num text-right">{r.regionDays}</td>
              <td className="text-xs">
                {r.source === "class" ? "own class" : `Zurich pool (${r.basisRegionDays})`}
              </td>
              {(["C", "M", "X"] as const).map((k) => (
                <td key={k} className="num text-right text-xs">
                  {r.rates[k].ratePerDay.toFixed(3)} ± {r.rates[k].standardError.toFixed(3)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function HeldOut({ result }: { result: FitResultJson }) {
  const [level, setLevel] = useState<"C+" | "M+" | "X">("M+");
  const levels = result.holdout.levels;
  if (!levels)
    return <p className="text-sm text-warn-700">No held-out comparison: {result.holdout.reason}</p>;
  const chosen = levels.find((l) => l.level === level) ?? levels[0]!;
  return (
    <div className="space-y-4">
      {result.split && (
        <p className="text-sm text-ink-700">
          Trained on {result.split.trainFrom} to {result.split.trainTo}, tested on{" "}
          {result.split.testFrom} to {result.split.testTo} (24 h window).
        </p>
      )}
      <table className="data-table" aria-label="Held-out comparison">
        <thead>
          <tr>
            <th>Level</th>
            <th className="text-right">Test region-days</th>
            <th className="text-right">Events</th>
            <th className="text-right">BS candidate</th>
            <th className="text-right">BS active</th>
            <th className="text-right">BSS candidate</th>
            <th className="text-right">BSS active</th>
          </tr>
        </thead>
        <tbody>
          {levels.map((l) => (
            <tr key={l.level}>
              <td>{l.level}</td>
              <td className="num text-right">{l.n}</td>
              <td className="num text-right">{l.events}</td>
              <td className="num text-right">{formatScore(l.candidate.brier, 4)}</td>
              <td className="num text-right">{formatScore(l.active.brier, 4)}</td>
              <td className="num text-right font-semibold">{formatScore(l.candidate.bss)}</td>
              <td className="num text-right">{formatScore(l.active.bss)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <label className="text-sm">
        Reliability on the test year for
        <select
          className="field-input ml-2 inline-block w-auto"
          value={level}
          onChange={(e) => setLevel(e.target.value as typeof level)}
        >
          {levels.map((l) => (
            <option key={l.level}>{l.level}</option>
          ))}
        </select>
      </label>
      <div className="grid gap-4 lg:grid-cols-2">
        <ReliabilityChart
          bins={chosen.candidate.reliability}
          title={`Candidate, ${chosen.level} 24 h`}
        />
        <ReliabilityChart
          bins={chosen.active.reliability}
          title={`Active ${result.model.version}, ${chosen.level} 24 h`}
        />
      </div>
    </div>
  );
}

export function FitResultView({ result }: { result: FitResultJson }) {
  const a = result.archive;
  return (
    <div className="space-y-5" data-testid="fit-result">
      <p className="text-sm">
        {result.model.name} ({result.model.key} {result.model.version}) refitted on {a.regionDays}{" "}
        region-days from {a.from ?? "—"} to {a.to ?? "—"} with {a.events} observed events.
        {a.isDemo && (
          <span className="chip ml-2 border-gold-500/50 text-gold-600">demo archive</span>
        )}
      </p>
      <h3 className="font-semibold">Fitted on the whole archive</h3>
      <LogisticTable result={result} />
      <PoissonTable result={result} />
      <h3 className="font-semibold">Held-out year</h3>
      <HeldOut result={result} />
    </div>
  );
}
