// The 2×2 contingency table at the chosen warning threshold and its categorical scores.
import {
  CONTINGENCY_KEYS,
  type ContingencyKey,
  type ContingencyJson,
  type IntervalJson,
} from "@/lib/query/verification";
import { ScoreRow } from "./ScoreTable";

const LABELS: Record<ContingencyKey, string> = {
  pod: "POD, probability of detection",
  far: "FAR, false alarm ratio",
  pofd: "POFD, probability of false detection",
  csi: "CSI, critical success index",
  bias: "Frequency bias",
  pc: "PC, proportion correct",
  tss: "TSS, Peirce (Hanssen–Kuipers) skill score",
  hss: "HSS, Heidke skill score",
  gss: "GSS, Gilbert skill score (ETS)",
  apss: "APSS, Appleman skill score",
};

interface Props {
  contingency: ContingencyJson;
  intervals: Record<string, IntervalJson> | null;
  isComputing: boolean;
}

export function ContingencyPanel({ contingency, intervals, isComputing }: Props) {
  const t = contingency.table;
  return (
    <div className="grid items-start gap-6 lg:grid-cols-[auto_1fr]">
      <table className="data-table w-auto" aria-label="Contingency table">
        <caption className="mb-2 text-left text-sm text-ink-700">
          Warning when p ≥ {contingency.threshold.toFixed(2)}
        </caption>
        <thead>
          <tr>
            <th />
            <th className="text-right">Observed yes</th>
            <th className="text-right">Observed no</th>
          </tr>
        </thead>
        <tbody>
          <tr>
            <th scope="row">Warned</th>
            <td className="num text-right" data-testid="cell-hits">
              {t.hits}
            </td>
            <td className="num text-right">{t.falseAlarms}</td>
          </tr>
          <tr>
            <th scope="row">Not warned</th>
            <td className="num text-right">{t.misses}</td>
            <td className="num text-right">{t.correctNegatives}</td>
          </tr>
        </tbody>
      </table>
      <table className="data-table" aria-label="Categorical scores">
        <thead>
          <tr>
            <th>Score</th>
            <th className="text-right">Value</th>
            <th className="text-right">95 % interval</th>
            <th>Note</th>
          </tr>
        </thead>
        <tbody>
          {CONTINGENCY_KEYS.map((key) => (
            <ScoreRow
              key={key}
              testId={`contingency-${key}`}
              label={LABELS[key]}
              score={contingency.scores[key]}
              interval={intervals?.[`contingency.${key}`]}
              isComputing={isComputing}
            />
          ))}
        </tbody>
      </table>
    </div>
  );
}
