// Derivation revisions: immutable solves of a network, the solve jobs that outlast a request, and comparisons.
import { z } from "zod";
import { isoTime, person, verdictView } from "./common.js";

// How long the request may wait for the solve, in ms; never longer than SOLVE_WAIT_MS.
export const solveQuery = z.object({ wait: z.coerce.number().int().min(0).max(3_600_000).optional() });

export const step = z
  .object({ id: z.string(), ordinal: z.number().int(), kind: z.string(), title: z.string(), explanation: z.string(), tex: z.string(), data: z.unknown() })
  .meta({ id: "Step" });

export const revision = z
  .object({
    id: z.uuid(),
    networkId: z.uuid(),
    number: z.number().int(),
    permalink: z.string(),
    network: z.object({ id: z.uuid(), slug: z.string(), title: z.string() }),
    circuit: z.record(z.string(), z.unknown()),
    // The engine's results in every form (vth, isc, rth: infix, tex, terms...).
    results: z.record(z.string(), z.unknown()),
    diagnostics: z.array(z.unknown()),
    steps: z.array(step),
    verdict: verdictView,
    createdBy: person.nullable(),
    createdAt: isoTime,
  })
  .meta({ id: "Revision" });
export type Revision = z.infer<typeof revision>;

export const revisionSummary = z
  .object({
    id: z.uuid(),
    number: z.number().int(),
    permalink: z.string(),
    createdBy: person.nullable(),
    createdAt: isoTime,
    verdict: verdictView,
    summary: z.object({ vth: z.string().nullable(), rth: z.string().nullable(), isc: z.string().nullable() }),
  })
  .meta({ id: "RevisionSummary" });
export const revisionList = z.object({ revisions: z.array(revisionSummary) }).meta({ id: "RevisionList" });

export const solveJob = z
  .object({
    id: z.uuid(),
    networkId: z.uuid(),
    status: z.enum(["queued", "solving", "done", "failed"]),
    cacheHit: z.boolean().nullable(),
    revision: z.object({ number: z.number().int(), permalink: z.string() }).nullable(),
    error: z.record(z.string(), z.unknown()).nullable(),
    createdAt: isoTime,
    startedAt: isoTime.nullable(),
    finishedAt: isoTime.nullable(),
    poll: z.string(),
  })
  .meta({ id: "SolveJob" });
export const solveJobAnswer = z.object({ job: solveJob }).meta({ id: "SolveJobAnswer" });

export const revisionComparison = z.object({ from: z.unknown(), to: z.unknown() }).loose().meta({ id: "RevisionComparison" });
