import { ApiReference } from "@/features/api-reference";

export function ApiReferenceRoute() {
  return (
    <section>
      <h1 className="text-2xl font-semibold tracking-tight">API reference</h1>
      <p className="mt-1 max-w-3xl text-sm text-ink/70">
        Every route of Portfold&apos;s JSON API, from the server&apos;s own description. Scripts send a personal API token from your{" "}
        <a href="/account" className="text-copper hover:underline">
          account page
        </a>{" "}
        as <code className="font-mono">Authorization: Bearer …</code>; errors always have the shape{" "}
        <code className="font-mono">{"{ error: { code, message, fields?, diagnostics? } }"}</code>.
      </p>
      <div className="mt-6">
        <ApiReference />
      </div>
    </section>
  );
}
