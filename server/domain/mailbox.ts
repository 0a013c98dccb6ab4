// The development mailbox: what the local capture server received, newest first.
import { desc, sql } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { mailMessages } from "../db/schema.js";

export async function capturedMail(db: Database, options: { to?: string; limit: number }) {
  const rows = await db
    .select()
    .from(mailMessages)
    .where(options.to ? sql`${mailMessages.envelopeTo} ? ${options.to.toLowerCase()}` : undefined)
    .orderBy(desc(mailMessages.receivedAt), desc(mailMessages.id))
    .limit(options.limit);
  return rows.map((row) => ({
    id: row.id,
    from: row.envelopeFrom,
    to: row.envelopeTo,
    subject: row.subject,
    text: row.text,
    html: row.html,
    receivedAt: row.receivedAt.toISOString(),
  }));
}
