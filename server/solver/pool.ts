// The solver pool: engine solves on worker threads (piscina), never on the request thread.
// A solve past its time or memory cap has its thread terminated; piscina starts a fresh one.
import { MessageChannel } from "node:worker_threads";
import { Piscina } from "piscina";
import type { SolveSettings } from "../config.js";
import type { Network, SolveOptions } from "../domain/engine.js";
import { breach } from "./caps.js";
import type { SolveOutcome } from "./derive.js";
import { startedMessage, type SolveTask } from "./solve-task.js";

export interface SolverStats {
  // Solves that reached a thread: the count a cache hit must not raise.
  started: number;
  finished: number;
  // Threads terminated because a solve went past its time or memory cap.
  terminated: number;
  queued: number;
  running: number;
  threads: number;
}

export interface SolveHooks {
  // Called once, when a thread begins the solve (the job turns from queued to solving).
  onStart?: () => void;
}

export interface Solver {
  solve(circuit: Network, options: SolveOptions, key: string, hooks?: SolveHooks): Promise<SolveOutcome>;
  stats(): SolverStats;
  warm(): void;
  close(): Promise<void>;
}

export class SolverBusyError extends Error {
  constructor() {
    super("solver queue is full");
  }
}

const workerFile = new URL("./worker.mjs", import.meta.url);

// Identical solves asked for at the same time share one run (the cache only helps the next request).
interface Flight {
  started: boolean;
  listeners: (() => void)[];
}

export function createSolver(settings: SolveSettings): Solver {
  let pool: Piscina<SolveTask, SolveOutcome> | null = null;
  const flights = new Map<string, { flight: Flight; outcome: Promise<SolveOutcome> }>();
  const counts = { started: 0, finished: 0, terminated: 0, running: 0 };

  const threads = () => {
    pool ??= new Piscina<SolveTask, SolveOutcome>({
      filename: workerFile.href,
      minThreads: settings.threads,
      maxThreads: settings.threads,
      idleTimeout: Infinity,
      // The queue is bounded below, in solve(): piscina does not count tasks that carry an abort signal.
      // The thread loads tsx itself (worker.mjs); whatever loader the parent runs under stays out.
      execArgv: [],
      resourceLimits: { maxOldGenerationSizeMb: settings.memoryMb },
    });
    return pool;
  };

  async function runOnThread(circuit: Network, options: SolveOptions, flight: Flight): Promise<SolveOutcome> {
    const channel = new MessageChannel();
    const abort = new AbortController();
    let timer: NodeJS.Timeout | undefined;
    let timedOut = false;
    channel.port1.on("message", (message) => {
      if (message !== startedMessage || flight.started) return;
      flight.started = true;
      counts.started += 1;
      counts.running += 1;
      timer = setTimeout(() => {
        timedOut = true;
        abort.abort();
      }, settings.timeLimitMs);
      for (const listener of flight.listeners) listener();
    });
    try {
      const task: SolveTask = { circuit, options, maxResultTerms: settings.maxResultTerms, progress: channel.port2 };
      return await threads().run(task, { transferList: [channel.port2], signal: abort.signal });
    } catch (error) {
      if (timedOut) {
        counts.terminated += 1;
        return { kind: "capped", breach: breach("time", settings.timeLimitMs, null) };
      }
      if ((error as { code?: unknown })?.code === "ERR_WORKER_OUT_OF_MEMORY") {
        counts.terminated += 1;
        return { kind: "capped", breach: breach("memory", settings.memoryMb, null) };
      }
      throw error;
    } finally {
      clearTimeout(timer);
      channel.port1.close();
      if (flight.started) {
        counts.running -= 1;
        counts.finished += 1;
      }
    }
  }

  return {
    solve(circuit, options, key, hooks = {}) {
      let entry = flights.get(key);
      if (!entry) {
        if (flights.size >= settings.threads + settings.queueMax) return Promise.reject(new SolverBusyError());
        const flight: Flight = { started: false, listeners: [] };
        entry = { flight, outcome: runOnThread(circuit, options, flight).finally(() => flights.delete(key)) };
        flights.set(key, entry);
      }
      if (hooks.onStart) {
        if (entry.flight.started) hooks.onStart();
        else entry.flight.listeners.push(hooks.onStart);
      }
      return entry.outcome;
    },
    stats: () => ({ ...counts, queued: flights.size - counts.running, threads: pool?.threads.length ?? 0 }),
    warm: () => void threads(),
    close: async () => {
      await pool?.destroy();
      pool = null;
    },
  };
}
