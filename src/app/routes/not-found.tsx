import { Link } from "react-router-dom";

export function NotFoundRoute() {
  return (
    <section className="max-w-md">
      <h1 className="text-2xl font-semibold tracking-tight">Nothing at this address</h1>
      <p className="mt-3 text-sm text-ink/80">The page may have moved, or the link may be mistyped.</p>
      <Link to="/" className="mt-4 inline-block text-sm text-copper underline">
        Back to the start
      </Link>
    </section>
  );
}
