import { Link, useParams } from "react-router-dom";
import { ErrorState, LoadingState } from "@/components/ui/states";
import { AnalysisColumn } from "@/features/analysis";
import { useMe } from "@/features/auth";
import { useRevision, Ledger, ResultCard } from "@/features/derivations";
import { ExportMenu } from "@/features/export";
import { DrawingView } from "@/features/canvas";
import { useNetwork } from "@/features/networks";
import { useComments, ReviewPanel } from "@/features/review";
import { useSharedRevision } from "@/features/sharing";
import { ApiError } from "@/lib/api-client";
import { shortDateTime } from "@/lib/dates";
import { roleAtLeast } from "@/lib/api-contract";
import { printNetlistText, type EngineNetwork } from "@/lib/engine-netlist";

// The page behind a share link: one revision, read-only, no account needed. Team members who
// sign in see the review notes and may add their own.
export function SharedViewRoute() {
  const { token = "" } = useParams();
  const shared = useSharedRevision(token);
  const me = useMe();
  const revision = shared.data?.revision;
  const valueSets = shared.data?.valueSets ?? [];
  // Membership is the server's to decide: reading the network succeeds only for members.
  const network = useNetwork(me.data && revision ? revision.networkId : "");
  const member = Boolean(me.data && network.data);
  const role = network.data?.role ?? null;
  const canReview = role !== null && roleAtLeast(role, "reviewer");
  const comments = useComments(revision?.networkId ?? "", revision?.number ?? 0, member);
  // Members read the revision as the team sees it too: with its count of open notes.
  const memberRevision = useRevision(member ? (revision?.networkId ?? "") : "", member ? (revision?.number ?? null) : null);
  const here = `/s/${token}`;

  if (shared.isLoading) return <LoadingState label="Opening the shared revision…" />;
  if (shared.isError) {
    const gone = shared.error instanceof ApiError && (shared.error.status === 404 || shared.error.status === 410);
    return (
      <section className="max-w-lg">
        <h1 className="text-2xl font-semibold tracking-tight">This share link does not open</h1>
        <div className="mt-3">
          <ErrorState error={shared.error} title={gone ? "The link was revoked, has expired, or never existed." : "The shared revision could not be loaded."} />
        </div>
        <p className="mt-3 text-sm text-ink/70">Ask whoever sent it for a new link.</p>
      </section>
    );
  }
  if (!revision) return null;

  const commentPath = me.data ? (
    member ? null : (
      <p className="text-[11px] text-ink/50">Notes are for members of the network's team.</p>
    )
  ) : (
    <Link to={`/sign-in?next=${encodeURIComponent(here)}`} className="text-[11px] text-copper hover:underline">
      Sign in to comment
    </Link>
  );

  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-3 border-b border-rule pb-3">
        <div className="min-w-0 flex-1 basis-72">
          <p className="text-xs text-ink/60">Shared revision · read-only</p>
          <h1 className="break-words text-2xl font-semibold tracking-tight">{revision.network.title}</h1>
          <p className="mt-0.5 text-xs text-ink/70">
            Derivation revision {revision.number}
            {revision.createdBy ? ` · solved by ${revision.createdBy.name}` : ""}
            {revision.createdAt ? ` · ${shortDateTime(revision.createdAt)}` : ""}
          </p>
          <ReviewPanel revision={memberRevision.data ?? revision} member={member} canReview={canReview} currentUserId={me.data?.user.id ?? null} />
        </div>
        <div className="flex flex-wrap items-center gap-2 print:hidden">
          {member && (
            <Link to={`/networks/${revision.networkId}/r/${revision.number}`} className="rounded border border-rule px-3 py-1.5 text-sm hover:border-ink/40">
              Open in the workbench
            </Link>
          )}
          {!me.data && !me.isLoading && (
            <Link to={`/sign-in?next=${encodeURIComponent(here)}`} className="rounded bg-copper px-3 py-1.5 text-sm font-medium text-paper hover:bg-copper/90">
              Sign in to comment
            </Link>
          )}
          <ExportMenu revision={revision} valueSets={valueSets} />
        </div>
      </div>
      <div className="mt-3">
        <ResultCard results={revision.results} portLabel={`${revision.circuit.port.plus}–${revision.circuit.port.minus}`} />
      </div>
      <div className="mt-4 grid grid-cols-1 gap-6 min-[1100px]:grid-cols-[minmax(15rem,18rem)_minmax(0,1fr)_15rem] min-[1440px]:grid-cols-[minmax(16rem,21rem)_minmax(0,1fr)_18rem] print:block">
        <section aria-labelledby="shared-network-heading" className="min-w-0 print:hidden">
          <h2 id="shared-network-heading" className="mb-1 text-sm font-semibold">
            Network
          </h2>
          <div className="rounded border border-rule bg-white/40 p-1">
            <DrawingView network={{ ground: "0", ...revision.circuit } as EngineNetwork} layout={revision.circuit.layout} readOnly height={300} />
          </div>
          {/* The netlist exactly as the engine prints it, so copying it out pastes back as a valid netlist. */}
          <pre className="mt-2 overflow-x-auto whitespace-pre rounded-sm bg-white/60 p-2 font-mono text-[11px] text-ink/80" aria-label="Netlist">
            {printNetlistText({ ground: "0", ...revision.circuit } as EngineNetwork)}
          </pre>
        </section>
        <section aria-labelledby="ledger-heading" className="min-w-0">
          <h2 id="ledger-heading" className="text-sm font-semibold tracking-tight">
            Ledger
          </h2>
          <div className="mt-2">
            <Ledger revision={revision} comments={comments.data ?? []} review={{ networkId: revision.networkId, number: revision.number, canComment: member && canReview, currentUserId: me.data?.user.id ?? null, revisionAuthorId: revision.createdBy?.id ?? null, isOwner: role === "owner", commentPath }} />
          </div>
        </section>
        <section aria-label="Values, Limits and Sweep" className="min-w-0">
          <AnalysisColumn results={revision.results} circuit={revision.circuit} valueSets={valueSets} />
        </section>
      </div>
    </div>
  );
}
