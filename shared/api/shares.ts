// Share links: a revision readable without an account until it expires or is revoked.
import { z } from "zod";
import { isoTime, person } from "./common.js";
import { revision } from "./revisions.js";
import { valueSet } from "./value-sets.js";

export const shareRequest = z.object({ expiresAt: z.iso.datetime({ offset: true }).nullable().optional() }).meta({ id: "ShareRequest" });
// The only answer that carries the link's token: the server keeps a hash of it.
export const createdShare = z
  .object({ id: z.uuid(), token: z.string(), url: z.string(), revision: z.number().int(), expiresAt: isoTime.nullable(), createdAt: isoTime })
  .meta({ id: "CreatedShare" });
export const share = z
  .object({
    id: z.uuid(),
    revision: z.number().int(),
    status: z.enum(["active", "revoked", "expired"]),
    createdBy: person.nullable(),
    createdAt: isoTime,
    expiresAt: isoTime.nullable(),
    revokedAt: isoTime.nullable(),
  })
  .meta({ id: "Share" });
export const shareList = z.object({ shares: z.array(share) }).meta({ id: "ShareList" });
export const sharedRevision = z
  .object({
    readOnly: z.literal(true),
    network: z.object({ title: z.string(), description: z.string(), slug: z.string() }),
    revision,
    // The network's value sets, so the reader sees the same numbers the designer chose.
    valueSets: z.array(valueSet),
    expiresAt: isoTime.nullable(),
  })
  .meta({ id: "SharedRevision" });
