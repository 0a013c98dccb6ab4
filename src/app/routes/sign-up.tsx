import { useState } from "react";
import { Link, useNavigate, useSearchParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { ApiError } from "@/lib/api-client";
import { useSignUp, safeNext } from "@/features/auth";

export function SignUpRoute() {
  const [params] = useSearchParams();
  const next = safeNext(params.get("next"), "/teams");
  const navigate = useNavigate();
  const signUp = useSignUp();
  const [name, setName] = useState("");
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const fields = signUp.error instanceof ApiError ? (signUp.error.fields ?? {}) : {};
  return (
    <section className="max-w-sm">
      <h1 className="text-2xl font-semibold tracking-tight">Create an account</h1>
      <p className="mt-2 text-sm text-ink/80">You get a personal team at once; we send a link to confirm your e-mail address.</p>
      <form
        className="mt-5 space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          signUp.mutate({ name, email, password }, { onSuccess: () => navigate(next, { replace: true }) });
        }}
      >
        <TextField label="Name" autoComplete="name" required value={name} onChange={(e) => setName(e.target.value)} error={fields.name} />
        <TextField label="E-mail" type="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} error={fields.email} />
        <TextField
          label="Password"
          type="password"
          autoComplete="new-password"
          required
          minLength={8}
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          error={fields.password}
          hint="At least 8 characters."
        />
        {!Object.keys(fields).length && <InlineError error={signUp.error} />}
        <Button type="submit" variant="primary" disabled={signUp.isPending}>
          {signUp.isPending ? "Creating the account…" : "Create account"}
        </Button>
      </form>
      <p className="mt-5 text-sm text-ink/80">
        Already have an account?{" "}
        <Link to={`/sign-in${params.get("next") ? `?next=${encodeURIComponent(next)}` : ""}`} className="text-copper underline">
          Sign in
        </Link>
      </p>
    </section>
  );
}
