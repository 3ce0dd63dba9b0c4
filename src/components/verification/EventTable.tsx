// The stored events, newest first, filtered by period, level and region, a page at a time.
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { eventsQuery, type EventView } from "@/lib/query/verification";
import type { EventListQuery } from "@/lib/schemas/verification";
import { formatUtc } from "@/lib/ui/format";
import { FormAlert } from "@/components/ui/FormAlert";
import { Pager } from "@/components/ui/Pager";

type Filter = {
  from: string;
  to: string;
  level: "" | NonNullable<EventListQuery["level"]>;
  region: string;
  page: number;
};

export function EventTable({
  canManage,
  onCorrect,
}: {
  canManage: boolean;
  onCorrect: (e: EventView) => void;
}) {
  const [filter, setFilter] = useState<Filter>({
    from: "",
    to: "",
    level: "",
    region: "",
    page: 1,
  });
  const list = useQuery(eventsQuery({ ...filter, level: filter.level || undefined, pageSize: 25 }));
  const update = (patch: Partial<Filter>) => setFilter((f) => ({ ...f, page: 1, ...patch }));
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter events">
        <label className="text-sm">
          From
          <input
            type="date"
            className="field-input mt-1"
            value={filter.from}
            onChange={(e) => update({ from: e.target.value })}
          />
        </label>
        <label className="text-sm">
          To
          <input
            type="date"
            className="field-input mt-1"
            value={filter.to}
            onChange={(e) => update({ to: e.target.value })}
          />
        </label>
        <label className="text-sm">
          Class at least
          <select
            className="field-input mt-1"
            value={filter.level}
            onChange={(e) => update({ level: e.target.value as Filter["level"] })}
          >
            <option value="">Any</option>
            <option value="C+">C1.0</option>
            <option value="M+">M1.0</option>
            <option value="X">X1.0</option>
          </select>
        </label>
        <label className="text-sm">
          Region
          <input
            className="field-input mt-1 w-32"
            placeholder="HR-0412"
            value={filter.region}
            onChange={(e) => update({ region: e.target.value })}
          />
        </label>
      </div>
      {list.isError && <FormAlert tone="error">{list.error.message}</FormAlert>}
      <div className="overflow-x-auto">
        <table className="data-table" aria-label="Observed events">
          <thead>
            <tr>
              <th>Peak (UTC)</th>
              <th>Start – end</th>
              <th>Class as listed</th>
              <th>True-flux class</th>
              <th>Region</th>
              <th>List</th>
              {canManage && (
                <th>
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {list.data?.events.map((e) => (
              <tr key={e.id} data-testid={`event-${e.id}`}>
                <td className="num whitespace-nowrap">{formatUtc(e.peakTime)}</td>
                <td className="num text-xs whitespace-nowrap">
                  {e.startTime.slice(11, 16)} – {e.endTime.slice(11, 16)}
                </td>
                <td className="num">
                  {e.originalClass}
                  {e.convention === "legacy-scaled" && (
                    <span className="chip ml-1 text-[10px]">legacy</span>
                  )}
                </td>
                <td className="num font-semibold">{e.trueClass}</td>
                <td className="num">{e.regionNumber ?? "—"}</td>
                <td className="text-xs">
                  {e.listName}
                  {e.isDemo && (
                    <span className="chip ml-1 border-gold-500/50 text-gold-600">demo</span>
                  )}
                </td>
                {canManage && (
                  <td className="text-right">
                    <button
                      type="button"
                      className="btn-quiet px-2 py-1"
                      onClick={() => onCorrect(e)}
                    >
                      Correct
                    </button>
                  </td>
                )}
              </tr>
            ))}
            {list.data && list.data.events.length === 0 && (
              <tr>
                <td colSpan={canManage ? 7 : 6} className="py-6 text-center text-ink-700">
                  No events match these filters.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      {list.data && (
        <Pager
          page={filter.page}
          pageSize={list.data.pageSize}
          total={list.data.total}
          onPage={(page) => setFilter((f) => ({ ...f, page }))}
        />
      )}
    </div>
  );
}
