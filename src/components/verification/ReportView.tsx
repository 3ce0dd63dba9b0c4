// The verification report island: scores, contingency table, comparison and plots from the
// server's report, with the bootstrap intervals fetched afterwards while a progress bar runs.
import { useEffect, useState } from "react";
import type { IntervalsResult, VerificationReport } from "@/lib/query/verification";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { BrierTimelineChart } from "./BrierTimelineChart";
import { ComparisonPanel } from "./ComparisonPanel";
import { ContingencyPanel } from "./ContingencyPanel";
import { streamIntervals } from "./interval-stream";
import { ProgressBar } from "@/components/ui/ProgressBar";
import { ReliabilityChart } from "./ReliabilityChart";
import { RocChart } from "./RocChart";
import { ScoreTable } from "./ScoreTable";
import { SweepChart } from "./SweepChart";

interface Props {
  report: VerificationReport;
  /** The report's query string, reused for the intervals, exports and the printable page. */
  query: string;
  isPrintable?: boolean;
}

type IntervalState =
  | { status: "running"; done: number; total: number; label: string }
  | { status: "done"; result: IntervalsResult }
  | { status: "failed"; message: string };

function useIntervals(query: string, hasCases: boolean): IntervalState | null {
  const [state, setState] = useState<IntervalState | null>(null);
  useEffect(() => {
    if (!hasCases) return;
    const controller = new AbortController();
    setState({ status: "running", done: 0, total: 0, label: "Starting" });
    streamIntervals(
      `/api/verification/intervals?${query}`,
      (done, total, label) => setState({ status: "running", done, total, label }),
      controller.signal,
    )
      .then((result) => setState({ status: "done", result }))
      .catch((err: Error) => {
        if (!controller.signal.aborted) setState({ status: "failed", message: err.message });
      });
    return () => controller.abort();
  }, [query, hasCases]);
  return state;
}

export function ReportView({ report, query, isPrintable = false }: Props) {
  const hasCases = report.sample.n > 0;
  const state = useIntervals(query, hasCases);
  const intervals = state?.status === "done" ? state.result.intervals : null;
  const isComputing = state?.status === "running";
  const s = report.sample;
  return (
    <div className="space-y-6">
      <section className="card space-y-2" aria-label="Sample">
        <p className="text-sm">
          <strong>{report.source.label}</strong>
          {report.reference && (
            <>
              {" "}
              against <strong>{report.reference.label}</strong>
            </>
          )}{" "}
          · {report.level} in {report.windowHours} h ·{" "}
          {report.scope === "region" ? "region forecasts" : "full disk"} · levels on{" "}
          {report.convention === "true" ? "true" : "legacy-scaled"} flux
          {report.isDemo && (
            <span className="chip ml-2 border-gold-500/50 text-gold-600">
              demo data — invented for the scenario
            </span>
          )}
        </p>
        <p className="text-sm text-ink-700" data-testid="sample-size">
          {s.n} cases, {s.events} events
          {s.baseRate !== null && <> (base rate {(s.baseRate * 100).toFixed(1)} %)</>}
          {s.firstIssue && s.lastIssue && (
            <>
              ; issued {formatUtc(s.firstIssue)} to {formatUtc(s.lastIssue)}
            </>
          )}
        </p>
        <ul className="list-disc pl-5 text-xs text-ink-700">
          {report.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
        {!isPrintable && hasCases && (
          <p className="flex flex-wrap gap-2 pt-1 text-sm">
            <a
              className="btn-quiet px-3 py-1"
              href={`/api/verification/export?${query}&what=pairs`}
            >
              Export matched pairs (CSV)
            </a>
            <a
              className="btn-quiet px-3 py-1"
              href={`/api/verification/export?${query}&what=scores`}
            >
              Export scores (CSV)
            </a>
            <a className="btn-quiet px-3 py-1" href={`/verification/report?${query}`}>
              Printable report
            </a>
          </p>
        )}
      </section>
      {hasCases && state?.status === "running" && (
        <ProgressBar
          label={`Bootstrap intervals: ${state.label}`}
          value={state.total > 0 ? state.done / state.total : null}
        />
      )}
      {state?.status === "failed" && <FormAlert tone="error">{state.message}</FormAlert>}
      {!hasCases && (
        <FormAlert tone="info">
          No forecast records match these filters, so every score is undefined.
        </FormAlert>
      )}
      <section className="card overflow-x-auto" aria-labelledby="scores-heading">
        <h2 id="scores-heading" className="mb-3">
          Scores
        </h2>
        <ScoreTable report={report} intervals={intervals} isComputing={isComputing} />
      </section>
      <section className="card overflow-x-auto" aria-labelledby="contingency-heading">
        <h2 id="contingency-heading" className="mb-3">
          Contingency table
        </h2>
        <ContingencyPanel
          contingency={report.contingency}
          intervals={intervals}
          isComputing={isComputing}
        />
      </section>
      <section className="card" aria-labelledby="comparison-heading">
        <h2 id="comparison-heading" className="mb-3">
          Side by side
        </h2>
        <ComparisonPanel
          report={report}
          difference={state?.status === "done" ? state.result.skillDifference : null}
          isComputing={isComputing}
        />
      </section>
      <div className="grid gap-6 lg:grid-cols-2 print:grid-cols-2">
        <ReliabilityChart bins={report.reliability} />
        <RocChart points={report.roc} area={report.scores.rocArea} />
        <BrierTimelineChart
          points={report.timeline.points}
          windowDays={report.timeline.windowDays}
          sourceLabel={report.source.label}
          referenceLabel={report.reference?.label ?? null}
        />
        <SweepChart rows={report.sweep} threshold={report.contingency.threshold} />
      </div>
    </div>
  );
}
