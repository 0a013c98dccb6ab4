import { useEffect, useRef } from "react";
import { Link, useSearchParams } from "react-router-dom";
import { ErrorState, LoadingState } from "@/components/ui/states";
import { useVerifyEmail } from "@/features/auth";

export function VerifyEmailRoute() {
  const [params] = useSearchParams();
  const token = params.get("token") ?? "";
  const verify = useVerifyEmail();
  const sent = useRef(false);
  useEffect(() => {
    if (token && !sent.current) {
      sent.current = true;
      verify.mutate({ token });
    }
  }, [token, verify]);
  return (
    <section className="max-w-md">
      <h1 className="text-2xl font-semibold tracking-tight">Confirm your e-mail address</h1>
      <div className="mt-4 text-sm">
        {!token && <p>This link has no token. Open the link from the e-mail exactly as it was sent.</p>}
        {verify.isPending && <LoadingState label="Confirming…" />}
        {verify.isError && <ErrorState error={verify.error} title="The address could not be confirmed" />}
        {verify.isSuccess && (
          <p>
            Your address is confirmed.{" "}
            <Link to="/teams" className="text-copper underline">
              Go to your teams
            </Link>
          </p>
        )}
      </div>
    </section>
  );
}
