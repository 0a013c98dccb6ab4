// The solver pool: engine solves on worker threads (piscina), never on the request thread.
// A solve past its time or memory cap has its thread terminated; piscina starts a fresh one.
import { MessageChannel } from "node:worker_threads";
import { Piscina } from "piscina";
import type { SolveSettings } from "../config.js";
import type { Network, SolveOptions } from "./engine.js";
import { breach, type CapBreach } from "./caps.js";
import type { ReadOutcome, ReadTask } from "./read-task.js";
import type { SolveOutcome } from "./derive.js";
import { startedMessage, type SolveTask } from "./solve-task.js";

interface SolverStats {
  // Solves that reached a thread: the count a cache hit must not raise.
  started: number;
  finished: number;
  // Threads terminated because a solve went past its time or memory cap.
  terminated: number;
  queued: number;
  running: number;
  threads: number;
}

interface SolveHooks {
  // Called once, when a thread begins the solve (the job turns from queued to solving).
  onStart?: () => void;
}

/** Who asked for a solve: a free thread takes the next solve of the team served longest ago. */
interface SolveOwner {
  userId: string;
  teamId: string;
}

export interface Solver {
  solve(circuit: Network, options: SolveOptions, key: string, owner: SolveOwner, hooks?: SolveHooks): Promise<SolveOutcome>;
  /** The engine's reader on a thread of its own, under the same time and memory caps; null when capped. */
  read(kind: ReadTask["kind"], input: unknown): Promise<ReadOutcome | { kind: "capped"; breach: CapBreach }>;
  stats(): SolverStats;
  warm(): void;
  close(): Promise<void>;
}

/** What a closed solver answers a solve or read asked of it (the process is stopping). */
export class SolverStopped extends Error {
  constructor() {
    super("the solver is closed");
  }
}

const workerFile = new URL("./worker.mjs", import.meta.url);

// Identical solves asked for at the same time share one run (the cache only helps the next request).
interface Flight {
  started: boolean;
  listeners: (() => void)[];
}

type Threads = Piscina<unknown, unknown>;

function threadPool(settings: SolveSettings, threads: number): Threads {
  return new Piscina({
    filename: workerFile.href,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: Infinity,
    // The queue is bounded by admission (server/domain/solve-jobs.ts) and the workers' concurrency.
    // The thread loads tsx itself (worker.mjs); whatever loader the parent runs under stays out.
    execArgv: [],
    resourceLimits: { maxOldGenerationSizeMb: settings.memoryMb },
  });
}

/**
 * Runs one task on a thread of `pool` under the time cap (counted from the thread's "started"
 * message, so queue time is free) and the memory cap; past either, the thread is terminated.
 */
async function runCapped<T>(
  settings: SolveSettings,
  pool: Threads,
  task: Record<string, unknown>,
  name: string,
  onStarted: () => void,
  onTerminated: () => void,
): Promise<T | { kind: "capped"; breach: CapBreach }> {
  const channel = new MessageChannel();
  const abort = new AbortController();
  let timer: NodeJS.Timeout | undefined;
  let timedOut = false;
  let started = false;
  const markStarted = (): boolean => {
    if (started) return false;
    started = true;
    onStarted();
    return true;
  };
  channel.port1.on("message", (message) => {
    if (message !== startedMessage || !markStarted()) return;
    timer = setTimeout(() => {
      timedOut = true;
      abort.abort();
    }, settings.timeLimitMs);
  });
  try {
    const result = (await pool.run({ ...task, progress: channel.port2 }, { name, transferList: [channel.port2], signal: abort.signal })) as T;
    // The result and the "started" message travel on different channels, so a fast task can
    // return first; a task that returned has started, so it is counted now (and only once).
    markStarted();
    return result;
  } catch (error) {
    if (timedOut) {
      onTerminated();
      return { kind: "capped", breach: breach("time", settings.timeLimitMs, null) };
    }
    if ((error as { code?: unknown })?.code === "ERR_WORKER_OUT_OF_MEMORY") {
      onTerminated();
      return { kind: "capped", breach: breach("memory", settings.memoryMb, null) };
    }
    throw error;
  } finally {
    clearTimeout(timer);
    channel.port1.close();
  }
}

