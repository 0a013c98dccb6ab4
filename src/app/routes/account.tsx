import { Link } from "react-router-dom";
import { ApiTokens } from "@/features/account/components/api-tokens";
import { RequireAccount } from "@/features/auth/components/require-account";

export function AccountRoute() {
  return (
    <RequireAccount>
      {(me) => (
        <section className="max-w-4xl">
          <h1 className="text-2xl font-semibold tracking-tight">Your account</h1>
          <p className="mt-1 text-sm text-ink/70">
            {me.user.name} · {me.user.email}
          </p>
          <h2 className="mt-8 text-lg font-semibold">API tokens</h2>
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
