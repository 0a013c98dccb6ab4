import { useMe } from "../api/get-me";
import { useResendVerification } from "../api/resend-verification";

// Until the address is confirmed the account cannot invite others; say so once, at the top.
export function VerifyEmailBanner() {
  const me = useMe();
  const resend = useResendVerification();
  if (!me.data || me.data.user.emailVerified !== false) return null;
  return (
    <div role="status" className="border-b border-copper/30 bg-copper/5 print:hidden">
      <p className="mx-auto max-w-7xl px-6 py-1.5 text-xs">
        Confirm your e-mail address ({me.data.user.email}) with the link we sent; until then you cannot invite others.{" "}
        {resend.isSuccess ? (
          <span className="text-verdigris">A new link is on its way.</span>
        ) : (
          <button type="button" className="text-copper underline" disabled={resend.isPending} onClick={() => resend.mutate()}>
            Send the link again
          </button>
        )}
      </p>
    </div>
  );
}
