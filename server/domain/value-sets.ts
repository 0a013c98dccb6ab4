// Value sets: named numbers for a network's symbols, kept so a designer and a reviewer read the same figures.
import { and, asc, eq } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { valueSets } from "../db/schema.js";
import { Conflict, notFound } from "./errors.js";
import { requireNetworkRole } from "./access.js";

export interface ValueSetView {
  id: string;
  name: string;
  values: Record<string, string>;
  createdAt: string;
  updatedAt: string;
}

type ValueSetRow = typeof valueSets.$inferSelect;

const view = (row: ValueSetRow): ValueSetView => ({ id: row.id, name: row.name, values: row.values, createdAt: row.createdAt.toISOString(), updatedAt: row.updatedAt.toISOString() });

/** Without a role check: for callers that have checked access already (the share page). */
export async function valueSetsOf(db: Database, networkId: string): Promise<ValueSetView[]> {
  const rows = await db.select().from(valueSets).where(eq(valueSets.networkId, networkId)).orderBy(asc(valueSets.name));
  return rows.map(view);
}

export async function listValueSets(db: Database, userId: string, networkId: string): Promise<ValueSetView[]> {
  await requireNetworkRole(db, userId, networkId, "viewer");
  return valueSetsOf(db, networkId);
}

// Saving under a name that exists replaces that set's numbers: the name is how people refer to it.
export async function saveValueSet(db: Database, userId: string, networkId: string, input: { name: string; values: Record<string, string> }): Promise<ValueSetView> {
  await requireNetworkRole(db, userId, networkId, "editor");
  const [row] = await db
    .insert(valueSets)
    .values({ networkId, name: input.name, values: input.values, createdBy: userId })
    .onConflictDoUpdate({ target: [valueSets.networkId, valueSets.name], set: { values: input.values, updatedAt: new Date() } })
    .returning();
  if (!row) throw new Conflict("conflict", "The value set could not be saved.");
  return view(row);
}

export async function deleteValueSet(db: Database, userId: string, networkId: string, setId: string): Promise<void> {
  await requireNetworkRole(db, userId, networkId, "editor");
  const deleted = await db.delete(valueSets).where(and(eq(valueSets.id, setId), eq(valueSets.networkId, networkId))).returning({ id: valueSets.id });
  if (deleted.length === 0) throw notFound("That value set");
}
