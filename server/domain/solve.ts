// Solving a network: the engine derives, then the revision and its steps are stored in one transaction.
import type { Database } from "../db/client.js";
import { HttpError } from "../lib/errors.js";
import { requireNetworkRole } from "./access.js";
import { solveNetwork, type Network } from "./engine.js";
import { revisionView, storeRevision, type RevisionInput, type RevisionView } from "./revisions.js";

// The engine's answer split the way it is stored: snapshot, results (every form), diagnostics, steps.
export function derive(circuit: Network): RevisionInput {
  const outcome = solveNetwork(circuit);
  if (!outcome.ok || !outcome.network) {
    throw new HttpError(422, "network_ill_posed", "The network cannot be solved as it stands; see the diagnostics.", undefined, outcome.diagnostics);
  }
  const { steps, diagnostics, network: solved, ...results } = outcome;
  return { circuit: solved, results, diagnostics, steps };
}

export async function solve(db: Database, networkId: string, userId: string): Promise<RevisionView> {
  const { network } = await requireNetworkRole(db, networkId, userId, "editor");
  const revision = await storeRevision(db, networkId, userId, derive(network.circuit as Network));
  return revisionView(db, network, revision);
}
