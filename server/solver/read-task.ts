// What the reader thread runs: the engine's reader on a network (JSON or netlist text) or a cell
// definition. Parsing typed values can take long on large input, so it never runs on the request thread.
import type { MessagePort } from "node:worker_threads";
import { parseNetwork, readCellDefinition, type CellDefinition, type Diagnostic, type Network } from "./engine.js";
import { startedMessage } from "./solve-task.js";

export type ReadTask = { kind: "network" | "cell"; input: unknown; progress: MessagePort };

export type ReadOutcome =
  | { kind: "network"; network: Network | null; format: "json" | "text"; diagnostics: Diagnostic[] }
  | { kind: "cell"; definition: CellDefinition | null; diagnostics: Diagnostic[] };

export function runReadTask(task: ReadTask): ReadOutcome {
  task.progress.postMessage(startedMessage);
  task.progress.close();
  if (task.kind === "cell") return { kind: "cell", ...readCellDefinition(task.input) };
  const { network, format, diagnostics } = parseNetwork(task.input);
  return { kind: "network", network, format, diagnostics };
}