export function createSolver(settings: SolveSettings): Solver {
  let pool: Threads | null = null;
  // Reading networks has a thread of its own, so an edit never waits behind long solves.
  let reader: Threads | null = null;
  const flights = new Map<string, { flight: Flight; outcome: Promise<SolveOutcome> }>();
  const counts = { started: 0, finished: 0, terminated: 0, running: 0 };
  // Fair order: solves wait per team, and a free thread takes the next solve of the team served
  // longest ago (a team never served goes first), so a quiet team never waits behind a busy one's queue.
  const waiting = new Map<string, (() => void)[]>();
  const lastServed = new Map<string, number>();
  let turns = 0;
  let handedOut = 0;
  const pump = () => {
    while (handedOut < settings.threads && waiting.size > 0) {
      let team = "";
      let oldest = Number.POSITIVE_INFINITY;
      for (const candidate of waiting.keys()) {
        const served = lastServed.get(candidate) ?? -1;
        if (served < oldest) [team, oldest] = [candidate, served];
      }
      const queue = waiting.get(team)!;
      const start = queue.shift()!;
      if (queue.length === 0) waiting.delete(team);
      lastServed.set(team, (turns += 1));
      // Teams with nothing queued need no memory of their turn beyond a while.
      if (lastServed.size > 10_000) for (const known of lastServed.keys()) if (!waiting.has(known)) lastServed.delete(known);
      handedOut += 1;
      start();
    }
  };
  const inTurn = <T>(teamId: string, run: () => Promise<T>): Promise<T> =>
    new Promise<T>((resolve, reject) => {
      const queue = waiting.get(teamId) ?? [];
      queue.push(() =>
        run()
          .then(resolve, reject)
          .finally(() => {
            handedOut -= 1;
            pump();
          }),
      );
      waiting.set(teamId, queue);
      pump();
    });

  // A closed solver starts no threads again: a job taken while the process stops fails at once
  // instead of starting a fresh pool that keeps the process (or a test's teardown) waiting.
  let closed = false;
  const open = () => {
    if (closed) throw new SolverStopped();
  };
  const threads = () => {
    open();
    return (pool ??= threadPool(settings, settings.threads));
  };
  const readerThread = () => {
    open();
    return (reader ??= threadPool(settings, 1));
  };
  const terminated = () => {
    counts.terminated += 1;
  };

  async function runOnThread(circuit: Network, options: SolveOptions, flight: Flight): Promise<SolveOutcome> {
    const task = { circuit, options, maxResultTerms: settings.maxResultTerms, maxRevisionBytes: settings.maxRevisionBytes } satisfies Omit<SolveTask, "progress">;
    const started = () => {
      flight.started = true;
      counts.started += 1;
      counts.running += 1;
      for (const listener of flight.listeners) listener();
    };
    try {
      return await runCapped<SolveOutcome>(settings, threads(), task, "default", started, terminated);
    } finally {
      if (flight.started) {
        counts.running -= 1;
        counts.finished += 1;
      }
    }
  }

  return {
    solve(circuit, options, key, owner, hooks = {}) {
      let entry = flights.get(key);
      if (!entry) {
        const flight: Flight = { started: false, listeners: [] };
        const outcome = inTurn(owner.teamId, () => runOnThread(circuit, options, flight)).finally(() => flights.delete(key));
        entry = { flight, outcome };
        flights.set(key, entry);
      }
      if (hooks.onStart) {
        if (entry.flight.started) hooks.onStart();
        else entry.flight.listeners.push(hooks.onStart);
      }
      return entry.outcome;
    },
    read: async (kind, input) => runCapped<ReadOutcome>(settings, readerThread(), { kind, input }, "runReadTask", () => undefined, terminated),
    stats: () => ({ ...counts, queued: flights.size - counts.running, threads: pool?.threads.length ?? 0 }),
    // The reader thread starts on first use: most networks read inline.
    warm: () => void (closed || threads()),
    close: async () => {
      closed = true;
      await Promise.all([pool?.destroy(), reader?.destroy()]);
      pool = null;
      reader = null;
    },
  };
}
