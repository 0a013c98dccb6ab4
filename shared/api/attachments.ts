// Attachments of a network: measurement plots, datasheets (PDF, PNG, JPEG).
import { z } from "zod";
import { isoTime } from "./common.js";

export const attachment = z.object({ id: z.uuid(), filename: z.string(), contentType: z.string(), createdAt: isoTime }).loose().meta({ id: "Attachment" });
export const attachmentList = z.object({ attachments: z.array(attachment) }).loose().meta({ id: "AttachmentList" });
