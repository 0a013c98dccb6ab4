// Networks: a team's circuits in the engine's JSON format.
import { z } from "zod";
import type { NetworkInput } from "../engine/types.js";
import { engineShaped, isoTime, nameText, person, plainText, roles, verdicts } from "./common.js";

export const networkSorts = ["title", "author", "lastRevision", "verdict", "updatedAt", "createdAt"] as const;

// The longest title; an imported file's name is cut to it.
export const networkTitleMax = 200;

const title = nameText(networkTitleMax, "Give the network a title.");
const description = z.string().max(5_000);
// The circuit's shape is the engine's to judge (readCircuit); here it only has to be an object.
const circuit = z.record(z.string(), z.unknown(), { error: "The circuit is a JSON object in Portfold's network format." });
// The netlist text as typed, kept beside the circuit it reads as; null for a network made from JSON.
const netlist = z.string().max(256 * 1024).nullable();

export const createNetworkRequest = z
  .object({ title, description: description.optional(), circuit: circuit.optional(), netlist: netlist.optional() })
  .refine((body) => body.circuit !== undefined || typeof body.netlist === "string", { error: "Send the circuit, its netlist text, or both." })
  .meta({ id: "CreateNetworkRequest" });
export const patchNetworkRequest = z
  .object({ title: title.optional(), description: description.optional(), circuit: circuit.optional(), netlist: netlist.optional(), expectedUpdatedAt: z.iso.datetime({ offset: true }).optional() })
  .refine((body) => body.title !== undefined || body.description !== undefined || body.circuit !== undefined || body.netlist !== undefined, {
    error: "Change at least one of title, description, circuit, netlist.",
  })
  .meta({ id: "PatchNetworkRequest" });
export const duplicateNetworkRequest = z.object({ title: title.optional() }).meta({ id: "DuplicateNetworkRequest" });
// The form fields sent beside an imported file: a title obeys the same rule as any title.
export const importFields = z.object({ title: title.optional() });
export const networkListQuery = z.object({
  q: plainText(200).optional(),
  sort: z.enum(networkSorts).default("updatedAt"),
  order: z.enum(["asc", "desc"]).optional(),
  page: z.coerce.number().int().min(1).max(1_000_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});

export const network = z
  .object({
    id: z.uuid(),
    teamId: z.uuid(),
    slug: z.string(),
    title: z.string(),
    description: z.string(),
    circuit: engineShaped<NetworkInput>(z.record(z.string(), z.unknown())),
    // The netlist text as typed; null for a network made from JSON.
    netlist: z.string().nullable(),
    port: z.unknown(),
    quantities: z.record(z.string(), z.string()),
    author: person.nullable(),
    role: z.enum(roles),
    latestRevision: z.number().int().nullable(),
    createdAt: isoTime,
    updatedAt: isoTime,
    // Set on an import: which of the two file formats was read.
    importedFrom: z.string().optional(),
  })
  .meta({ id: "Network" });

export const networkSummary = z
  .object({
    id: z.uuid(),
    slug: z.string(),
    title: z.string(),
    description: z.string(),
    author: person.nullable(),
    latestRevision: z.number().int().nullable(),
    verdict: z.enum(verdicts).nullable(),
    createdAt: isoTime,
    updatedAt: isoTime,
  })
  .meta({ id: "NetworkSummary" });
export const networkList = z.object({ networks: z.array(networkSummary), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() }).meta({ id: "NetworkList" });
