import { useState } from "react";
import { Link, useSearchParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { InlineError } from "@/components/ui/states";
import { useRequestPasswordReset, useResetPassword } from "@/features/auth";

function RequestForm() {
  const request = useRequestPasswordReset();
  const [email, setEmail] = useState("");
  if (request.isSuccess) {
    return <p className="mt-4 text-sm">If an account uses {email}, a link to set a new password is on its way. The link works once and expires.</p>;
  }
  return (
    <form
      className="mt-5 space-y-3"
      onSubmit={(event) => {
        event.preventDefault();
        request.mutate({ email });
      }}
    >
      <TextField label="E-mail" type="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
      <InlineError error={request.error} />
      <Button type="submit" variant="primary" disabled={request.isPending}>
        {request.isPending ? "Sending…" : "Send the link"}
      </Button>
    </form>
  );
}

function NewPasswordForm({ token }: { token: string }) {
  const reset = useResetPassword();
  const [password, setPassword] = useState("");
  const [again, setAgain] = useState("");
  if (reset.isSuccess) {
    return (
      <p className="mt-4 text-sm">
        Your password is set and you are signed in.{" "}
        <Link to="/teams" className="text-copper underline">
          Go to your networks
        </Link>
      </p>
    );
  }
  const mismatch = again.length > 0 && again !== password;
  return (
    <form
      className="mt-5 space-y-3"
      onSubmit={(event) => {
        event.preventDefault();
        if (!mismatch) reset.mutate({ token, password });
      }}
    >
      <TextField label="New password" type="password" autoComplete="new-password" required minLength={8} value={password} onChange={(e) => setPassword(e.target.value)} hint="At least 8 characters." />
      <TextField label="New password again" type="password" autoComplete="new-password" required value={again} onChange={(e) => setAgain(e.target.value)} error={mismatch ? "The two passwords differ." : undefined} />
      <InlineError error={reset.error} />
      <Button type="submit" variant="primary" disabled={reset.isPending || mismatch}>
        {reset.isPending ? "Saving…" : "Set the password"}
      </Button>
    </form>
  );
}

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get("token");
  return (
    <section className="max-w-sm">
      <h1 className="text-2xl font-semibold tracking-tight">{token ? "Set a new password" : "Reset your password"}</h1>
      {token ? <NewPasswordForm token={token} /> : <RequestForm />}
    </section>
  );
}
