// A team's own cells: definitions its networks place by id, resolved into a circuit before it is solved.
import { and, asc, eq, inArray } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { teamCells, users } from "../db/schema.js";
import { Conflict, Invalid, notFound } from "./errors.js";
import { requireTeamRole } from "./access.js";
import { BUILT_IN_CELLS, externalCellIds, type CellDefinition, type Network } from "../solver/engine.js";
import { readCell } from "./reading.js";
import type { Services, Transaction } from "./services.js";

export interface CellView {
  /** The id networks use in a cell instance. */
  id: string;
  teamId: string;
  title: string;
  definition: CellDefinition;
  author: { id: string; name: string } | null;
  createdAt: string;
  updatedAt: string;
}

type CellRow = typeof teamCells.$inferSelect;

function view(row: CellRow, authorName: string | null): CellView {
  return {
    id: row.slug,
    teamId: row.teamId,
    title: row.title,
    definition: row.definition as CellDefinition,
    author: row.authorId && authorName ? { id: row.authorId, name: authorName } : null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const nameTaken = (id: string, builtIn: boolean) =>
  new Conflict("cell_name_taken", builtIn ? `"${id}" is a built-in cell; give the team's cell another id.` : `The team already has a cell "${id}".`, { fields: { "definition.id": "taken" } });

function isUniqueViolation(error: unknown): boolean {
  const e = error as { code?: string; cause?: { code?: string } };
  return e?.code === "23505" || e?.cause?.code === "23505";
}

export async function listCells(db: Database, userId: string, teamId: string): Promise<{ cells: CellView[] }> {
  await requireTeamRole(db, userId, teamId, "viewer");
  const rows = await db
    .select({ cell: teamCells, authorName: users.name })
    .from(teamCells)
    .leftJoin(users, eq(users.id, teamCells.authorId))
    .where(eq(teamCells.teamId, teamId))
    .orderBy(asc(teamCells.slug));
  return { cells: rows.map((r) => view(r.cell, r.authorName)) };
}

export async function createCell(services: Services, userId: string, teamId: string, input: unknown): Promise<CellView> {
  const { db } = services;
  await requireTeamRole(db, userId, teamId, "editor");
  const { definition, diagnostics } = await readCell(services, input);
  if (!definition) throw new Invalid("invalid_cell", "The cell definition is not valid; see the diagnostics.", { fields: { definition: diagnostics[0]?.message ?? "invalid" }, diagnostics });
  // A team cell named like a built-in one would silently replace it in every network of the team.
  if (BUILT_IN_CELLS.has(definition.id)) throw nameTaken(definition.id, true);
  try {
    const [row] = await db.insert(teamCells).values({ teamId, slug: definition.id, title: definition.title, definition, authorId: userId }).returning();
    const [author] = await db.select({ name: users.name }).from(users).where(eq(users.id, userId));
    return view(row, author?.name ?? null);
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(definition.id, false);
    throw error;
  }
}

export async function deleteCell(db: Database, userId: string, teamId: string, cellId: string): Promise<void> {
  await requireTeamRole(db, userId, teamId, "editor");
  const gone = await db.delete(teamCells).where(and(eq(teamCells.teamId, teamId), eq(teamCells.slug, cellId))).returning({ id: teamCells.id });
  if (gone.length === 0) throw notFound("That cell");
}

/**
 * The circuit with the definitions of the team cells it places put into its `cellDefinitions`,
 * so the solve (and the revision that keeps the circuit) needs nothing outside it. Ids the team
 * does not have stay unresolved: the engine names them (cell-unknown).
 */
export async function withTeamCells(db: Database | Transaction, teamId: string, circuit: Network): Promise<Network> {
  const wanted = externalCellIds(circuit);
  if (wanted.length === 0) return circuit;
  const rows = await db.select({ definition: teamCells.definition }).from(teamCells).where(and(eq(teamCells.teamId, teamId), inArray(teamCells.slug, wanted))).orderBy(asc(teamCells.slug));
  if (rows.length === 0) return circuit;
  return { ...circuit, cellDefinitions: [...(circuit.cellDefinitions ?? []), ...rows.map((r) => r.definition as CellDefinition)] };
}
