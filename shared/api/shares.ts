// Share links: a revision readable without an account until it expires or is revoked.
import { z } from "zod";
import { isoTime } from "./common.js";

export const shareRequest = z.object({ expiresAt: z.iso.datetime({ offset: true }).nullable().optional() }).meta({ id: "ShareRequest" });
export const share = z.object({ id: z.uuid(), expiresAt: isoTime.nullable() }).loose().meta({ id: "Share" });
export const shareList = z.object({ shares: z.array(share) }).loose().meta({ id: "ShareList" });
export const sharedRevision = z.object({ revision: z.unknown() }).loose().meta({ id: "SharedRevision" });
