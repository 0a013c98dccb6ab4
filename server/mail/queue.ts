// Mail leaves the request path: requests enqueue a pg-boss job in the same PostgreSQL (schema
// `pgboss`) and a worker, in the server process or on its own (`npm run worker`), delivers it.
import { createHash } from "node:crypto";
import PgBoss from "pg-boss";
import { sql } from "drizzle-orm";
import type { Logger } from "pino";
import { jobSchema, workQueue, type QueueWorker } from "../jobs/boss.js";
import type { Database } from "../db/client.js";
import type { Mailer, OutgoingMail } from "./mailer.js";

export interface MailQueueSettings {
  // The job queue; what fails its last retry moves to `${queue}-dead`.
  queue: string;
  retryLimit: number;
  retryDelaySeconds: number;
  retryBackoff: boolean;
}


function deadLetterQueue(settings: Pick<MailQueueSettings, "queue">): string {
  return `${settings.queue}-dead`;
}

// The mail queue and its dead-letter queue, made once per process on its job engine.
export async function createMailQueues(boss: PgBoss, settings: MailQueueSettings): Promise<void> {
  await boss.createQueue(deadLetterQueue(settings));
  await boss.createQueue(settings.queue, { name: settings.queue, deadLetter: deadLetterQueue(settings) });
}

// One mail, one job: the same key (given, or the mail's own content) never queues it twice.
function mailKey(mail: OutgoingMail): string {
  return mail.key ?? createHash("sha256").update(JSON.stringify([mail.to.toLowerCase(), mail.subject, mail.text, mail.html])).digest("hex");
}

// pg-boss refuses a second job with the same id (ON CONFLICT DO NOTHING), so the id is the key in UUID form.
function jobIdFor(key: string): string {
  const hex = createHash("sha256").update(key).digest("hex");
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-${((parseInt(hex[16], 16) & 3) | 8).toString(16)}${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}

export function createQueuedMailer(boss: PgBoss, settings: MailQueueSettings, log?: Logger): Mailer {
  return {
    async send(mail) {
      const { key: _key, ...letter } = mail;
      const key = mailKey(mail);
      try {
        await boss.send(settings.queue, letter, {
          id: jobIdFor(key),
          singletonKey: key,
          retryLimit: settings.retryLimit,
          retryDelay: settings.retryDelaySeconds,
          retryBackoff: settings.retryBackoff,
          deadLetter: deadLetterQueue(settings),
        });
        return true;
      } catch (error) {
        log?.error({ err: error, subject: mail.subject }, "mail not queued");
        return false;
      }
    },
  };
}

// The worker hands each job to the SMTP mailer; a failed delivery throws, so pg-boss retries it.
// A few loops deliver side by side, so one slow SMTP exchange does not hold up the rest.
export function startMailWorker(
  boss: PgBoss,
  settings: MailQueueSettings,
  smtp: Mailer,
  options: { pollingIntervalSeconds?: number; concurrency?: number; log?: Logger } = {},
): QueueWorker {
  return workQueue<OutgoingMail>(boss, settings.queue, { concurrency: options.concurrency ?? 3, pollingIntervalSeconds: options.pollingIntervalSeconds ?? 2, log: options.log }, async (mail) => {
    if (!(await smtp.send(mail))) throw new Error(`SMTP delivery of "${mail.subject}" failed`);
  });
}

export interface QueuedMail {
  id: string;
  to: string;
  subject: string;
  state: string;
  retryCount: number;
  createdOn: string;
}

// What the queue holds now, and what gave up (the dead-letter queue), newest first; empty before pg-boss ever started.
export async function mailQueueReport(db: Database, settings: Pick<MailQueueSettings, "queue">, limit = 100): Promise<{ pending: QueuedMail[]; dead: QueuedMail[] }> {
  const exists = await db.execute<{ table: string | null }>(sql`select to_regclass(${`${jobSchema}.job`})::text as "table"`);
  if (!exists.rows[0]?.table) return { pending: [], dead: [] };
  const list = async (name: string, states: string[]) => {
    const { rows } = await db.execute<{ id: string; to: string; subject: string; state: string; retry_count: number; created_on: string }>(
      sql`select id, data->>'to' as "to", data->>'subject' as subject, state::text as state, retry_count, created_on
            from ${sql.identifier(jobSchema)}.job where name = ${name} and state::text in ${states} order by created_on desc limit ${limit}`,
    );
    return rows.map((row) => ({ id: row.id, to: row.to, subject: row.subject, state: row.state, retryCount: row.retry_count, createdOn: new Date(row.created_on).toISOString() }));
  };
  return { pending: await list(settings.queue, ["created", "retry", "active"]), dead: await list(deadLetterQueue(settings), ["created", "retry", "active", "failed"]) };
}

// Drops a queue and its dead-letter queue with every job in them (a throwaway queue's end).
export async function deleteMailQueues(boss: PgBoss, settings: Pick<MailQueueSettings, "queue">): Promise<void> {
  await boss.deleteQueue(settings.queue);
  await boss.deleteQueue(deadLetterQueue(settings));
}
