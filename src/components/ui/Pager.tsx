// Previous / next pagination with the visible range, for island lists.
interface PagerProps {
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
}

export function Pager({ page, pageSize, total, onPage }: PagerProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages" className="flex items-center justify-between text-sm">
      <span className="text-ink-700">{first}–{last} of {total}</span>
      <span className="space-x-2">
        <button type="button" className="btn-quiet px-3 py-1" disabled={page <= 1} onClick={() => onPage(page - 1)}>Previous</button>
        <span className="num">{page} / {pages}</span>
        <button type="button" className="btn-quiet px-3 py-1" disabled={page >= pages} onClick={() => onPage(page + 1)}>Next</button>
      </span>
    </nav>
  );
}
