import { Button } from "./button";

// Previous / next through a server-paged list, with where the reader is in it.
export function Pager({ page, pageSize, total, onPage }: { page: number; pageSize: number; total: number; onPage: (page: number) => void }) {
  const from = total > 0 ? (page - 1) * pageSize + 1 : 0;
  const to = Math.min(total, page * pageSize);
  const lastPage = Math.max(1, Math.ceil(total / pageSize));
  return (
    <nav aria-label="Pages" className="mt-3 flex items-center justify-between text-sm">
      <span className="text-ink/70">
        {from}–{to} of {total}
      </span>
      <div className="flex gap-2">
        <Button disabled={page <= 1} onClick={() => onPage(page - 1)}>
          Previous
        </Button>
        <span className="self-center text-xs text-ink/60">
          page {page} of {lastPage}
        </span>
        <Button disabled={page >= lastPage} onClick={() => onPage(page + 1)}>
          Next
        </Button>
      </div>
    </nav>
  );
}
