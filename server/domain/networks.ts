// Networks: a team's circuits with their port and declared quantities.
import { randomBytes } from "node:crypto";
import { networkTitleMax, type networkSorts } from "../../shared/api/networks.js";
import { and, asc, count, eq, ilike, or, sql, type SQL } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { networks, teamMembers, users, type Role } from "../db/schema.js";
import { withoutControls } from "../lib/validate.js";
import { Conflict, UnsupportedType, notFound } from "./errors.js";
import { requireNetworkRole, requireTeamRole, type NetworkRow } from "./access.js";
import { revisionStateSql } from "./verdicts.js";
import { NETLIST_EXTENSION, type Network } from "../solver/engine.js";
import { readNetworkFile } from "./reading.js";
import type { Services } from "./services.js";

export interface NetworkView {
  id: string;
  teamId: string;
  slug: string;
  title: string;
  description: string;
  circuit: Network;
  /** The netlist text as typed, or null for a network made from JSON. */
  netlist: string | null;
  port: Network["port"];
  quantities: Record<string, string>;
  author: { id: string; name: string } | null;
  role: Role;
  latestRevision: number | null;
  createdAt: string;
  updatedAt: string;
}

// The latest revision number and that revision's current verdict, read beside each network.
const latestRevision = sql<number | null>`(select max(r.number) from revisions r where r.network_id = ${networks.id})`;
const latestVerdict = revisionStateSql(
  sql`(select r.id from revisions r where r.network_id = ${networks.id} order by r.number desc limit 1)`,
  sql`(select r.created_by from revisions r where r.network_id = ${networks.id} order by r.number desc limit 1)`,
  sql`(select t.required_approvals from teams t where t.id = ${networks.teamId})`,
);
// Never solved: no verdict at all.
const latestVerdictOrNull = sql<string | null>`(case when ${latestRevision} is null then null else ${latestVerdict} end)`;

