// Derivation revisions: immutable solves of a network, the solve jobs that outlast a request, and comparisons.
import { z } from "zod";
import type { Diagnostic, Element, NetworkInput, SolveChecks, SolveResult } from "../engine/types.js";
import { engineShaped, isoTime, person, revisionState } from "./common.js";

// What a revision keeps of the engine's solve (server/solver/derive.ts): everything but the network, steps and diagnostics,
// which it holds beside. Revisions solved before each check said what it did have no check details.
export type RevisionResults = Omit<SolveResult, "network" | "steps" | "diagnostics" | "checks"> & {
  checks: Omit<SolveChecks, "details"> & { details?: SolveChecks["details"] };
};

// How long the request may wait for the solve, in ms; never longer than SOLVE_WAIT_MS.
export const solveQuery = z.object({ wait: z.coerce.number().int().min(0).max(3_600_000).optional() });

const step = z
  .object({ id: z.string(), ordinal: z.number().int(), kind: z.string(), title: z.string(), explanation: z.string(), tex: z.string(), data: z.unknown() })
  .meta({ id: "Step" });

export const revision = z
  .object({
    id: z.uuid(),
    networkId: z.uuid(),
    number: z.number().int(),
    permalink: z.string(),
    network: z.object({ id: z.uuid(), slug: z.string(), title: z.string() }),
    circuit: engineShaped<NetworkInput>(z.record(z.string(), z.unknown())),
    // The engine's results in every form (vth, isc, rth: infix, tex, terms...).
    results: engineShaped<RevisionResults>(z.record(z.string(), z.unknown())),
    diagnostics: engineShaped<Diagnostic[]>(z.array(z.unknown())),
    steps: z.array(step),
    verdict: revisionState,
    // The latest earlier revision that reads as approved, which this one is compared with.
    approvedBefore: z.object({ number: z.number().int(), by: person.nullable(), at: isoTime.nullable() }).nullable(),
    // Open note threads: for members only (a shared revision carries no notes).
    openNotes: z.number().int().optional(),
    createdBy: person.nullable(),
    createdAt: isoTime,
  })
  .meta({ id: "Revision" });

const revisionSummary = z
  .object({
    id: z.uuid(),
    number: z.number().int(),
    permalink: z.string(),
    createdBy: person.nullable(),
    createdAt: isoTime,
    verdict: revisionState,
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

const revisionStamp = z.object({ number: z.number().int(), createdAt: isoTime });
const change = z.object({ before: z.unknown(), after: z.unknown() });
export const revisionComparison = z
  .object({
    from: revisionStamp,
    to: revisionStamp,
    // Elements by name; port, ground and quantities where they differ (null: unchanged).
    circuit: z.object({
      added: z.array(engineShaped<Element>(z.record(z.string(), z.unknown()))),
      removed: z.array(engineShaped<Element>(z.record(z.string(), z.unknown()))),
      changed: z.array(
        z.object({ name: z.string(), before: engineShaped<Element>(z.record(z.string(), z.unknown())), after: engineShaped<Element>(z.record(z.string(), z.unknown())), fields: z.array(z.string()) }),
      ),
      port: change.nullable(),
      ground: change.nullable(),
      quantities: z.array(z.object({ symbol: z.string(), before: z.string().nullable(), after: z.string().nullable() })),
    }),
    results: z.array(z.object({ name: z.string(), before: z.string().nullable(), after: z.string().nullable(), changed: z.boolean() })),
  })
  .meta({ id: "RevisionComparison" });
