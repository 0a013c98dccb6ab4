import { useState } from "react";
import { Link, useNavigate, useSearchParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { useSignIn, safeNext } from "@/features/auth";

export function SignInRoute() {
  const [params] = useSearchParams();
  const next = safeNext(params.get("next"), "/teams");
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  return (
    <section className="max-w-sm">
      <h1 className="text-2xl font-semibold tracking-tight">Sign in</h1>
      {params.get("next")?.startsWith("/s/") && <p className="mt-2 text-sm text-ink/80">Sign in with your team account to add notes to the shared revision.</p>}
      <form
        className="mt-5 space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          signIn.mutate({ email, password }, { onSuccess: () => navigate(next, { replace: true }) });
        }}
      >
        <TextField label="E-mail" type="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
        <TextField label="Password" type="password" autoComplete="current-password" required value={password} onChange={(e) => setPassword(e.target.value)} />
        <InlineError error={signIn.error} />
        <Button type="submit" variant="primary" disabled={signIn.isPending}>
          {signIn.isPending ? "Signing in…" : "Sign in"}
        </Button>
      </form>
      <p className="mt-5 text-sm text-ink/80">
        <Link to="/reset-password" className="text-copper underline">
          Forgotten your password?
        </Link>
      </p>
      <p className="mt-1 text-sm text-ink/80">
        New to Portfold?{" "}
        <Link to={`/sign-up${params.get("next") ? `?next=${encodeURIComponent(next)}` : ""}`} className="text-copper underline">
          Create an account
        </Link>
      </p>
    </section>
  );
}
