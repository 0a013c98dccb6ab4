// Derivation revisions: immutable solves of a network, numbered per network, steps as rows.
import { and, asc, desc, eq, max } from "drizzle-orm";
import { config } from "../config.js";
import type { Database } from "../db/client.js";
import { networks, revisionSteps, revisions, users, type Role } from "../db/schema.js";
import { notFound } from "./errors.js";
import { requireNetworkRole, type NetworkRow } from "./access.js";
import type { Derivation } from "../solver/derive.js";
import type { Diagnostic, Network } from "../solver/engine.js";
import { openNoteCounts } from "./reviews.js";
import { approvedBefore, revisionStates } from "./verdicts.js";

// What a revision stores is exactly what a solve derives (server/solver/derive.ts).
export type RevisionInput = Derivation;

type RevisionRow = typeof revisions.$inferSelect;

export function permalink(slug: string, number: number): string {
  return `/n/${slug}/r/${number}`;
}

// Large derivations are written in slices so one INSERT stays under PostgreSQL's parameter limit.
const stepsPerInsert = 500;

// All or nothing: the revision row and every step commit together or not at all.
export async function storeRevision(db: Database, userId: string, networkId: string, input: RevisionInput): Promise<RevisionRow> {
  return db.transaction(async (tx) => {
    // Locking the network row serializes concurrent solves, so numbers never collide.
    await tx.select({ id: networks.id }).from(networks).where(eq(networks.id, networkId)).for("update");
    const [{ last }] = await tx.select({ last: max(revisions.number) }).from(revisions).where(eq(revisions.networkId, networkId));
    const [revision] = await tx
      .insert(revisions)
      .values({
        networkId,
        number: (last ?? 0) + 1,
        circuit: input.circuit,
        results: input.results,
        diagnostics: input.diagnostics,
        createdBy: userId,
      })
      .returning();
    for (let start = 0; start < input.steps.length; start += stepsPerInsert) {
      const slice = input.steps.slice(start, start + stepsPerInsert);
      await tx.insert(revisionSteps).values(
        slice.map((step, offset) => ({
          revisionId: revision.id,
          ordinal: start + offset + 1,
          stepKey: step.id,
          kind: step.kind,
          title: step.title,
          explanation: step.explanation,
          tex: step.tex,
          data: step.data ?? {},
        })),
      );
    }
    return revision;
  });
}

// Steps and author of a revision never change, so each process keeps recently read ones, up to
// STEP_CACHE_MB of step text: a shared revision under load costs the share check and the verdict,
// not the whole ledger again. Counted in bytes, so a few huge ledgers cannot fill the memory.
type ImmutableParts = { steps: (typeof revisionSteps.$inferSelect)[]; authorName: string | null };
const immutableParts = new Map<string, { parts: Promise<ImmutableParts>; bytes: number }>();
let cachedBytes = 0;

const stepBytes = (steps: ImmutableParts["steps"]) =>
  steps.reduce((sum, step) => sum + step.tex.length + step.explanation.length + step.title.length + JSON.stringify(step.data ?? null).length, 0);

function forget(id: string) {
  const entry = immutableParts.get(id);
  if (!entry) return;
  cachedBytes -= entry.bytes;
  immutableParts.delete(id);
}

function stepsAndAuthor(db: Database, revision: RevisionRow) {
  const known = immutableParts.get(revision.id);
  if (known) {
    // Map order is insertion order: re-inserting keeps the recently read at the end.
    immutableParts.delete(revision.id);
    immutableParts.set(revision.id, known);
    return known.parts;
  }
  const loading = Promise.all([
    db.select().from(revisionSteps).where(eq(revisionSteps.revisionId, revision.id)).orderBy(asc(revisionSteps.ordinal)),
    revision.createdBy ? db.select({ name: users.name }).from(users).where(eq(users.id, revision.createdBy)) : Promise.resolve([]),
  ]).then(([steps, [author]]) => ({ steps, authorName: author?.name ?? null }));
  const entry = { parts: loading, bytes: 0 };
  immutableParts.set(revision.id, entry);
  loading.then(
    ({ steps }) => {
      if (immutableParts.get(revision.id) !== entry) return;
      entry.bytes = stepBytes(steps);
      cachedBytes += entry.bytes;
      if (entry.bytes > config.solve.stepCacheBytes) forget(revision.id);
      while (cachedBytes > config.solve.stepCacheBytes && immutableParts.size > 0) forget(immutableParts.keys().next().value!);
    },
    () => forget(revision.id),
  );
  return loading;
}

