import { useEffect, useId, useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState, ErrorState, InlineError, LoadingState } from "@/components/ui/states";
import { Pager } from "@/components/ui/pager";
import { shortDateTime } from "@/lib/dates";
import { VerdictMark } from "@/features/review";
import { roleAtLeast, type NetworkSort, type NetworkSummary, type Role } from "@/lib/api-contract";
import { useDeleteNetwork } from "../api/delete-network";
import { useDuplicateNetwork } from "../api/duplicate-network";
import { useNetworks } from "../api/get-networks";

const PAGE_SIZE = 20;

const COLUMNS: { key: NetworkSort; label: string }[] = [
  { key: "title", label: "Title" },
  { key: "author", label: "Author" },
  { key: "lastRevision", label: "Last revision" },
  { key: "verdict", label: "Verdict" },
  { key: "updatedAt", label: "Updated" },
];

const updated = shortDateTime;

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

function RowActions({ network, teamId, canEdit }: { network: NetworkSummary; teamId: string; canEdit: boolean }) {
  const [confirming, setConfirming] = useState(false);
  const remove = useDeleteNetwork();
  const duplicate = useDuplicateNetwork();
  const navigate = useNavigate();
  if (!canEdit) return null;
  return (
    <div className="flex justify-end gap-1">
      <Button variant="quiet" className="px-2 py-0.5 text-xs" onClick={() => duplicate.mutate({ networkId: network.id, teamId }, { onSuccess: (created) => navigate(`/networks/${created.id}`) })} disabled={duplicate.isPending} aria-label={`Duplicate ${network.title}`}>
        {duplicate.isPending ? "Duplicating…" : "Duplicate"}
      </Button>
      <Button variant="quiet" className="px-2 py-0.5 text-xs hover:text-signal" onClick={() => setConfirming(true)} aria-label={`Delete ${network.title}`}>
        Delete
      </Button>
      <InlineError error={duplicate.error} />
      <Dialog open={confirming} onClose={() => setConfirming(false)} title="Delete this network?">
        <p className="text-sm">
          “{network.title}” and all its derivation revisions, share links and review notes will be deleted. This cannot be undone.
        </p>
        <InlineError error={remove.error} />
        <div className="mt-4 flex justify-end gap-2">
          <Button onClick={() => setConfirming(false)}>Keep it</Button>
          <Button variant="danger" disabled={remove.isPending} onClick={() => remove.mutate({ networkId: network.id, teamId }, { onSuccess: () => setConfirming(false) })}>
            {remove.isPending ? "Deleting…" : "Delete network"}
          </Button>
        </div>
      </Dialog>
    </div>
  );
}

// The team's networks: searched, sorted and paged by the server.
export function NetworksTable({ teamId, role }: { teamId: string; role: Role }) {
  const searchId = useId();
  const [search, setSearch] = useState("");
  const [sort, setSort] = useState<NetworkSort>("updatedAt");
  const [direction, setDirection] = useState<"asc" | "desc">("desc");
  const debouncedSearch = useDebounced(search, 250);
  // A new search or order starts again at page 1: the page is kept with the query it belongs to.
  const query = JSON.stringify([debouncedSearch, sort, direction]);
  const [paged, setPaged] = useState({ query, page: 1 });
  const page = paged.query === query ? paged.page : 1;
  const setPage = (next: number) => setPaged({ query, page: next });
  const networks = useNetworks({ teamId, search: debouncedSearch, sort, direction, page, pageSize: PAGE_SIZE });
  const canEdit = roleAtLeast(role, "editor");

  const sortBy = (key: NetworkSort) => {
    if (key === sort) setDirection(direction === "asc" ? "desc" : "asc");
    else {
      setSort(key);
      setDirection(key === "updatedAt" || key === "lastRevision" ? "desc" : "asc");
    }
  };

  const data = networks.data;

  return (
    <div>
      <div className="flex items-end justify-between gap-3">
        <div className="w-72">
          <label htmlFor={searchId} className="block text-sm font-medium">
            Search networks
          </label>
          <input
            id={searchId}
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder="title, author"
            className="mt-1 block w-full rounded border border-rule bg-white px-2.5 py-1.5 text-sm focus:border-copper focus:outline-none"
          />
        </div>
        {networks.isFetching && !networks.isLoading && <span className="text-xs text-ink/50">Updating…</span>}
      </div>
      <div className="mt-3">
        {networks.isLoading ? (
          <LoadingState label="Loading the team's networks…" />
        ) : networks.isError ? (
          <ErrorState error={networks.error} title="The networks could not be loaded" />
        ) : !data || data.networks.length === 0 ? (
          <EmptyState title={debouncedSearch ? `No network matches “${debouncedSearch}”.` : "No networks in this team yet."}>
            {!debouncedSearch && (canEdit ? "Create one from text or import a file to begin." : "Editors and owners of the team can create networks.")}
          </EmptyState>
        ) : (
          <>
            <div className="overflow-x-auto">
            <table className="w-full border-collapse text-sm">
              <caption className="sr-only">Networks of the team, sorted by {sort}</caption>
              <thead>
                <tr className="border-b border-ink/30 text-left">
                  {COLUMNS.map((c) => (
                    <th key={c.key} scope="col" aria-sort={sort === c.key ? (direction === "asc" ? "ascending" : "descending") : "none"} className="py-1.5 pr-3 font-medium">
                      <button type="button" onClick={() => sortBy(c.key)} className="flex items-center gap-1 hover:text-copper">
                        {c.label}
                        <span aria-hidden="true" className="text-xs text-ink/50">
                          {sort === c.key ? (direction === "asc" ? "▲" : "▼") : ""}
                        </span>
                      </button>
                    </th>
                  ))}
                  <th scope="col">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {data.networks.map((n) => (
                  <tr key={n.id} className="border-b border-rule">
                    <td className="py-1.5 pr-3">
                      <Link to={`/networks/${n.id}`} className="font-medium hover:text-copper hover:underline">
                        {n.title}
                      </Link>
                    </td>
                    <td className="py-1.5 pr-3 text-ink/80">{n.author?.name ?? "—"}</td>
                    <td className="py-1.5 pr-3 font-mono text-xs">{n.latestRevision ? `revision ${n.latestRevision}` : <span className="font-sans text-ink/50">not solved</span>}</td>
                    <td className="py-1.5 pr-3 text-xs">
                      <VerdictMark verdict={n.verdict} />
                    </td>
                    <td className="py-1.5 pr-3 text-xs text-ink/70">{updated(n.updatedAt)}</td>
                    <td className="py-1.5">
                      <RowActions network={n} teamId={teamId} canEdit={canEdit} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            </div>
            <Pager page={data.page} pageSize={data.pageSize} total={data.total} onPage={setPage} />
          </>
        )}
      </div>
    </div>
  );
}
