// Operations: the health probe monitors and balancers call.
import { z } from "zod";

export const health = z.object({ ok: z.boolean(), db: z.enum(["up", "down"]) }).meta({ id: "Health" });
