// Reliability diagram: observed frequency against mean forecast per bin, the diagonal of perfect
// reliability, and the count of forecasts in every bin beneath.
import {
  Bar,
  BarChart,
  CartesianGrid,
  LabelList,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { toReliabilityChartData } from "@/lib/charts/verification";
import type { ReliabilityBinJson } from "@/lib/query/verification";
import { GOLD, GRID, INK, MUTED } from "./chart-colours";

const TICKS = [0, 0.2, 0.4, 0.6, 0.8, 1];

export function ReliabilityChart({
  bins,
  title = "Reliability diagram",
}: {
  bins: ReliabilityBinJson[];
  title?: string;
}) {
  const { points, counts } = toReliabilityChartData(bins);
  return (
    <figure className="card break-inside-avoid" aria-label={title} data-chart="reliability">
      <figcaption className="mb-2 text-sm font-semibold">{title}</figcaption>
      {points.length === 0 && <p className="text-sm text-ink-700">No forecasts in this sample.</p>}
      <div className="h-60">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={points} margin={{ top: 8, right: 16, bottom: 16, left: 0 }}>
            <CartesianGrid stroke={GRID} />
            <XAxis
              type="number"
              dataKey="x"
              domain={[0, 1]}
              ticks={TICKS}
              tick={{ fontSize: 11 }}
              label={{
                value: "Forecast probability",
                position: "insideBottom",
                offset: -8,
                fontSize: 11,
              }}
            />
            <YAxis
              type="number"
              domain={[0, 1]}
              ticks={TICKS}
              tick={{ fontSize: 11 }}
              label={{
                value: "Observed frequency",
                angle: -90,
                position: "insideLeft",
                fontSize: 11,
                dy: 50,
              }}
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
              labelFormatter={(x) => `mean forecast ${Number(x).toFixed(3)}`}
            />
            <Line
              type="linear"
              dataKey="y"
              name="Observed frequency"
              stroke={INK}
              strokeWidth={2}
              dot={{ r: 3 }}
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <p className="mt-2 text-xs text-ink-700">Forecasts per bin</p>
      <div className="h-24">
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={counts} margin={{ top: 14, right: 16, bottom: 0, left: 0 }}>
            <XAxis dataKey="bin" tick={{ fontSize: 9 }} interval={0} />
            <YAxis hide />
            <Bar dataKey="count" name="Forecasts" fill={GOLD} isAnimationActive={false}>
              <LabelList dataKey="count" position="top" fontSize={9} />
            </Bar>
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
