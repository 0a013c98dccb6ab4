import { Link, NavLink, Outlet, useMatches, useNavigate } from "react-router-dom";
import { useMe, useSignOut, VerifyEmailBanner } from "@/features/auth";
import { PortMark } from "@/components/ui/port-mark";

interface RouteHandle {
  wide?: boolean;
}

function AccountNav() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (me.isLoading) return <span className="text-ink/40">…</span>;
  if (!me.data) {
    return (
      <>
        <Link to="/sign-in" className="hover:text-copper">
          Sign in
        </Link>
        <Link to="/sign-up" className="rounded border border-copper px-2 py-0.5 text-copper hover:bg-copper hover:text-paper">
          Sign up
        </Link>
      </>
    );
  }
  return (
    <>
      {me.data.teams.slice(0, 4).map((team) => (
        <NavLink key={team.id} to={`/teams/${team.id}`} className={({ isActive }) => (isActive ? "text-copper" : "hover:text-copper")}>
          {team.name}
        </NavLink>
      ))}
      <NavLink to="/reviews/awaiting" className={({ isActive }) => (isActive ? "text-copper" : "hover:text-copper")}>
        Reviews
      </NavLink>
      <NavLink to="/account" className={({ isActive }) => (isActive ? "text-copper" : "text-ink/60 hover:text-copper")} title={`${me.data.user.email} · account settings`}>
        {me.data.user.name}
      </NavLink>
      <button
        type="button"
        className="hover:text-copper"
        onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate("/") })}
        disabled={signOut.isPending}
      >
        Sign out
      </button>
    </>
  );
}

export function AppLayout() {
  const matches = useMatches();
  const wide = matches.some((m) => (m.handle as RouteHandle | undefined)?.wide);
  const width = wide ? "max-w-[1680px]" : "max-w-7xl";
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-paper focus:px-2">
        Skip to content
      </a>
      <header className="border-b border-rule print:hidden">
        <div className={`mx-auto flex ${width} flex-wrap items-center justify-between gap-x-4 gap-y-1 px-3 py-3 sm:px-6`}>
          <Link to="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight">
            <PortMark />
            Portfold
          </Link>
          <nav aria-label="Account" className="flex min-w-0 flex-wrap items-center justify-end gap-x-4 gap-y-1 text-sm">
            <AccountNav />
          </nav>
        </div>
      </header>
      <VerifyEmailBanner />
      <main id="main" className={`mx-auto w-full min-w-0 ${width} flex-1 px-3 sm:px-6 ${wide ? "py-4" : "py-8"}`}>
        <Outlet />
      </main>
      <footer className="border-t border-rule">
        <div className={`mx-auto ${width} px-3 py-4 text-xs text-ink/70 sm:px-6`}>
          <p className="font-medium text-ink">Portfold</p>
          <p className="mt-1 max-w-3xl">
            Results are linear, small-signal idealisations. Verify them against measurement, component ratings and the
            codes and licensed practice that apply before building hardware, above all at mains or high voltage.
          </p>
        </div>
      </footer>
    </div>
  );
}
