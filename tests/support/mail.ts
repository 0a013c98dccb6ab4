// Reads what the in-process SMTP capture server stored, waiting briefly for delivery.
import { desc, gte, sql, and } from "drizzle-orm";
import type { Database } from "../../server/db/client.js";
import { mailMessages } from "../../server/db/schema.js";

export type CapturedMail = typeof mailMessages.$inferSelect;

export async function waitForMail(db: Database, to: string, options: { since?: Date; subject?: RegExp; timeoutMs?: number } = {}): Promise<CapturedMail> {
  const deadline = Date.now() + (options.timeoutMs ?? 5_000);
  for (;;) {
    const rows = await db
      .select()
      .from(mailMessages)
      .where(and(sql`${mailMessages.envelopeTo} ? ${to.toLowerCase()}`, options.since ? gte(mailMessages.receivedAt, options.since) : undefined))
      .orderBy(desc(mailMessages.receivedAt));
    const match = rows.find((row) => !options.subject || options.subject.test(row.subject));
    if (match) return match;
    if (Date.now() > deadline) throw new Error(`no mail to ${to}${options.subject ? ` matching ${options.subject}` : ""} arrived`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

export async function mailCount(db: Database, to: string): Promise<number> {
  const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(mailMessages).where(sql`${mailMessages.envelopeTo} ? ${to.toLowerCase()}`);
  return row.n;
}

// The first link in a mail's text that points at the given path under the server.
export function linkIn(mail: CapturedMail, path: string): URL {
  const match = mail.text.match(new RegExp(`https?://[^\\s]+${path.replace(/[/?]/g, (c) => `\\${c}`)}[^\\s]*`));
  if (!match) throw new Error(`no ${path} link in mail "${mail.subject}":\n${mail.text}`);
  return new URL(match[0]);
}

// Mail is delivered by the queue's worker after the request: wait until the queue holds nothing
// still to deliver, so counts taken next include every mail of the requests made so far.
export async function waitForMailQueue(server: { db: Database; mailQueue: string }, options: { timeoutMs?: number } = {}): Promise<void> {
  const deadline = Date.now() + (options.timeoutMs ?? 10_000);
  for (;;) {
    const { rows } = await server.db.execute<{ n: number }>(
      sql`select count(*)::int as n from pgboss.job where name = ${server.mailQueue} and state::text in ('created', 'retry', 'active')`,
    );
    if (rows[0].n === 0) return;
    if (Date.now() > deadline) throw new Error(`the ${server.mailQueue} queue still holds ${rows[0].n} mail`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
