// The development mailbox (404 in production).
import { z } from "zod";
import { isoTime, plainText } from "./common.js";

export const mailQuery = z.object({
  to: plainText(254).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
export const mailList = z.object({ messages: z.array(z.record(z.string(), z.unknown())) }).meta({ id: "MailList" });
// Mail waiting in the queue, and the dead-letter queue (mail that failed its last retry).
const queuedMail = z.object({ id: z.string(), to: z.string().nullable(), subject: z.string().nullable(), state: z.string(), retryCount: z.number().int(), createdOn: isoTime });
export const mailQueue = z.object({ pending: z.array(queuedMail), dead: z.array(queuedMail) }).meta({ id: "MailQueue" });
