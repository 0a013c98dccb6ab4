import { ErrorState, InlineError, LoadingState } from "@/components/ui/states";
import { roles, type Role } from "@/lib/api-contract";
import { useChangeMemberRole } from "../api/change-member-role";
import { useTeamMembers } from "../api/get-team-members";
import { useRemoveMember } from "../api/remove-member";

// Who is in the team and with which role; owners change roles and remove members (the server refuses the last owner's removal).
export function TeamMembers({ teamId, isOwner, currentUserId }: { teamId: string; isOwner: boolean; currentUserId: string }) {
  const members = useTeamMembers(teamId);
  const change = useChangeMemberRole();
  const remove = useRemoveMember();
  if (members.isLoading) return <LoadingState label="Loading members…" />;
  if (members.isError) return <ErrorState error={members.error} title="The members could not be loaded" />;
  return (
    <div>
      <div className="overflow-x-auto">
      <table className="w-full max-w-2xl text-sm">
        <caption className="sr-only">Members of the team</caption>
        <thead>
          <tr className="border-b border-ink/30 text-left">
            <th scope="col" className="py-1 font-medium">Member</th>
            <th scope="col" className="py-1 font-medium">Role</th>
            <th scope="col"><span className="sr-only">Remove</span></th>
          </tr>
        </thead>
        <tbody>
          {(members.data ?? []).map((m) => (
            <tr key={m.userId} className="border-b border-rule">
              <td className="py-1">
                {m.name} <span className="text-xs text-ink/50">{m.email}</span>
                {m.userId === currentUserId && <span className="text-xs text-ink/50"> (you)</span>}
              </td>
              <td className="py-1">
                {isOwner ? (
                  <select
                    aria-label={`Role of ${m.name}`}
                    value={m.role}
                    disabled={change.isPending}
                    onChange={(e) => change.mutate({ teamId, userId: m.userId, role: e.target.value as Role })}
                    className="rounded border border-rule bg-white px-1.5 py-0.5 text-xs"
                  >
                    {roles.map((r) => (
                      <option key={r} value={r}>
                        {r}
                      </option>
                    ))}
                  </select>
                ) : (
                  <span className="text-xs">{m.role}</span>
                )}
              </td>
              <td className="py-1 text-right">
                {isOwner && m.userId !== currentUserId && (
                  <button
                    type="button"
                    className="text-xs text-ink/60 hover:text-signal"
                    onClick={() => {
                      if (window.confirm(`Remove ${m.name} from the team? They lose access to its networks at once.`)) remove.mutate({ teamId, userId: m.userId });
                    }}
                  >
                    Remove
                  </button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      </div>
      <InlineError error={change.error ?? remove.error} />
    </div>
  );
}
