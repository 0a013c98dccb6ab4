import { Link, Navigate } from "react-router-dom";
import { EmptyState } from "@/components/ui/states";
import { RequireAccount } from "@/features/auth";
import { CreateTeamForm } from "@/features/teams";

// With one team the list is in the way: go straight to it.
export function TeamsRoute() {
  return (
    <RequireAccount>
      {(me) =>
        me.teams.length === 1 ? (
          <Navigate to={`/teams/${me.teams[0].id}`} replace />
        ) : (
          <section className="max-w-2xl">
            <h1 className="text-2xl font-semibold tracking-tight">Your teams</h1>
            {me.teams.length === 0 ? (
              <div className="mt-4">
                <EmptyState title="You are not in a team yet.">Create one, or accept an invitation from its owner.</EmptyState>
              </div>
            ) : (
              <ul className="mt-4 divide-y divide-rule border-y border-rule">
                {me.teams.map((t) => (
                  <li key={t.id} className="flex justify-between py-2">
                    <Link to={`/teams/${t.id}`} className="font-medium hover:text-copper">
                      {t.name}
                    </Link>
                    <span className="text-sm text-ink/60">{t.role}</span>
                  </li>
                ))}
              </ul>
            )}
            <div className="mt-6">
              <CreateTeamForm />
            </div>
          </section>
        )
      }
    </RequireAccount>
  );
}
