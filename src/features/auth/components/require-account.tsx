import type { ReactNode } from "react";
import { Navigate, useLocation } from "react-router-dom";
import { ErrorState, LoadingState } from "@/components/ui/states";
import type { Me } from "@/lib/api-contract";
import { useMe } from "../api/get-me";

// Screens behind an account: signed-out visitors go to sign-in and come back afterwards.
export function RequireAccount({ children }: { children: (me: Me) => ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isLoading) return <LoadingState label="Checking your session…" />;
  if (me.error) return <ErrorState error={me.error} title="Your session could not be checked" />;
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  return <>{children(me.data)}</>;
}

/** Only local paths are followed after sign-in, so a crafted link cannot send people elsewhere. */
export function safeNext(next: string | null, fallback = "/"): string {
  return next && next.startsWith("/") && !next.startsWith("//") ? next : fallback;
}
