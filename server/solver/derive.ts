// One solve, as a pure function: the engine derives, the outcome is split the way a revision stores it.
import { solveNetwork, type Diagnostic, type Network, type SolveOptions } from "./engine.js";
import { breach, resultBreach, type CapBreach } from "./caps.js";
import { boundDerivation } from "./revision-size.js";

interface StepRecord {
  id: string;
  kind: string;
  title: string;
  explanation: string;
  tex: string;
  data: unknown;
}

/** A finished derivation: the circuit as the engine read it, the results (every form), diagnostics, steps. */
export interface Derivation {
  circuit: Network;
  results: Record<string, unknown>;
  diagnostics: Diagnostic[];
  steps: StepRecord[];
}

export type SolveOutcome =
  | { kind: "solved"; derivation: Derivation }
  | { kind: "ill_posed"; diagnostics: Diagnostic[] }
  | { kind: "capped"; breach: CapBreach }
  // The engine threw instead of answering: its bug, reported to the client as unsolvable and logged.
  | { kind: "engine_failed"; message: string };

export function deriveOutcome(circuit: Network, options: SolveOptions, maxResultTerms: number, maxRevisionBytes = Number.POSITIVE_INFINITY): SolveOutcome {
  let outcome: ReturnType<typeof solveNetwork>;
  try {
    outcome = solveNetwork(circuit, options);
  } catch (error) {
    return { kind: "engine_failed", message: error instanceof Error ? `${error.name}: ${error.message}` : String(error) };
  }
  if (!outcome.ok || !outcome.network) return { kind: "ill_posed", diagnostics: outcome.diagnostics };
  const { steps, diagnostics, network: solved, ...results } = outcome;
  const tooLarge = resultBreach(results, maxResultTerms);
  if (tooLarge) return { kind: "capped", breach: tooLarge };
  const derivation = { circuit: solved, results, diagnostics, steps };
  if (!Number.isFinite(maxRevisionBytes)) return { kind: "solved", derivation };
  const bounded = boundDerivation(derivation, maxRevisionBytes);
  if (!bounded) return { kind: "capped", breach: breach("revisionBytes", maxRevisionBytes, null) };
  return { kind: "solved", derivation: bounded.derivation };
}
