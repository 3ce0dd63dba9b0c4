// A region's evolution: area and flux, and its 24 h probabilities (finals against guidance).
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { RegionChartPoint } from "@/lib/charts/region-history";

const INK = "#23275a";
const GOLD = "#c47f12";
const CALM = "#2f7d6d";
const WARN = "#9a3412";

export function RegionCharts({ points }: { points: RegionChartPoint[] }) {
  if (points.length === 0) return <p className="text-ink-700">No assessments yet.</p>;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <figure className="card">
        <figcaption className="mb-2 text-sm font-semibold">Area (MSH) and total unsigned flux (10²² Mx)</figcaption>
        <div className="h-64">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={points} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
              <CartesianGrid stroke="#e6e1d6" />
              <XAxis dataKey="day" tick={{ fontSize: 11 }} />
              <YAxis yAxisId="area" tick={{ fontSize: 11 }} />
              <YAxis yAxisId="flux" orientation="right" tick={{ fontSize: 11 }} />
              <Tooltip />
              <Legend />
              <Line yAxisId="area" type="monotone" dataKey="areaMsh" name="Area MSH" stroke={INK} dot isAnimationActive={false} connectNulls />
              <Line yAxisId="flux" type="monotone" dataKey="flux22" name="Flux 10²² Mx" stroke={GOLD} dot isAnimationActive={false} connectNulls />
            </LineChart>
          </ResponsiveContainer>
        </div>
      </figure>
      <figure className="card">
        <figcaption className="mb-2 text-sm font-semibold">24 h probabilities (%)</figcaption>
        <div className="h-64">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={points} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
              <CartesianGrid stroke="#e6e1d6" />
              <XAxis dataKey="day" tick={{ fontSize: 11 }} />
              <YAxis domain={[0, 100]} tick={{ fontSize: 11 }} />
              <Tooltip />
              <Legend />
              <Line type="monotone" dataKey="finalC" name="Final C+" stroke={CALM} isAnimationActive={false} connectNulls />
              <Line type="monotone" dataKey="finalM" name="Final M+" stroke={INK} strokeWidth={2} isAnimationActive={false} connectNulls />
              <Line type="monotone" dataKey="guidanceM" name="Guidance M+" stroke={INK} strokeDasharray="5 4" isAnimationActive={false} connectNulls />
              <Line type="monotone" dataKey="finalX" name="Final X" stroke={WARN} isAnimationActive={false} connectNulls />
            </LineChart>
          </ResponsiveContainer>
        </div>
      </figure>
    </div>
  );
}