function view(row: NetworkRow, role: Role, author: { id: string; name: string } | null, latest: number | null): NetworkView {
  const circuit = row.circuit as Network;
  return {
    id: row.id,
    teamId: row.teamId,
    slug: row.slug,
    title: row.title,
    description: row.description,
    circuit,
    netlist: row.netlist ?? null,
    port: circuit.port,
    quantities: circuit.quantities ?? {},
    author,
    role,
    latestRevision: latest,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

// Human-readable and permanent: the title at creation plus a random suffix, never changed later.
function slugFor(title: string): string {
  const base = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48)
    .replace(/-+$/g, "");
  const suffix = randomBytes(4).toString("hex").slice(0, 6);
  return `${base || "network"}-${suffix}`;
}

async function loadView(db: Database, row: NetworkRow, role: Role): Promise<NetworkView> {
  const [extra] = await db
    .select({ authorName: users.name, latest: latestRevision })
    .from(networks)
    .leftJoin(users, eq(users.id, networks.authorId))
    .where(eq(networks.id, row.id));
  return view(row, role, row.authorId && extra?.authorName ? { id: row.authorId, name: extra.authorName } : null, extra?.latest ?? null);
}

export interface NetworkListQuery {
  q?: string;
  sort: (typeof networkSorts)[number];
  order?: "asc" | "desc";
  page: number;
  pageSize: number;
}

export async function listNetworks(db: Database, userId: string, teamId: string, query: NetworkListQuery) {
  await requireTeamRole(db, userId, teamId, "viewer");
  const conditions: SQL[] = [eq(networks.teamId, teamId)];
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    conditions.push(or(ilike(networks.title, pattern), ilike(networks.description, pattern))!);
  }
  const where = and(...conditions);
  const column = {
    title: sql`lower(${networks.title})`,
    author: sql`lower(${users.name})`,
    lastRevision: latestRevision,
    verdict: latestVerdictOrNull,
    updatedAt: sql`${networks.updatedAt}`,
    createdAt: sql`${networks.createdAt}`,
  }[query.sort];
  const order = query.order ?? (query.sort === "title" || query.sort === "author" ? "asc" : "desc");
  const rows = await db
    .select({
      id: networks.id,
      slug: networks.slug,
      title: networks.title,
      description: networks.description,
      authorId: networks.authorId,
      authorName: users.name,
      createdAt: networks.createdAt,
      updatedAt: networks.updatedAt,
      latestRevision,
      verdict: latestVerdictOrNull,
    })
    .from(networks)
    .leftJoin(users, eq(users.id, networks.authorId))
    .where(where)
    .orderBy(sql`${column} ${sql.raw(order)} nulls last`, asc(networks.id))
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(networks).where(where);
  return {
    networks: rows.map((row) => ({
      id: row.id,
      slug: row.slug,
      title: row.title,
      description: row.description,
      author: row.authorId && row.authorName ? { id: row.authorId, name: row.authorName } : null,
      latestRevision: row.latestRevision,
      // A revision nobody has judged yet is open.
      verdict: row.latestRevision === null ? null : (row.verdict ?? "open"),
      createdAt: row.createdAt.toISOString(),
      updatedAt: row.updatedAt.toISOString(),
    })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

export async function createNetwork(
  db: Database,
  userId: string,
  teamId: string,
  input: { title: string; description?: string; circuit: Network; netlist?: string | null },
): Promise<NetworkView> {
  const role = await requireTeamRole(db, userId, teamId, "editor");
  const [row] = await db
    .insert(networks)
    .values({ teamId, slug: slugFor(input.title), title: input.title, description: input.description ?? "", circuit: input.circuit, netlist: input.netlist ?? null, authorId: userId })
    .returning();
  return loadView(db, row, role);
}

export async function getNetwork(db: Database, userId: string, networkId: string): Promise<NetworkView> {
  const { network, role } = await requireNetworkRole(db, userId, networkId, "viewer");
  return loadView(db, network, role);
}

export async function networkIdForSlug(db: Database, userId: string, slug: string): Promise<string> {
  const [row] = await db
    .select({ id: networks.id })
    .from(networks)
    .innerJoin(teamMembers, and(eq(teamMembers.teamId, networks.teamId), eq(teamMembers.userId, userId)))
    .where(eq(networks.slug, slug));
  if (!row) throw notFound("That network");
  return row.id;
}

export async function updateNetwork(
  db: Database,
  userId: string,
  networkId: string,
  patch: { title?: string; description?: string; circuit?: Network; netlist?: string | null; expectedUpdatedAt?: string },
): Promise<NetworkView> {
  const { role } = await requireNetworkRole(db, userId, networkId, "editor");
  const conditions: SQL[] = [eq(networks.id, networkId)];
  // Optimistic concurrency: an edit made from a stale copy is refused rather than silently lost.
  if (patch.expectedUpdatedAt) conditions.push(sql`date_trunc('milliseconds', ${networks.updatedAt}) = ${patch.expectedUpdatedAt}::timestamptz`);
  const [row] = await db
    .update(networks)
    .set({
      ...(patch.title !== undefined ? { title: patch.title } : {}),
      ...(patch.description !== undefined ? { description: patch.description } : {}),
      ...(patch.circuit !== undefined ? { circuit: patch.circuit } : {}),
      // A circuit sent without its text came from JSON (or the table): the old text no longer describes it.
      ...(patch.netlist !== undefined ? { netlist: patch.netlist } : patch.circuit !== undefined ? { netlist: null } : {}),
      updatedAt: new Date(),
    })
    .where(and(...conditions))
    .returning();
  if (!row) throw new Conflict("stale", "The network changed since you loaded it: someone saved it after you opened it. Keep your version, take theirs, or copy yours out first.");
  return loadView(db, row, role);
}

export async function deleteNetwork(db: Database, userId: string, networkId: string): Promise<void> {
  await requireNetworkRole(db, userId, networkId, "editor");
  await db.delete(networks).where(eq(networks.id, networkId));
}

export async function duplicateNetwork(db: Database, userId: string, networkId: string, title?: string): Promise<NetworkView> {
  const { network } = await requireNetworkRole(db, userId, networkId, "editor");
  return createNetwork(db, userId, network.teamId, {
    title: title ?? `${network.title} (copy)`,
    description: network.description,
    circuit: network.circuit as Network,
    netlist: network.netlist,
  });
}

const importExtensions = [".json", NETLIST_EXTENSION];
const importTypes = ["application/json", "text/plain"];

// Import from a file: our JSON or our text netlist, as UTF-8 text; refused with the engine's diagnostics.
export async function importNetwork(
  services: Services,
  userId: string,
  teamId: string,
  file: { originalname: string; mimetype: string; buffer: Buffer },
  title?: string,
) {
  const filename = file.originalname;
  const dot = filename.lastIndexOf(".");
  const extension = dot >= 0 ? filename.slice(dot).toLowerCase() : "";
  if (!importExtensions.includes(extension) && !importTypes.includes(file.mimetype.toLowerCase())) {
    throw new UnsupportedType("unsupported_type", `Import a Portfold network as JSON (.json) or as a Portfold netlist (${NETLIST_EXTENSION}).`, { fields: { file: "not a .json or netlist file" } });
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(file.buffer);
  } catch {
    text = "\u0000";
  }
  if (text.includes("\u0000")) throw new UnsupportedType("unsupported_type", "The file is not UTF-8 text.", { fields: { file: "binary content" } });
  const { network, format } = await readNetworkFile(services, text);
  const base = withoutControls(dot > 0 ? filename.slice(0, dot) : filename).slice(0, networkTitleMax).trim();
  const created = await createNetwork(services.db, userId, teamId, { title: title || base || "Imported network", circuit: network, netlist: format === "text" ? text : null });
  return { ...created, importedFrom: format };
}
