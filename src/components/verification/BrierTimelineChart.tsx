// Brier score over time: the trailing-window score of the scored source and of the reference.
import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { toTimelineChartData } from "@/lib/charts/verification";
import type { TimelinePointJson } from "@/lib/query/verification";
import { GOLD, GRID, INK } from "./chart-colours";

interface Props {
  points: TimelinePointJson[];
  windowDays: number;
  sourceLabel: string;
  referenceLabel: string | null;
}

export function BrierTimelineChart({ points, windowDays, sourceLabel, referenceLabel }: Props) {
  const { rows, hasReference } = toTimelineChartData(points);
  return (
    <figure
      className="card break-inside-avoid"
      aria-label="Brier score over time"
      data-chart="timeline"
    >
      <figcaption className="mb-2 text-sm font-semibold">
        Brier score over time ({windowDays}-day trailing window; lower is better)
      </figcaption>
      <div className="h-64">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={rows} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
            <CartesianGrid stroke={GRID} />
            <XAxis dataKey="day" tick={{ fontSize: 10 }} minTickGap={28} />
            <YAxis
              domain={[0, "auto"]}
              tick={{ fontSize: 11 }}
              tickFormatter={(v: number) => v.toFixed(2)}
            />
            <Tooltip formatter={(v) => (typeof v === "number" ? v.toFixed(4) : String(v))} />
            <Legend wrapperStyle={{ fontSize: 11 }} />
            <Line
              type="monotone"
              dataKey="source"
              name={sourceLabel}
              stroke={INK}
              strokeWidth={2}
              dot={false}
              isAnimationActive={false}
            />
            {hasReference && (
              <Line
                type="monotone"
                dataKey="reference"
                name={referenceLabel ?? "Reference"}
                stroke={GOLD}
                strokeDasharray="5 4"
                dot={false}
                isAnimationActive={false}
              />
            )}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
