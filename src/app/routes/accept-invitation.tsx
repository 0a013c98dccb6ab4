import { Link, useLocation, useNavigate, useSearchParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { ErrorState, LoadingState } from "@/components/ui/states";
import { useMe } from "@/features/auth";
import { useAcceptInvitation, useInvitation } from "@/features/teams";
import { shortDateTime } from "@/lib/dates";

export function AcceptInvitationRoute() {
  const [params] = useSearchParams();
  const token = params.get("token") ?? "";
  const location = useLocation();
  const here = encodeURIComponent(location.pathname + location.search);
  const invitation = useInvitation(token);
  const me = useMe();
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  return (
    <section className="max-w-md">
      <h1 className="text-2xl font-semibold tracking-tight">Join a team</h1>
      <div className="mt-4 space-y-3 text-sm">
        {!token && <p>This link has no token. Open the link from the e-mail exactly as it was sent.</p>}
        {invitation.isLoading && <LoadingState label="Reading the invitation…" />}
        {invitation.isError && <ErrorState error={invitation.error} title="This invitation cannot be used">It may have expired or been accepted already. Ask the team's owner for a new one.</ErrorState>}
        {invitation.data && (
          <>
            <p>
              {invitation.data.invitedBy ?? "The team's owner"} invites {invitation.data.email} to join <strong>{invitation.data.team.name}</strong> as{" "}
              {invitation.data.role}. The invitation expires on {shortDateTime(invitation.data.expiresAt)}.
            </p>
            {me.isLoading ? null : me.data ? (
              <>
                <p className="text-ink/70">
                  Signed in as {me.data.user.name} ({me.data.user.email}).
                </p>
                {me.data.user.email.toLowerCase() !== invitation.data.email.toLowerCase() ? (
                  <p className="text-copper" role="note">
                    This invitation is for {invitation.data.email} only: sign out and sign in with that address to accept it.
                  </p>
                ) : me.data.user.emailVerified === false ? (
                  <p className="text-copper" role="note">
                    Confirm {invitation.data.email} first (the link is in the mail we sent it), then join.
                  </p>
                ) : null}
                {accept.isError && <ErrorState error={accept.error} title="The invitation could not be accepted" />}
                <Button variant="primary" disabled={accept.isPending} onClick={() => accept.mutate({ token }, { onSuccess: (data) => navigate(`/teams/${data.team.id}`) })}>
                  {accept.isPending ? "Joining…" : `Join ${invitation.data.team.name}`}
                </Button>
              </>
            ) : (
              <p>
                <Link to={`/sign-in?next=${here}`} className="text-copper underline">
                  Sign in
                </Link>{" "}
                or{" "}
                <Link to={`/sign-up?next=${here}`} className="text-copper underline">
                  create an account
                </Link>{" "}
                to accept.
              </p>
            )}
          </>
        )}
      </div>
    </section>
  );
}
