// What one solver thread runs per task: tell the pool the solve has started, then derive.
import type { MessagePort } from "node:worker_threads";
import type { Network, SolveOptions } from "./engine.js";
import { deriveOutcome, type SolveOutcome } from "./derive.js";

export interface SolveTask {
  circuit: Network;
  options: SolveOptions;
  maxResultTerms: number;
  maxRevisionBytes: number;
  // The pool starts the time cap when this port says "started", so time spent queued does not count.
  progress: MessagePort;
}

export const startedMessage = "started";

export function runSolveTask(task: SolveTask): SolveOutcome {
  task.progress.postMessage(startedMessage);
  task.progress.close();
  return deriveOutcome(task.circuit, task.options, task.maxResultTerms, task.maxRevisionBytes);
}
