// Seeds the demo team idempotently: running it twice leaves one copy of everything.
import { eq } from "drizzle-orm";
import { config } from "../config.js";
import { createDatabase, createPool } from "./client.js";
import { networks, teamMembers, teams, users } from "./schema.js";
import { demoNetworks, demoTeam, demoUser } from "./demo-data.js";

const pool = createPool(config.databaseUrl, 1);
const db = createDatabase(pool);
try {
  await db.transaction(async (tx) => {
    await tx.insert(users).values(demoUser).onConflictDoNothing();
    await tx.insert(teams).values(demoTeam).onConflictDoNothing();
    await tx.insert(teamMembers).values({ teamId: demoTeam.id, userId: demoUser.id, role: "owner" }).onConflictDoNothing();
    for (const network of demoNetworks) {
      const [existing] = await tx.select({ id: networks.id }).from(networks).where(eq(networks.slug, network.slug));
      if (!existing) await tx.insert(networks).values({ ...network, teamId: demoTeam.id, authorId: demoUser.id });
    }
  });
  console.log(`[portfold] demo data ready (${demoNetworks.length} networks in "${demoTeam.name}")`);
} finally {
  await pool.end();
}
