// The scored source beside the reference on the cases both forecast, and the paired bootstrap
// of their difference in skill.
import type { IntervalJson, SideScoresJson, VerificationReport } from "@/lib/query/verification";
import { formatInterval, formatScore } from "./format-score";

const ROWS: { key: keyof SideScoresJson; label: string }[] = [
  { key: "brier", label: "Brier score" },
  { key: "bssClimatology", label: "BSS against sample climatology" },
  { key: "reliability", label: "Reliability REL" },
  { key: "resolution", label: "Resolution RES" },
  { key: "rocArea", label: "ROC area" },
];

interface Props {
  report: VerificationReport;
  difference: IntervalJson | null;
  isComputing: boolean;
}

export function ComparisonPanel({ report, difference, isComputing }: Props) {
  const c = report.comparison;
  if (!report.reference)
    return <p className="text-sm text-ink-700">Choose a reference to compare against.</p>;
  if (!c)
    return (
      <p className="text-sm text-ink-700">
        {report.reference.label} has no forecasts for these cases.
      </p>
    );
  const verdict =
    difference?.lower.value != null && difference.upper.value != null
      ? difference.lower.value > 0
        ? `${report.source.label} is more skilful`
        : difference.upper.value < 0
          ? `${report.reference.label} is more skilful`
          : "the interval includes zero: no clear difference"
      : null;
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-700">
        {c.n} shared cases, {c.events} events.
      </p>
      <table className="data-table" aria-label="Side by side">
        <thead>
          <tr>
            <th>Score</th>
            <th className="text-right">{report.source.label}</th>
            <th className="text-right">{report.reference.label}</th>
          </tr>
        </thead>
        <tbody>
          {ROWS.map((r) => (
            <tr key={r.key}>
              <th scope="row" className="font-normal">
                {r.label}
              </th>
              <td className="num text-right">{formatScore(c.source[r.key])}</td>
              <td className="num text-right">{formatScore(c.reference[r.key])}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-sm" data-testid="skill-difference">
        Skill difference (BSS {report.source.label} − BSS {report.reference.label}), paired
        bootstrap:{" "}
        {difference ? (
          <>
            <span className="num">{formatScore(difference.estimate)}</span>{" "}
            <span className="num text-ink-700">{formatInterval(difference)}</span>
            {verdict && <span className="text-ink-700"> — {verdict}.</span>}
          </>
        ) : isComputing ? (
          "computing…"
        ) : (
          "—"
        )}
        {difference?.estimate.value === null && (
          <span className="text-ink-700"> (undefined: {difference.estimate.reason})</span>
        )}
      </p>
    </div>
  );
}
