import { useState } from "react";
import { useParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/states";
import { roleAtLeast } from "@/lib/api-contract";
import { RequireAccount } from "@/features/auth";
import { AddCellForm, TeamCells } from "@/features/cells";
import { CreateNetworkDialog, ImportNetworkDialog, NetworksTable } from "@/features/networks";
import { CreateTeamForm, InviteMemberForm, RequiredApprovals, TeamMembers } from "@/features/teams";

export function TeamRoute() {
  const { teamId = "" } = useParams();
  const [creating, setCreating] = useState(false);
  const [importing, setImporting] = useState(false);
  return (
    <RequireAccount>
      {(me) => {
        const team = me.teams.find((t) => t.id === teamId);
        if (!team) {
          return <EmptyState title="No such team, or you are not a member of it.">Ask the team's owner for an invitation.</EmptyState>;
        }
        const canEdit = roleAtLeast(team.role, "editor");
        return (
          <section>
            <div className="flex flex-wrap items-end justify-between gap-3 border-b border-rule pb-3">
              <div>
                <h1 className="text-2xl font-semibold tracking-tight">{team.name}</h1>
                <p className="mt-0.5 text-sm text-ink/70">
                  Your role: {team.role}
                  {team.personal ? " · your personal team" : ""}
                </p>
              </div>
              {canEdit && (
                <div className="flex gap-2">
                  <Button onClick={() => setImporting(true)}>Import from file</Button>
                  <Button variant="primary" onClick={() => setCreating(true)}>
                    New network
                  </Button>
                </div>
              )}
            </div>
            <div className="mt-4">
              <NetworksTable teamId={team.id} role={team.role} />
            </div>
            <section className="mt-10 border-t border-rule pt-4" aria-labelledby="members-heading">
              <h2 id="members-heading" className="text-sm font-semibold">
                Members
              </h2>
              <div className="mt-2">
                <TeamMembers teamId={team.id} isOwner={team.role === "owner"} currentUserId={me.user.id} />
              </div>
              {team.role === "owner" && (
                <div className="mt-3">
                  <InviteMemberForm teamId={team.id} />
                </div>
              )}
            </section>
            <section className="mt-10 border-t border-rule pt-4" aria-labelledby="review-heading">
              <h2 id="review-heading" className="text-sm font-semibold">
                Review
              </h2>
              <div className="mt-2">
                <RequiredApprovals teamId={team.id} isOwner={team.role === "owner"} />
              </div>
            </section>
            <section className="mt-10 border-t border-rule pt-4" aria-labelledby="cells-heading">
              <h2 id="cells-heading" className="text-sm font-semibold">
                Cells
              </h2>
              <p className="mt-0.5 max-w-3xl text-xs text-ink/70">
                Reusable blocks of elements the team's networks place by id, as <code className="font-mono">{"<name> cell <id> <terminal>=<node> …"}</code>
              </p>
              <div className="mt-2">
                <TeamCells teamId={team.id} canEdit={canEdit} />
              </div>
              {canEdit && (
                <div className="mt-5">
                  <AddCellForm teamId={team.id} />
                </div>
              )}
            </section>
            <section className="mt-10 border-t border-rule pt-4" aria-label="Teams">
              <CreateTeamForm />
            </section>
            {creating && <CreateNetworkDialog teamId={team.id} open={creating} onClose={() => setCreating(false)} />}
            {importing && <ImportNetworkDialog teamId={team.id} open={importing} onClose={() => setImporting(false)} />}
          </section>
        );
      }}
    </RequireAccount>
  );
}
