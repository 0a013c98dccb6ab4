// Seeds the demo team idempotently: running it twice leaves one copy of everything.
// Never in production: the demo logins have a published password.
import { and, eq } from "drizzle-orm";
import { hashPassword } from "../auth/password.js";
import { config, isProduction } from "../config.js";
import { personalTeamName } from "../domain/accounts.js";
import type { Network } from "../solver/engine.js";
import { derive } from "../domain/solve.js";
import { storeRevision } from "../domain/revisions.js";
import { hashToken } from "../lib/tokens.js";
import { createDatabase, createPool, type Database } from "./client.js";
import { comments, networks, revisionSteps, revisionVerdicts, revisions, shareLinks, teamMembers, teams, users } from "./schema.js";
import { demoNetworks, demoReview, demoReviewer, demoShareToken, demoTeam, demoUser } from "./demo-data.js";

async function ensureUser(db: Database, person: { id: string; email: string; name: string }, passwordHash: string) {
  await db
    .insert(users)
    .values({ ...person, passwordHash, emailVerifiedAt: new Date() })
    .onConflictDoUpdate({ target: users.id, set: { passwordHash, emailVerifiedAt: new Date() } });
  await db.insert(teams).values({ name: personalTeamName(person.name), personalUserId: person.id }).onConflictDoNothing();
  const [personal] = await db.select({ id: teams.id }).from(teams).where(eq(teams.personalUserId, person.id));
  await db.insert(teamMembers).values({ teamId: personal.id, userId: person.id, role: "owner" }).onConflictDoNothing();
}

async function firstRevision(db: Database, networkId: string, circuit: Network) {
  const [existing] = await db.select().from(revisions).where(and(eq(revisions.networkId, networkId), eq(revisions.number, 1)));
  return existing ?? storeRevision(db, demoUser.id, networkId, derive(circuit));
}

async function seed(db: Database) {
  const passwordHash = await hashPassword(config.demoPassword);
  await ensureUser(db, demoUser, passwordHash);
  await ensureUser(db, demoReviewer, passwordHash);
  await db.insert(teams).values(demoTeam).onConflictDoNothing();
  await db
    .insert(teamMembers)
    .values([
      { teamId: demoTeam.id, userId: demoUser.id, role: "owner" },
      { teamId: demoTeam.id, userId: demoReviewer.id, role: "reviewer" },
    ])
    .onConflictDoNothing();

  const revisionBySlug = new Map<string, string>();
  for (const network of demoNetworks) {
    let [row] = await db.select().from(networks).where(eq(networks.slug, network.slug));
    row ??= (await db.insert(networks).values({ ...network, teamId: demoTeam.id, authorId: demoUser.id }).returning())[0];
    revisionBySlug.set(network.slug, (await firstRevision(db, row.id, row.circuit as Network)).id);
  }

  const sharedRevision = revisionBySlug.get(demoNetworks[0].slug)!;
  await db.insert(shareLinks).values({ revisionId: sharedRevision, tokenHash: hashToken(demoShareToken), createdBy: demoUser.id }).onConflictDoNothing();

  const reviewed = revisionBySlug.get(demoReview.slug)!;
  const [anyComment] = await db.select({ id: comments.id }).from(comments).where(eq(comments.revisionId, reviewed)).limit(1);
  if (!anyComment) {
    const { thread, note } = demoReview;
    const steps = await db.select().from(revisionSteps).where(eq(revisionSteps.revisionId, reviewed)).orderBy(revisionSteps.ordinal);
    const anchor = (where: { stepId: string; stepKind: string }) =>
      (steps.find((step) => step.stepKey === where.stepId) ?? steps.find((step) => step.kind === where.stepKind) ?? steps[0]).stepKey;
    const [question] = await db
      .insert(comments)
      .values({ revisionId: reviewed, stepKey: anchor(thread), authorId: demoReviewer.id, body: thread.question })
      .returning();
    await db.insert(comments).values([
      { revisionId: reviewed, stepKey: question.stepKey, parentId: question.id, authorId: demoUser.id, body: thread.answer },
      { revisionId: reviewed, stepKey: anchor(note), authorId: demoReviewer.id, body: note.body },
    ]);
    await db.insert(revisionVerdicts).values({ revisionId: reviewed, verdict: demoReview.verdict, userId: demoReviewer.id, role: "reviewer", note: demoReview.verdictNote });
  }
}

if (isProduction) {
  console.log("[portfold] demo data is not seeded in production");
} else {
  const pool = createPool(config.databaseUrl, 1);
  try {
    await seed(createDatabase(pool));
    console.log(`[portfold] demo data ready (${demoNetworks.length} networks in "${demoTeam.name}", solved, one shared, one under review)`);
    console.log(`[portfold] demo logins: ${demoUser.email} and ${demoReviewer.email}, password "${config.demoPassword}"`);
    console.log(`[portfold] demo share link: ${config.publicUrl}/s/${demoShareToken}`);
  } finally {
    await pool.end();
  }
}
