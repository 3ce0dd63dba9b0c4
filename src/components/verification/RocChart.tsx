// ROC curve: probability of detection against probability of false detection, with the diagonal.
import {
  CartesianGrid,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { toRocChartData } from "@/lib/charts/verification";
import type { RocPointJson, ScoreJson } from "@/lib/query/verification";
import { GRID, INK, MUTED } from "./chart-colours";
import { formatScore } from "./format-score";

const TICKS = [0, 0.2, 0.4, 0.6, 0.8, 1];

export function RocChart({ points, area }: { points: RocPointJson[]; area: ScoreJson }) {
  const data = toRocChartData(points);
  return (
    <figure className="card break-inside-avoid" aria-label="ROC curve" data-chart="roc">
      <figcaption className="mb-2 text-sm font-semibold">
        ROC curve · area {formatScore(area)}
      </figcaption>
      {area.value === null && (
        <p className="text-sm text-ink-700">The curve is undefined: {area.reason}.</p>
      )}
      <div className="h-72">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 16, left: 0 }}>
            <CartesianGrid stroke={GRID} />
            <XAxis
              type="number"
              dataKey="x"
              domain={[0, 1]}
              ticks={TICKS}
              tick={{ fontSize: 11 }}
              label={{ value: "POFD", position: "insideBottom", offset: -8, fontSize: 11 }}
            />
            <YAxis
              type="number"
              domain={[0, 1]}
              ticks={TICKS}
              tick={{ fontSize: 11 }}
              label={{ value: "POD", angle: -90, position: "insideLeft", fontSize: 11 }}
            />
            <ReferenceLine
              segment={[
                { x: 0, y: 0 },
                { x: 1, y: 1 },
              ]}
              stroke={MUTED}
              strokeDasharray="4 4"
              ifOverflow="hidden"
            />
            <Tooltip
              formatter={(v) => (typeof v === "number" ? v.toFixed(3) : String(v))}
              labelFormatter={(x) => `POFD ${Number(x).toFixed(3)}`}
            />
            <Line
              type="linear"
              dataKey="y"
              name="POD"
              stroke={INK}
              strokeWidth={2}
              dot={false}
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