// `verdict` is the revision's state derived from its verdict history (server/domain/verdicts.ts);
// `approvedBefore` the latest earlier revision that reads as approved, which a newer one is compared with.
export async function revisionView(db: Database, network: Pick<NetworkRow, "id" | "slug" | "title" | "teamId">, revision: RevisionRow) {
  const [{ steps, authorName }, verdict, before] = await Promise.all([
    stepsAndAuthor(db, revision),
    revisionStates(db, network.teamId, [revision]).then((states) => states.get(revision.id)!),
    approvedBefore(db, network.id, network.teamId, revision.number),
  ]);
  return {
    id: revision.id,
    networkId: network.id,
    number: revision.number,
    permalink: permalink(network.slug, revision.number),
    network: { id: network.id, slug: network.slug, title: network.title },
    circuit: revision.circuit as Network,
    results: revision.results as Record<string, unknown>,
    diagnostics: revision.diagnostics as Diagnostic[],
    steps: steps.map((step) => ({
      id: step.stepKey,
      ordinal: step.ordinal,
      kind: step.kind,
      title: step.title,
      explanation: step.explanation,
      tex: step.tex,
      data: step.data,
    })),
    verdict,
    approvedBefore: before,
    createdBy: revision.createdBy && authorName !== null ? { id: revision.createdBy, name: authorName } : null,
    createdAt: revision.createdAt.toISOString(),
  };
}

export type RevisionView = Awaited<ReturnType<typeof revisionView>>;

export async function requireRevision(db: Database, userId: string, networkId: string, number: number, minimum: Role) {
  const access = await requireNetworkRole(db, userId, networkId, minimum);
  const [revision] = await db.select().from(revisions).where(and(eq(revisions.networkId, networkId), eq(revisions.number, number)));
  if (!revision) throw notFound("That revision");
  return { ...access, revision };
}

// For members: the revision with its count of open note threads (the shared view carries no notes).
export async function getRevision(db: Database, userId: string, networkId: string, number: number) {
  const { network, revision } = await requireRevision(db, userId, networkId, number, "viewer");
  const [view, notes] = await Promise.all([revisionView(db, network, revision), openNoteCounts(db, [revision.id])]);
  return { ...view, openNotes: notes.get(revision.id)! };
}

export async function listRevisions(db: Database, userId: string, networkId: string) {
  const { network } = await requireNetworkRole(db, userId, networkId, "viewer");
  const rows = await db
    .select({ revision: revisions, authorName: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.createdBy))
    .where(eq(revisions.networkId, networkId))
    .orderBy(desc(revisions.number));
  const verdictByRevision = await revisionStates(db, network.teamId, rows.map((row) => row.revision));
  return rows.map(({ revision, authorName }) => {
    const results = revision.results as Record<string, { infix?: string } | null>;
    return {
      id: revision.id,
      number: revision.number,
      permalink: permalink(network.slug, revision.number),
      createdBy: revision.createdBy && authorName ? { id: revision.createdBy, name: authorName } : null,
      createdAt: revision.createdAt.toISOString(),
      verdict: verdictByRevision.get(revision.id)!,
      summary: { vth: results.vth?.infix ?? null, rth: results.rth?.infix ?? null, isc: results.isc?.infix ?? null },
    };
  });
}
