// The solve cache in PostgreSQL: a canonical hash of what decides a derivation, and the derivation.
import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { eq, sql } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { solveCache } from "../db/schema.js";
import type { Network, SolveOptions } from "./engine.js";
import type { Derivation } from "./derive.js";

/** JSON with object keys sorted at every level, so equal data always prints the same. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map((item) => canonicalJson(item ?? null)).join(",")}]`;
  if (value !== null && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, item]) => item !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([key, item]) => `${JSON.stringify(key)}:${canonicalJson(item)}`).join(",")}}`;
  }
  return JSON.stringify(value);
}

const engineDir = fileURLToPath(new URL("../../shared/engine/", import.meta.url));
let engineHash: string | null = null;

/** A hash of the engine's own source: a changed engine never answers from an older engine's cache. */
function engineFingerprint(): string {
  if (engineHash) return engineHash;
  const hash = createHash("sha256");
  const files = (readdirSync(engineDir, { recursive: true }) as string[]).filter((file) => file.endsWith(".ts")).sort();
  for (const file of files) hash.update(file).update("\0").update(readFileSync(join(engineDir, file))).update("\0");
  engineHash = hash.digest("hex").slice(0, 16);
  return engineHash;
}

/** The cache key of a solve: the circuit (its port inside), the options, and the engine that derives. */
export function solveKey(circuit: Network, options: SolveOptions, engine = engineFingerprint()): string {
  const { port, ...rest } = circuit;
  return createHash("sha256").update(canonicalJson({ engine, circuit: rest, port, options })).digest("hex");
}

export async function cachedDerivation(db: Database, key: string): Promise<Derivation | null> {
  const [row] = await db.select({ derivation: solveCache.derivation }).from(solveCache).where(eq(solveCache.key, key));
  return (row?.derivation as Derivation | undefined) ?? null;
}

// Counted only once the entry is used, so a refused solve writes nothing.
export async function noteCacheHit(db: Database, key: string): Promise<void> {
  await db.update(solveCache).set({ hits: sql`${solveCache.hits} + 1`, lastUsedAt: new Date() }).where(eq(solveCache.key, key));
}

export async function storeDerivation(db: Database, key: string, derivation: Derivation): Promise<void> {
  await db.insert(solveCache).values({ key, derivation }).onConflictDoNothing();
}
