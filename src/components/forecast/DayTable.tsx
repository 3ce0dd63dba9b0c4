// The day's regions, sortable by any column, with guidance next to the forecaster's finals.
import { useState } from "react";
import { sortDayRows, type DayRow, type SortKey } from "@/lib/ui/day-table";
import { pct } from "@/lib/ui/grid-format";

const COLUMNS: { key: SortKey; label: string; numeric?: boolean }[] = [
  { key: "region", label: "Region" },
  { key: "location", label: "Location" },
  { key: "areaMsh", label: "Area MSH", numeric: true },
  { key: "mcintosh", label: "McIntosh" },
  { key: "mountWilson", label: "Mt Wilson" },
  { key: "unsignedFluxMx", label: "Flux Mx", numeric: true },
  { key: "guidanceC", label: "Guid. C+", numeric: true },
  { key: "guidanceM", label: "Guid. M+", numeric: true },
  { key: "guidanceX", label: "Guid. X", numeric: true },
  { key: "finalC", label: "Final C+", numeric: true },
  { key: "finalM", label: "Final M+", numeric: true },
  { key: "finalX", label: "Final X", numeric: true },
];

export function DayTable({ rows, canEdit }: { rows: DayRow[]; canEdit: boolean }) {
  const [sort, setSort] = useState<{ key: SortKey; direction: "asc" | "desc" }>({ key: "region", direction: "asc" });
  const sorted = sortDayRows(rows, sort.key, sort.direction);
  const toggle = (key: SortKey) => setSort((s) => ({ key, direction: s.key === key && s.direction === "asc" ? "desc" : "asc" }));
  if (rows.length === 0) return <p className="text-ink-700">No regions assessed for this day yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid="day-table">
        <caption className="sr-only">Regions of the day; 24 h probabilities in percent. Column headers sort.</caption>
        <thead>
          <tr>
            {COLUMNS.map((c) => (
              <th key={c.key} aria-sort={sort.key === c.key ? (sort.direction === "asc" ? "ascending" : "descending") : "none"} className={c.numeric ? "text-right" : ""}>
                <button type="button" className="uppercase hover:underline" onClick={() => toggle(c.key)}>
                  {c.label}{sort.key === c.key ? (sort.direction === "asc" ? " ▲" : " ▼") : ""}
                </button>
              </th>
            ))}
            <th>24 h flares</th>
            <th><span className="sr-only">Actions</span></th>
          </tr>
        </thead>
        <tbody>
          {sorted.map((r) => (
            <tr key={r.id} data-region={r.region}>
              <td className="num font-medium whitespace-nowrap"><a className="underline" href={`/regions/${r.region}`}>{r.region}</a>{r.isDemo && <span className="chip ml-1 border-gold-500/50 text-[10px] text-gold-600">demo</span>}</td>
              <td className="num">{r.location}{r.isLimbFlagged && <span className="chip ml-1 border-gold-500/60 text-[10px] text-gold-600" title="Beyond 60° from disk centre: projection effects">limb</span>}</td>
              <td className="num text-right">{r.areaMsh ?? "—"}</td>
              <td className="num">{r.mcintosh ?? "—"}</td>
              <td className="text-xs">{r.mountWilson ?? "—"}</td>
              <td className="num text-right">{r.unsignedFluxMx === null ? "—" : r.unsignedFluxMx.toExponential(1)}</td>
              <td className="num text-right text-ink-700">{pct(r.guidanceC)}</td>
              <td className="num text-right text-ink-700">{pct(r.guidanceM)}</td>
              <td className="num text-right text-ink-700">{pct(r.guidanceX)}</td>
              <td className="num text-right font-semibold">{pct(r.finalC)}</td>
              <td className="num text-right font-semibold">{pct(r.finalM)}</td>
              <td className="num text-right font-semibold">{pct(r.finalX)}{r.reasonCount > 0 && <span className="ml-1 text-[10px] text-gold-600" title="Finals with a reason">✎{r.reasonCount}</span>}</td>
              <td className="num text-xs">{r.flares}</td>
              <td>{canEdit && <a className="btn-quiet px-2 py-1" href={`/assessments/${r.id}`}>Edit</a>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
