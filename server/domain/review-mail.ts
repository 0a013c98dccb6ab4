// Review mail goes to the people involved, never to the one who acted, never to those who turned it off.
import { and, eq, inArray } from "drizzle-orm";
import { users } from "../db/schema.js";
import type { OutgoingMail } from "../mail/mailer.js";
import type { Services } from "./services.js";

/** Addresses of these people that take review mail, the actor left out, each once. */
async function reviewMailRecipients(services: Services, actorId: string, userIds: (string | null)[]): Promise<string[]> {
  const ids = [...new Set(userIds.filter((id): id is string => id !== null && id !== actorId))];
  if (ids.length === 0) return [];
  const rows = await services.db.select({ email: users.email }).from(users).where(and(inArray(users.id, ids), eq(users.reviewMail, true)));
  return rows.map((row) => row.email).sort();
}

export async function mailPeople(services: Services, actorId: string, userIds: (string | null)[], mail: (to: string) => OutgoingMail): Promise<void> {
  for (const to of await reviewMailRecipients(services, actorId, userIds)) await services.mailer.send(mail(to));
}
