import { useState } from "react";
import { Link, useParams, useSearchParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { MathTex } from "@/components/ui/math";
import { EmptyState, ErrorState, LoadingState } from "@/components/ui/states";
import { RequireAccount } from "@/features/auth";
import { useRevision, useRevisions } from "@/features/derivations";
import { useRevisionComparison } from "@/features/history";
import { Schematic } from "@/features/canvas";
import { useNetwork } from "@/features/networks";
import { VerdictMark } from "@/features/review";
import { compactTex } from "@/lib/printed-forms";
import { printElementLine, type EngineNetwork } from "@/lib/engine-netlist";
import type { Revision } from "@/lib/api-contract";

const RESULTS = [
  ["vth", "V_{\\mathrm{th}}"],
  ["rth", "R_{\\mathrm{th}}"],
  ["isc", "I_{\\mathrm{sc}}"],
] as const;

function RevisionSide({ revision, changed }: { revision: Revision; changed: ReadonlySet<string> }) {
  return (
    <div className="min-w-0">
      <h3 className="text-sm font-semibold">Revision {revision.number}</h3>
      <p className="text-xs text-ink/60">
        {revision.createdBy?.name ?? ""} {revision.createdAt ? `· ${new Date(revision.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}` : ""}
      </p>
      <div className="mt-2 rounded border border-rule bg-white/40 p-1">
        <Schematic network={{ ground: "0", ...revision.circuit } as EngineNetwork} />
      </div>
      <dl className="mt-2 space-y-1 text-sm">
        {RESULTS.map(([name, tex]) => (
          <div key={name} className={changed.has(name) ? "border-l-2 border-copper pl-2" : "pl-2.5"}>
            <dt className="sr-only">{name}</dt>
            <dd className="overflow-x-auto">{revision.results[name] ? <MathTex tex={`${tex} = ${compactTex(revision.results[name]!)}`} /> : <span className="text-ink/50">none</span>}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

function Comparison({ networkId, from, to }: { networkId: string; from: number; to: number }) {
  const a = useRevision(networkId, from);
  const b = useRevision(networkId, to);
  const comparison = useRevisionComparison(networkId, from, to);
  if (a.isLoading || b.isLoading || comparison.isLoading) return <LoadingState label="Loading both revisions…" />;
  if (a.isError || b.isError || comparison.isError) return <ErrorState error={a.error ?? b.error ?? comparison.error} title="The revisions could not be compared" />;
  if (!a.data || !b.data || !comparison.data) return null;
  const { circuit } = comparison.data;
  const diff = {
    elements: [
      ...circuit.removed.map((e) => ({ name: e.name, before: e, after: null })),
      ...circuit.changed.map((c) => ({ name: c.name, before: c.before, after: c.after })),
      ...circuit.added.map((e) => ({ name: e.name, before: null, after: e })),
    ],
    portChanged: circuit.port !== null,
  };
  const changed = new Set(comparison.data.results.filter((r) => r.changed).map((r) => r.name));
  const changedResults = RESULTS.filter(([n]) => changed.has(n)).map(([n]) => n);
  const line = (e: Parameters<typeof printElementLine>[0] | null) => (e ? printElementLine(e) : "—");
  return (
    <section aria-label={`Revision ${from} compared with ${to}`} className="mt-6">
      <h2 className="text-lg font-semibold tracking-tight">
        Revision {from} and revision {to}
      </h2>
      <div className="mt-2 text-sm">
        <p>
          Circuit: {diff.elements.length === 0 && !diff.portChanged ? "the same." : `${diff.elements.length} element${diff.elements.length === 1 ? " differs" : "s differ"}${diff.portChanged ? "; the port moved" : ""}.`}{" "}
          Results: {changedResults.length === 0 ? "the same." : `${changedResults.map((n) => ({ vth: "Vth", rth: "Rth", isc: "Isc" })[n]).join(", ")} changed (marked in copper).`}
        </p>
        {diff.elements.length > 0 && (
          <div className="overflow-x-auto">
          <table className="mt-2 w-full font-mono text-xs">
            <caption className="sr-only">Elements that differ</caption>
            <thead>
              <tr className="text-left font-sans text-ink/60">
                <th scope="col" className="font-medium">Revision {from}</th>
                <th scope="col" className="font-medium">Revision {to}</th>
              </tr>
            </thead>
            <tbody>
              {diff.elements.map((d) => (
                <tr key={d.name} className="border-t border-rule/60">
                  <td className={`py-0.5 ${d.after ? "" : "text-signal line-through"}`}>{line(d.before)}</td>
                  <td className={`py-0.5 ${d.before ? "" : "text-verdigris"}`}>{line(d.after)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        )}
      </div>
      <div className="mt-4 grid gap-6 md:grid-cols-2">
        <RevisionSide revision={a.data} changed={changed} />
        <RevisionSide revision={b.data} changed={changed} />
      </div>
    </section>
  );
}

export function RevisionHistoryRoute() {
  const { networkId = "" } = useParams();
  const [params, setParams] = useSearchParams();
  const network = useNetwork(networkId);
  const revisions = useRevisions(networkId);
  const [picked, setPicked] = useState<number[]>([]);
  const from = Number(params.get("from")) || null;
  const to = Number(params.get("to")) || null;
  const toggle = (number: number) => setPicked((list) => (list.includes(number) ? list.filter((x) => x !== number) : [...list, number].slice(-2)));
  return (
    <RequireAccount>
      {() => (
        <section>
          <p className="text-xs text-ink/60">
            <Link to={`/networks/${networkId}`} className="hover:text-copper">
              {network.data?.title ?? "Network"}
            </Link>{" "}
            / history
          </p>
          <h1 className="text-2xl font-semibold tracking-tight">Revision history</h1>
          <div className="mt-4">
            {revisions.isLoading ? (
              <LoadingState label="Loading revisions…" />
            ) : revisions.isError ? (
              <ErrorState error={revisions.error} title="The revisions could not be loaded" />
            ) : !revisions.data?.length ? (
              <EmptyState title="No revisions yet.">Each Solve stores one.</EmptyState>
            ) : (
              <>
                <p className="text-sm text-ink/70">Tick two revisions to compare their circuits and results side by side.</p>
                <div className="overflow-x-auto">
                <table className="mt-2 w-full text-sm">
                  <caption className="sr-only">Derivation revisions, newest first</caption>
                  <thead>
                    <tr className="border-b border-ink/30 text-left">
                      <th scope="col" className="w-16 py-1 font-medium">Compare</th>
                      <th scope="col" className="py-1 font-medium">Revision</th>
                      <th scope="col" className="py-1 font-medium">Solved</th>
                      <th scope="col" className="py-1 font-medium">By</th>
                      <th scope="col" className="py-1 font-medium">Verdict</th>
                      <th scope="col" className="py-1 font-medium">Rth</th>
                    </tr>
                  </thead>
                  <tbody>
                    {revisions.data.map((r) => (
                      <tr key={r.number} className="border-b border-rule">
                        <td className="py-1">
                          <input type="checkbox" aria-label={`Compare revision ${r.number}`} checked={picked.includes(r.number)} onChange={() => toggle(r.number)} className="accent-copper" />
                        </td>
                        <td className="py-1">
                          <Link to={`/networks/${networkId}/r/${r.number}`} className="font-medium hover:text-copper">
                            revision {r.number}
                          </Link>
                        </td>
                        <td className="py-1 text-xs text-ink/70">{r.createdAt ? new Date(r.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" }) : ""}</td>
                        <td className="py-1 text-xs">{r.createdBy?.name ?? "—"}</td>
                        <td className="py-1 text-xs">
                          <VerdictMark verdict={r.verdict.verdict} />
                        </td>
                        <td className="max-w-xs truncate py-1 font-mono text-xs" title={r.summary.rth ?? undefined}>
                          {r.summary.rth ?? "—"}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
                </div>
                <Button
                  className="mt-3"
                  variant="primary"
                  disabled={picked.length !== 2}
                  onClick={() => {
                    const [x, y] = [...picked].sort((p, q) => p - q);
                    setParams({ from: String(x), to: String(y) });
                  }}
                >
                  Compare the two
                </Button>
              </>
            )}
          </div>
          {from && to && <Comparison networkId={networkId} from={from} to={to} />}
        </section>
      )}
    </RequireAccount>
  );
}
