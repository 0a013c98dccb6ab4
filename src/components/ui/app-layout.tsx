import { Link, Outlet } from "react-router-dom";
import { PortMark } from "./port-mark";

export function AppLayout() {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-rule">
        <div className="mx-auto flex max-w-7xl items-center justify-between px-6 py-3">
          <Link to="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight">
            <PortMark />
            Portfold
          </Link>
          <nav className="flex items-center gap-4 text-sm">
            <Link to="/sign-in" className="hover:text-copper">
              Sign in
            </Link>
          </nav>
        </div>
      </header>
      <main className="mx-auto w-full max-w-7xl flex-1 px-6 py-8">
        <Outlet />
      </main>
      <footer className="border-t border-rule">
        <div className="mx-auto max-w-7xl px-6 py-4 text-xs text-ink/70">
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
