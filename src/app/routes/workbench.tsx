import { useEffect, useMemo, useState } from "react";
import { Link, Navigate, useNavigate, useParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { EmptyState, ErrorState, LoadingState } from "@/components/ui/states";
import { AnalysisColumn } from "@/features/analysis/components/analysis-column";
import { RequireAccount } from "@/features/auth/components/require-account";
import { useRevision } from "@/features/derivations/api/get-revision";
import { useSolveNetwork, type SolveProgress } from "@/features/derivations/api/solve-network";
import { Ledger } from "@/features/derivations/components/ledger";
import { ExportMenu } from "@/features/export/components/export-menu";
import { layoutFor } from "@/features/canvas/model/sync";
import { NetworkPanel, type NetworkTab } from "@/features/network-editor/components/network-panel";
import { circuitOf, netlistOf, readNetlist } from "@/features/network-editor/lib/netlist";
import { useNetwork } from "@/features/networks/api/get-network";
import { useNetworkBySlug } from "@/features/networks/api/get-network-by-slug";
import { useUpdateNetwork } from "@/features/networks/api/update-network";
import { useComments } from "@/features/review/api/get-comments";
import { ReviewPanel } from "@/features/review/components/review-panel";
import { ShareDialog } from "@/features/sharing/components/share-dialog";
import type { Me, Network } from "@/types/api";

function Workbench({ me, network, k }: { me: Me; network: Network; k: number | null }) {
  const navigate = useNavigate();
  const [text, setText] = useState(() => netlistOf(network.circuit));
  // The drawing's layout as edited here; the stored one until the drawing changes.
  const [layout, setLayout] = useState<unknown>(() => network.circuit.layout);
  const [tab, setTab] = useState<NetworkTab>("text");
  const [sharing, setSharing] = useState(false);
  const [solveProgress, setSolveProgress] = useState<SolveProgress>("sending");
  const saved = useMemo(() => netlistOf(network.circuit), [network.circuit]);
  const dirty = text !== saved || layout !== network.circuit.layout;
  const update = useUpdateNetwork();
  const solve = useSolveNetwork();
  const revision = useRevision(network.id, k);
  const role = network.role ?? me.teams.find((t) => t.id === network.teamId)?.role ?? "viewer";
  const canEdit = role === "owner" || role === "editor";
  const canReview = canEdit || role === "reviewer";
  const comments = useComments(network.id, k ?? 0, k !== null);

  // Leaving with unsaved edits asks first (the browser's own prompt).
  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);

  const save = async () => {
    const read = readNetlist(text);
    if (!read.network) return false;
    // The drawing is saved in step with the text (parts added in the text get their automatic place).
    await update.mutateAsync({ networkId: network.id, circuit: circuitOf({ ...read.network, layout: layoutFor(read.network, layout) }) });
    return true;
  };
  const runSolve = async () => {
    solve.reset();
    try {
      if (dirty && !(await save())) return;
      const created = await solve.mutateAsync({ networkId: network.id, onProgress: setSolveProgress });
      navigate(`/networks/${network.id}/r/${created.k}`);
    } catch {
      // The error is shown beside the netlist by the mutation's state.
    }
  };

  // Compared in the printed (canonical) form, so layout and comments do not count as changes.
  const current = readNetlist(text).network;
  const stale = revision.data && current && netlistOf(current) !== netlistOf(revision.data.circuit);
  const latest = network.latestRevision;

  return (
    <div>
      <div className="flex items-end justify-between gap-3 border-b border-rule pb-3 print:border-0">
        <div className="min-w-0 flex-1">
          <p className="text-xs text-ink/60 print:hidden">
            <Link to={`/teams/${network.teamId}`} className="hover:text-copper">
              {me.teams.find((t) => t.id === network.teamId)?.name ?? "Team"}
            </Link>{" "}
            / network
          </p>
          <h1 className="truncate text-2xl font-semibold tracking-tight">{network.title}</h1>
          <p className="mt-0.5 text-xs text-ink/70">
            {k ? (
              <>
                Derivation revision {k}
                {latest && latest !== k ? ` of ${latest}` : ""}
                {revision.data?.author ? ` · solved by ${revision.data.author}` : ""}
                {revision.data?.createdAt ? ` · ${new Date(revision.data.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}` : ""}
                {revision.data?.permalink && (
                  <>
                    {" · "}
                    <Link to={revision.data.permalink} className="font-mono text-ink/60 hover:text-copper">
                      {revision.data.permalink}
                    </Link>
                  </>
                )}
              </>
            ) : (
              "Not solved yet"
            )}
            {network.author ? ` · network by ${network.author}` : ""} · your role: {role}
          </p>
          {k && revision.data && <ReviewPanel revision={revision.data} member canReview={canReview} currentUserId={me.user.id} />}
        </div>
        <div className="flex shrink-0 flex-wrap items-center justify-end gap-2 print:hidden">
          {latest && latest > 0 && (
            <Link to={`/networks/${network.id}/history`} className="rounded border border-rule px-3 py-1.5 text-sm hover:border-ink/40">
              History
            </Link>
          )}
          {revision.data && <ExportMenu revision={revision.data} />}
          {k && canEdit && (
            <Button onClick={() => setSharing(true)} variant="secondary">
              Share
            </Button>
          )}
        </div>
      </div>

      <div className={`mt-4 grid grid-cols-1 gap-6 ${tab === "drawing" ? "lg:grid-cols-[minmax(30rem,1.25fr)_minmax(0,1fr)_16rem]" : "lg:grid-cols-[minmax(18rem,23rem)_minmax(0,1fr)_18rem]"} print:block`}>
        <section aria-label="Network" className="min-w-0 print:mb-4 print:max-w-md">
          <NetworkPanel
            text={text}
            onTextChange={setText}
            canEdit={canEdit}
            dirty={dirty}
            onSave={() => void save().catch(() => undefined)}
            onSolve={() => void runSolve()}
            saving={update.isPending}
            solving={solve.isPending}
            solveProgress={solveProgress}
            saveError={update.error}
            solveError={solve.error}
            printText={revision.data ? netlistOf(revision.data.circuit) : undefined}
            layout={layout}
            onLayoutChange={setLayout}
            onTabChange={setTab}
            teamId={network.teamId}
          />
        </section>
        <section aria-labelledby="ledger-heading" className="min-w-0">
          <div className="flex items-baseline justify-between">
            <h2 id="ledger-heading" className="text-sm font-semibold tracking-tight">
              Ledger
            </h2>
            {stale && (
              <p className="text-xs text-copper print:hidden">
                The netlist differs from revision {k}: {canEdit ? "Solve to record a new revision." : "this ledger shows the stored revision."}
              </p>
            )}
          </div>
          <div className="mt-2">
            {k === null ? (
              <EmptyState title="No derivation yet.">{canEdit ? "Check the netlist and the port, then press Solve." : "An editor of the team has not solved this network yet."}</EmptyState>
            ) : revision.isLoading ? (
              <LoadingState label={`Loading revision ${k}…`} />
            ) : revision.isError ? (
              <ErrorState error={revision.error} title={`Revision ${k} could not be loaded`} />
            ) : revision.data ? (
              <Ledger
                revision={revision.data}
                comments={comments.data ?? []}
                review={{ networkId: network.id, k: revision.data.k, canComment: canReview, currentUserId: me.user.id, revisionAuthorId: revision.data.authorId, isOwner: role === "owner" }}
              />
            ) : null}
          </div>
        </section>
        <section aria-label="Values, Limits and Sweep" className="min-w-0">
          {revision.data ? (
            <AnalysisColumn key={`${network.id}-${revision.data.k}`} results={revision.data.results} />
          ) : (
            <p className="text-sm text-ink/60 print:hidden">Values, Limits and Sweep work on a solved revision.</p>
          )}
        </section>
      </div>
      {sharing && k && <ShareDialog open={sharing} onClose={() => setSharing(false)} networkId={network.id} teamId={network.teamId} k={k} />}
    </div>
  );
}

export function PermalinkRoute() {
  const { slug = "", k = "" } = useParams();
  const network = useNetworkBySlug(slug);
  return (
    <RequireAccount>
      {() =>
        network.isLoading ? (
          <LoadingState label="Opening the permanent link…" />
        ) : network.isError ? (
          <ErrorState error={network.error} title="This link does not open a network you can see" />
        ) : network.data ? (
          <Navigate to={`/networks/${network.data.id}/r/${k}`} replace />
        ) : null
      }
    </RequireAccount>
  );
}

export function WorkbenchRoute() {
  const { networkId = "", k: kParam } = useParams();
  const network = useNetwork(networkId);
  const k = kParam ? Number(kParam) : (network.data?.latestRevision ?? null);
  return (
    <RequireAccount>
      {(me) =>
        network.isLoading ? (
          <LoadingState label="Loading the network…" />
        ) : network.isError ? (
          <ErrorState error={network.error} title="This network could not be opened" />
        ) : network.data ? (
          <Workbench key={network.data.id} me={me} network={network.data} k={k && Number.isInteger(k) && k > 0 ? k : null} />
        ) : null
      }
    </RequireAccount>
  );
}
