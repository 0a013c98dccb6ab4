// The development mailbox (404 in production).
import { z } from "zod";
import { plainText } from "./common.js";

export const mailQuery = z.object({
  to: plainText(254).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
export const mailList = z.object({ messages: z.array(z.record(z.string(), z.unknown())) }).loose().meta({ id: "MailList" });
