// The probabilistic scores of a report with their bootstrap intervals; undefined scores say why.
import type {
  IntervalJson,
  ScoreJson,
  ScoreKey,
  VerificationReport,
} from "@/lib/query/verification";
import { formatInterval, formatScore, undefinedReason } from "./format-score";

const LABELS: Record<ScoreKey, string> = {
  brier: "Brier score (lower is better)",
  bssClimatology: "Brier skill score against sample climatology",
  bssReference: "Brier skill score against the reference",
  reliability: "Reliability REL (lower is better)",
  resolution: "Resolution RES",
  uncertainty: "Uncertainty UNC",
  withinBinVariance: "Within-bin variance (Stephenson et al.)",
  withinBinCovariance: "Within-bin covariance (Stephenson et al.)",
  rocArea: "ROC area",
};

const ORDER: ScoreKey[] = [
  "brier",
  "bssClimatology",
  "bssReference",
  "reliability",
  "resolution",
  "uncertainty",
  "withinBinVariance",
  "withinBinCovariance",
  "rocArea",
];

export interface ScoreRowProps {
  label: string;
  score: ScoreJson;
  interval: IntervalJson | undefined;
  isComputing: boolean;
  testId: string;
}

export function ScoreRow({ label, score, interval, isComputing, testId }: ScoreRowProps) {
  const reason = undefinedReason(score, interval);
  return (
    <tr data-testid={testId}>
      <th scope="row" className="font-normal">
        {label}
      </th>
      <td className="num text-right">{formatScore(score)}</td>
      <td className="num text-right text-ink-700">
        {interval ? formatInterval(interval) : isComputing ? "…" : "—"}
      </td>
      <td className="text-xs text-ink-700">{reason ? `undefined: ${reason}` : ""}</td>
    </tr>
  );
}

interface Props {
  report: VerificationReport;
  intervals: Record<string, IntervalJson> | null;
  isComputing: boolean;
}

export function ScoreTable({ report, intervals, isComputing }: Props) {
  const keys = ORDER.filter((k) => k !== "bssReference" || report.reference);
  return (
    <table className="data-table" aria-label="Scores">
      <thead>
        <tr>
          <th>Score</th>
          <th className="text-right">Value</th>
          <th className="text-right">95 % interval</th>
          <th>Note</th>
        </tr>
      </thead>
      <tbody>
        {keys.map((key) => (
          <ScoreRow
            key={key}
            testId={`score-${key}`}
            label={
              key === "bssReference" && report.reference
                ? `Brier skill score against ${report.reference.label}`
                : LABELS[key]
            }
            score={report.scores[key]}
            interval={intervals?.[key]}
            isComputing={isComputing}
          />
        ))}
      </tbody>
    </table>
  );
}
