import { Formula } from "@/components/ui/formula";
import { resultTex, resultsInS } from "@/lib/quantities";
import { compactTex } from "@/lib/printed-forms";
import type { RevisionResults } from "@/lib/api-contract";

const stroke = { fill: "none", stroke: "currentColor", strokeWidth: 1.4, strokeLinecap: "round" as const, strokeLinejoin: "round" as const };

function PortTerminals({ x }: { x: number }) {
  return (
    <g>
      <circle cx={x} cy={14} r={4} fill="#FAF8F3" stroke="#B5562B" strokeWidth={1.6} />
      <circle cx={x} cy={74} r={4} fill="#FAF8F3" stroke="#B5562B" strokeWidth={1.6} />
      <text x={x + 7} y={17} fontSize="10" fill="#B5562B" fontWeight="600">+</text>
      <text x={x + 7} y={77} fontSize="10" fill="#B5562B" fontWeight="600">−</text>
    </g>
  );
}

function TheveninSymbol() {
  return (
    <svg viewBox="0 0 130 88" className="h-20 w-32 shrink-0 text-ink" role="img" aria-label="Thevenin equivalent: a voltage source Vth in series with Rth">
      <g {...stroke}>
        <path d="M20 14V32M20 56V74H126M20 14H46M82 14H126" />
        <circle cx={20} cy={44} r={12} fill="#FAF8F3" />
        <rect x={48} y={8} width={32} height={12} fill="#FAF8F3" />
      </g>
      <g fontSize="9" textAnchor="middle" fill="currentColor">
        <text x={20} y={40}>+</text>
        <text x={20} y={53}>−</text>
        <text x={64} y={34}>Rth</text>
        <text x={44} y={48}>Vth</text>
      </g>
      <PortTerminals x={120} />
    </svg>
  );
}

function NortonSymbol() {
  return (
    <svg viewBox="0 0 130 88" className="h-20 w-32 shrink-0 text-ink" role="img" aria-label="Norton equivalent: a current source Isc in parallel with Rth">
      <g {...stroke}>
        <path d="M20 14H120M20 74H120M20 14V32M20 56V74M70 14V28M70 60V74" />
        <circle cx={20} cy={44} r={12} fill="#FAF8F3" />
        <path d="M20 51V37M17 41L20 37L23 41" />
        <rect x={64} y={28} width={12} height={32} fill="#FAF8F3" />
      </g>
      <g fontSize="9" fill="currentColor">
        <text x={36} y={48}>Isc</text>
        <text x={80} y={47}>Rth</text>
      </g>
      <PortTerminals x={120} />
    </svg>
  );
}

// The final equivalents, each drawn small with its expressions beside it.
export function Equivalents({ results }: { results: RevisionResults }) {
  const { vth, rth, isc } = results;
  const inS = resultsInS(results);
  return (
    <div className="grid gap-4 min-[1700px]:grid-cols-2">
      <figure className="flex min-w-0 flex-col items-start gap-3 rounded border border-rule bg-white/50 p-3 sm:flex-row">
        <TheveninSymbol />
        <figcaption className="w-full min-w-0 text-sm">
          <p className="font-medium">Thevenin equivalent</p>
          {vth && rth ? (
            <div className="mt-1 space-y-1">
              <Formula lhs={resultTex("vth", inS)} tex={compactTex(vth)} />
              <Formula lhs={resultTex("rth", inS)} tex={compactTex(rth)} />
            </div>
          ) : (
            <p className="mt-1 text-ink/70">No Thevenin form: {rth ? "" : "the port is an ideal current source (Rth unbounded)."}</p>
          )}
        </figcaption>
      </figure>
      <figure className="flex min-w-0 flex-col items-start gap-3 rounded border border-rule bg-white/50 p-3 sm:flex-row">
        <NortonSymbol />
        <figcaption className="w-full min-w-0 text-sm">
          <p className="font-medium">Norton equivalent</p>
          {isc && rth ? (
            <div className="mt-1 space-y-1">
              <Formula lhs={resultTex("isc", inS)} tex={compactTex(isc)} />
              <Formula lhs={resultTex("rth", inS)} tex={compactTex(rth)} />
            </div>
          ) : (
            <p className="mt-1 text-ink/70">No Norton form: {isc ? "" : "the port is an ideal voltage source (Rth = 0)."}</p>
          )}
        </figcaption>
      </figure>
    </div>
  );
}
