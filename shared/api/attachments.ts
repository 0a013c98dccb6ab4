// Attachments of a network: measurement plots, datasheets (PDF, PNG, JPEG).
import { z } from "zod";
import { isoTime, person } from "./common.js";

export const attachment = z
  .object({ id: z.uuid(), networkId: z.uuid(), filename: z.string(), contentType: z.string(), size: z.number().int(), uploadedBy: person.nullable(), createdAt: isoTime })
  .meta({ id: "Attachment" });
// The limits travel with the list, so the page states them before anyone tries an upload.
export const attachmentList = z
  .object({ attachments: z.array(attachment), limits: z.object({ maxBytes: z.number().int(), types: z.array(z.string()) }) })
  .meta({ id: "AttachmentList" });
