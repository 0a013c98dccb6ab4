// Value sets: named numbers for a network's symbols, as typed in the Values panel.
import { z } from "zod";
import { isoTime, plainText } from "./common.js";

// A symbol name as the engine writes it, and a value as typed (SI prefixes allowed); the client checks the syntax live.
const symbol = z.string().regex(/^[A-Za-z][A-Za-z0-9_]{0,63}$/, { error: "A symbol is a letter followed by letters, digits or _." });
export const saveValueSetRequest = z
  .object({
    name: plainText(80).pipe(z.string().trim().min(1, { error: "Give the value set a name." })),
    values: z.record(symbol, z.string().trim().min(1).max(200)).refine((v) => Object.keys(v).length <= 200, { error: "At most 200 symbols in one set." }),
  })
  .meta({ id: "SaveValueSetRequest" });

export const valueSet = z
  .object({ id: z.uuid(), name: z.string(), values: z.record(z.string(), z.string()), createdAt: isoTime, updatedAt: isoTime })
  .meta({ id: "ValueSet" });
export const valueSetList = z.object({ valueSets: z.array(valueSet) }).meta({ id: "ValueSetList" });
