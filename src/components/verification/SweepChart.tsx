// Threshold sweep: Peirce (TSS) and Heidke (HSS) skill at every warning threshold, the chosen one marked.
import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { toSweepChartData } from "@/lib/charts/verification";
import type { SweepRowJson } from "@/lib/query/verification";
import { CALM, GRID, INK, WARN } from "./chart-colours";

export function SweepChart({ rows, threshold }: { rows: SweepRowJson[]; threshold: number }) {
  const data = toSweepChartData(rows);
  return (
    <figure className="card break-inside-avoid" aria-label="Threshold sweep" data-chart="sweep">
      <figcaption className="mb-2 text-sm font-semibold">
        TSS and HSS against the warning threshold (warn when p ≥ threshold; dashed: the chosen one)
      </figcaption>
      <div className="h-64">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
            <CartesianGrid stroke={GRID} />
            <XAxis
              type="number"
              dataKey="threshold"
              domain={[0, 1]}
              ticks={[0, 0.2, 0.4, 0.6, 0.8, 1]}
              tick={{ fontSize: 11 }}
            />
            <YAxis domain={[-0.2, 1]} tick={{ fontSize: 11 }} />
            <ReferenceLine x={threshold} stroke={WARN} strokeDasharray="3 3" />
            <Tooltip
              formatter={(v) => (typeof v === "number" ? v.toFixed(3) : "undefined")}
              labelFormatter={(x) => `threshold ${Number(x).toFixed(2)}`}
            />
            <Legend wrapperStyle={{ fontSize: 11 }} />
            <Line
              type="linear"
              dataKey="tss"
              name="TSS"
              stroke={INK}
              strokeWidth={2}
              dot={false}
              isAnimationActive={false}
            />
            <Line
              type="linear"
              dataKey="hss"
              name="HSS"
              stroke={CALM}
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
