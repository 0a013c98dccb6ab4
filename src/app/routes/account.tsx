import { Link } from "react-router-dom";
import { InlineError } from "@/components/ui/states";
import { ApiTokens, useUpdateAccountSettings } from "@/features/account";
import { RequireAccount } from "@/features/auth";

export function AccountRoute() {
  const update = useUpdateAccountSettings();
  return (
    <RequireAccount>
      {(me) => (
        <section className="max-w-4xl">
          <h1 className="text-2xl font-semibold tracking-tight">Account settings</h1>
          <p className="mt-1 text-sm text-ink/70">
            {me.user.name} · {me.user.email}
          </p>
          <h2 className="mt-6 text-sm font-semibold">Review mail</h2>
          <label className="mt-2 flex max-w-xl items-start gap-2 text-sm">
            <input
              type="checkbox"
              className="mt-0.5 accent-copper"
              checked={me.settings?.reviewMail ?? true}
              disabled={update.isPending}
              onChange={(e) => update.mutate({ reviewMail: e.target.checked })}
            />
            <span>
              Send me review mail: new notes and replies in threads I take part in, and verdicts on revisions I solved.
              <span className="block text-xs text-ink/60">Invitations and account mail (confirmation, password reset) are sent either way.</span>
            </span>
          </label>
          <InlineError error={update.error} />
          <h2 className="mt-8 text-sm font-semibold">API tokens</h2>
          <p className="mt-1 max-w-3xl text-sm text-ink/70">
            For scripts and CI jobs: a token acts with your roles in its teams and never signs in to this page. See the{" "}
            <Link to="/api-reference" className="text-copper hover:underline">
              API reference
            </Link>
            .
          </p>
          <div className="mt-4">
            <ApiTokens me={me} />
          </div>
        </section>
      )}
    </RequireAccount>
  );
}
