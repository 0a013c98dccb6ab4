// A team's own cells.
import { z } from "zod";
import type { CellDefinition } from "../engine/types.js";
import { engineShaped, isoTime, person } from "./common.js";

// The definition's shape is the engine's to judge (readCellDefinition); here it only has to be an object.
export const createCellRequest = z
  .object({ definition: z.record(z.string(), z.unknown(), { error: "The definition is a JSON object in Portfold's cell format." }) })
  .meta({ id: "CreateCellRequest" });

export const cell = z
  .object({ id: z.string(), teamId: z.uuid(), title: z.string(), definition: engineShaped<CellDefinition>(z.record(z.string(), z.unknown())), author: person.nullable(), createdAt: isoTime, updatedAt: isoTime })
  .meta({ id: "Cell" });
export const cellList = z.object({ cells: z.array(cell) }).meta({ id: "CellList" });
