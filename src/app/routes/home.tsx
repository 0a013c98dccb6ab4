import { Link } from "react-router-dom";
import { useMe } from "@/features/auth";

export function HomeRoute() {
  const me = useMe();
  return (
    <section className="max-w-3xl">
      <h1 className="text-3xl font-semibold tracking-tight">Portfold</h1>
      <p className="mt-3 text-lg leading-relaxed">
        What does this node look like from here? Enter a linear network, name a port, and read its Thevenin and Norton
        equivalents in closed form, with your gain symbols kept as letters and every step of the nodal analysis in the
        ledger.
      </p>
      <ul className="mt-6 space-y-2 border-l-2 border-rule pl-4 text-sm leading-relaxed">
        <li>Resistors, conductances, L and C in s, independent and all four dependent sources, ideal op-amps.</li>
        <li>Rth by a test source with the sources zeroed and by Voc/Isc, shown to agree.</li>
        <li>Values with SI prefixes, limits as a gain grows without bound, sweeps over decades.</li>
        <li>A share link a design review opens, comments on step by step, and approves.</li>
      </ul>
      {me.data ? (
        <Link to="/teams" className="mt-8 inline-block rounded bg-copper px-4 py-2 text-sm font-medium text-paper hover:bg-copper/90">
          Go to your networks
        </Link>
      ) : (
        <div className="mt-8 flex items-center gap-4 text-sm">
          <Link to="/sign-in" className="inline-block rounded bg-copper px-4 py-2 font-medium text-paper hover:bg-copper/90">
            Sign in to your team
          </Link>
          <Link to="/sign-up" className="text-copper underline">
            Create an account
          </Link>
        </div>
      )}
    </section>
  );
}
