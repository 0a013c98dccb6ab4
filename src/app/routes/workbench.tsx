import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useMemo, useState } from "react";
import { Link, Navigate, useNavigate, useParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { EmptyState, ErrorState, LoadingState } from "@/components/ui/states";
import { AnalysisColumn } from "@/features/analysis";
import { RequireAccount } from "@/features/auth";
import { useRevision, useSolveNetwork, type SolveProgress, Ledger, ResultCard } from "@/features/derivations";
import { useValueSets } from "@/features/value-sets";
import { useTeamCells } from "@/features/cells";
import { AttachmentsSection } from "@/features/attachments";
import { SaveConflict, NetworkPanel, type NetworkTab, circuitOf, netlistOf, readNetlist } from "@/features/network-editor";
import { NetworkHeading, networkQueryOptions, useNetwork, useNetworkBySlug, useUpdateNetwork, type UpdateNetworkInput } from "@/features/networks";
import { ApiError } from "@/lib/api-client";
import { errorMessage } from "@/components/ui/states";
import { ExportMenu } from "@/features/export";
import { layoutFor } from "@/features/canvas";
import { useComments, ReviewPanel } from "@/features/review";
import { ShareDialog } from "@/features/sharing";
import { roleAtLeast, type Me, type Network } from "@/lib/api-contract";

// The text the network is edited as: what was typed, or the printed form of a network made from JSON.
const textOf = (network: Network) => network.netlist ?? netlistOf(network.circuit);
const layoutKey = (layout: unknown) => JSON.stringify(layout ?? null);

function Workbench({ me, network, number }: { me: Me; network: Network; number: number | null }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [text, setText] = useState(() => textOf(network));
  // The drawing's layout as edited here; the stored one until the drawing changes.
  const [layout, setLayout] = useState<unknown>(() => network.circuit.layout);
  // What was last saved from (or loaded into) this page, and the copy's time stamp for the stale check.
  const [saved, setSaved] = useState(() => ({ text: textOf(network), layout: layoutKey(network.circuit.layout), updatedAt: network.updatedAt }));
  const [conflict, setConflict] = useState<Network | null>(null);
  const [tab, setTab] = useState<NetworkTab>("text");
  const [sharing, setSharing] = useState(false);
  const [solveProgress, setSolveProgress] = useState<SolveProgress>("sending");
  const dirty = text !== saved.text || layoutKey(layout) !== saved.layout;
  const update = useUpdateNetwork();
  const solve = useSolveNetwork();
  const revision = useRevision(network.id, number);
  const role = network.role ?? me.teams.find((t) => t.id === network.teamId)?.role ?? "viewer";
  const canEdit = roleAtLeast(role, "editor");
  const canReview = roleAtLeast(role, "reviewer");
  const comments = useComments(network.id, number ?? 0, number !== null);
  const valueSets = useValueSets(network.id);
  const teamCells = useTeamCells(network.teamId);
  const cellDefinitions = useMemo(() => teamCells.data?.map((cell) => cell.definition), [teamCells.data]);

  // Leaving with unsaved edits asks first (the browser's own prompt).
  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);

  // Every save names the copy it was made from; a 409 "stale" opens the conflict panel instead of losing either side.
  const patch = async (changes: Omit<UpdateNetworkInput, "networkId" | "expectedUpdatedAt">, expectedUpdatedAt = saved.updatedAt) => {
    try {
      const next = await update.mutateAsync({ networkId: network.id, ...changes, expectedUpdatedAt });
      setSaved((current) => ({ ...current, updatedAt: next.updatedAt }));
      return next;
    } catch (error) {
      if (error instanceof ApiError && error.code === "stale") {
        setConflict(await queryClient.fetchQuery({ ...networkQueryOptions(network.id), staleTime: 0 }));
        update.reset();
      }
      throw error;
    }
  };
  const save = async (expectedUpdatedAt?: string) => {
    const read = readNetlist(text);
    if (!read.network) return false;
    // The drawing is saved in step with the text (parts added in the text get their automatic place).
    const circuit = circuitOf({ ...read.network, layout: layoutFor(read.network, layout) });
    const sent = { text, layout: layoutKey(layout) };
    await patch({ circuit, netlist: text }, expectedUpdatedAt);
    setSaved((current) => ({ ...current, ...sent }));
    setConflict(null);
    return true;
  };
  const runSolve = async () => {
    solve.reset();
    try {
      if (dirty && !(await save())) return;
      const created = await solve.mutateAsync({ networkId: network.id, onProgress: setSolveProgress });
      navigate(`/networks/${network.id}/r/${created.number}`);
    } catch {
      // The error is shown beside the netlist and on the result card by the mutation's state.
    }
  };
  const takeTheirs = (theirs: Network) => {
    setText(textOf(theirs));
    setLayout(theirs.circuit.layout);
    setSaved({ text: textOf(theirs), layout: layoutKey(theirs.circuit.layout), updatedAt: theirs.updatedAt });
    setConflict(null);
  };

  // Compared in the printed (canonical) form, so layout and comments do not count as changes.
  const current = readNetlist(text).network;
  const stale = revision.data && current && netlistOf(current) !== netlistOf(revision.data.circuit);
  const latest = network.latestRevision;
  const olderNote =
    solve.error != null ? (
      <>
        <span className="font-medium">The last Solve failed: {errorMessage(solve.error)}</span> This card shows revision {number}, from before it; see the messages beside the netlist.
      </>
    ) : stale ? (
      <>The netlist has changed since revision {number}: {canEdit ? "Solve to bring this result up to date." : "this is the stored revision."}</>
    ) : undefined;

  return (
    <div>
      <div className="flex flex-col gap-3 border-b border-rule pb-3 sm:flex-row sm:flex-wrap sm:items-end sm:justify-between print:border-0">
        <div className="min-w-0 flex-1 sm:basis-72">
          <p className="text-xs text-ink/60 print:hidden">
            <Link to={`/teams/${network.teamId}`} className="hover:text-copper">
              {me.teams.find((t) => t.id === network.teamId)?.name ?? "Team"}
            </Link>{" "}
            / network
          </p>
          <NetworkHeading title={network.title} description={network.description} canEdit={canEdit} onSave={(changes) => patch(changes)}>
            <p className="mt-0.5 break-words text-xs text-ink/70">
              {number ? (
                <>
                  Derivation revision {number}
                  {latest && latest !== number ? ` of ${latest}` : ""}
                  {revision.data?.createdBy ? ` · solved by ${revision.data.createdBy.name}` : ""}
                  {revision.data?.createdAt ? ` · ${new Date(revision.data.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}` : ""}
                  {revision.data?.permalink && (
                    <>
                      {" · "}
                      <Link to={revision.data.permalink} className="break-all font-mono text-ink/60 hover:text-copper">
                        {revision.data.permalink}
                      </Link>
                    </>
                  )}
                </>
              ) : (
                "Not solved yet"
              )}
              {network.author ? ` · network by ${network.author.name}` : ""} · your role: {role}
            </p>
          </NetworkHeading>
          {number && revision.data && <ReviewPanel revision={revision.data} member canReview={canReview} currentUserId={me.user.id} />}
        </div>
        <div className="flex flex-wrap items-center gap-2 print:hidden">
          {latest && latest > 0 && (
            <Link to={`/networks/${network.id}/history`} className="rounded border border-rule px-3 py-1.5 text-sm hover:border-ink/40">
              History
            </Link>
          )}
          {revision.data && <ExportMenu revision={revision.data} valueSets={valueSets.data} />}
          {number && canEdit && (
            <Button onClick={() => setSharing(true)} variant="secondary">
              Share
            </Button>
          )}
        </div>
      </div>

      {revision.data && (
        <div className="mt-3">
          <ResultCard results={revision.data.results} portLabel={`${revision.data.circuit.port.plus}–${revision.data.circuit.port.minus}`} older={olderNote} />
        </div>
      )}
      {conflict && (
        <div className="mt-3">
          <SaveConflict mine={text} theirs={textOf(conflict)} onKeepMine={() => void save(conflict.updatedAt).catch(() => undefined)} onTakeTheirs={() => takeTheirs(conflict)} />
        </div>
      )}

      {/* Three columns from ~1100 px; below, the network and the analysis stack above and below the ledger. */}
      <div
        className={`mt-4 grid grid-cols-1 gap-6 ${tab === "drawing" ? "min-[1100px]:grid-cols-[minmax(24rem,1.1fr)_minmax(0,1fr)_15rem] min-[1440px]:grid-cols-[minmax(30rem,1.25fr)_minmax(0,1fr)_16rem]" : "min-[1100px]:grid-cols-[minmax(17rem,20rem)_minmax(0,1fr)_15rem] min-[1440px]:grid-cols-[minmax(18rem,23rem)_minmax(0,1fr)_18rem]"} print:block`}
      >
        <section aria-label="Network" className="min-w-0 space-y-5 print:mb-4 print:max-w-md">
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
            teamCells={cellDefinitions}
          />
          <AttachmentsSection networkId={network.id} canEdit={canEdit} />
        </section>
        <section aria-labelledby="ledger-heading" className="min-w-0">
          <h2 id="ledger-heading" className="text-sm font-semibold tracking-tight">
            Ledger
          </h2>
          <div className="mt-2">
            {number === null ? (
              <EmptyState title="No derivation yet.">{canEdit ? "Check the netlist and the port, then press Solve." : "An editor of the team has not solved this network yet."}</EmptyState>
            ) : revision.isLoading ? (
              <LoadingState label={`Loading revision ${number}…`} />
            ) : revision.isError ? (
              <ErrorState error={revision.error} title={`Revision ${number} could not be loaded`} />
            ) : revision.data ? (
              <Ledger
                revision={revision.data}
                comments={comments.data ?? []}
                review={{ networkId: network.id, number: revision.data.number, canComment: canReview, currentUserId: me.user.id, revisionAuthorId: revision.data.createdBy?.id ?? null, isOwner: role === "owner" }}
              />
            ) : null}
          </div>
        </section>
        <section aria-label="Values, Limits and Sweep" className="min-w-0">
          {revision.data ? (
            <AnalysisColumn key={`${network.id}-${revision.data.number}`} results={revision.data.results} circuit={revision.data.circuit} networkId={network.id} canSaveValues={canEdit} />
          ) : (
            <p className="text-sm text-ink/60 print:hidden">Values, Limits and Sweep work on a solved revision.</p>
          )}
        </section>
      </div>
      {sharing && number && <ShareDialog open={sharing} onClose={() => setSharing(false)} networkId={network.id} teamId={network.teamId} number={number} />}
    </div>
  );
}

export function PermalinkRoute() {
  const { slug = "", number = "" } = useParams();
  const network = useNetworkBySlug(slug);
  return (
    <RequireAccount>
      {() =>
        network.isLoading ? (
          <LoadingState label="Opening the permanent link…" />
        ) : network.isError ? (
          <ErrorState error={network.error} title="This link does not open a network you can see" />
        ) : network.data ? (
          <Navigate to={`/networks/${network.data.id}/r/${number}`} replace />
        ) : null
      }
    </RequireAccount>
  );
}

export function WorkbenchRoute() {
  const { networkId = "", number: numberParam } = useParams();
  const network = useNetwork(networkId);
  const number = numberParam ? Number(numberParam) : (network.data?.latestRevision ?? null);
  return (
    <RequireAccount>
      {(me) =>
        network.isLoading ? (
          <LoadingState label="Loading the network…" />
        ) : network.isError ? (
          <ErrorState error={network.error} title="This network could not be opened" />
        ) : network.data ? (
          <Workbench key={network.data.id} me={me} network={network.data} number={number && Number.isInteger(number) && number > 0 ? number : null} />
        ) : null
      }
    </RequireAccount>
  );
}
