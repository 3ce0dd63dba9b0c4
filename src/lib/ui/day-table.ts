// Sorting of the day's region table (isomorphic, pure).
export interface DayRow {
  id: number;
  region: string;
  location: string;
  isLimbFlagged: boolean;
  areaMsh: number | null;
  mcintosh: string | null;
  mountWilson: string | null;
  unsignedFluxMx: number | null;
  flares: string;
  guidanceC: number | null;
  guidanceM: number | null;
  guidanceX: number | null;
  finalC: number | null;
  finalM: number | null;
  finalX: number | null;
  reasonCount: number;
  isDemo: boolean;
}

export type SortKey = keyof Pick<DayRow, "region" | "location" | "areaMsh" | "mcintosh" | "mountWilson" | "unsignedFluxMx" | "guidanceM" | "finalM" | "finalC" | "finalX" | "guidanceC" | "guidanceX">;

/** Sorts a copy; empty values always go last whatever the direction. */
export function sortDayRows(rows: readonly DayRow[], key: SortKey, direction: "asc" | "desc"): DayRow[] {
  const sign = direction === "asc" ? 1 : -1;
  return [...rows].sort((a, b) => {
    const x = a[key];
    const y = b[key];
    if (x === null && y === null) return a.region.localeCompare(b.region);
    if (x === null) return 1;
    if (y === null) return -1;
    const order = typeof x === "number" && typeof y === "number" ? x - y : String(x).localeCompare(String(y));
    return order === 0 ? a.region.localeCompare(b.region) : sign * order;
  });
}
