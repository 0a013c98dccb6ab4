// Test people and teams, created through the domain functions (fast, in parallel), not through HTTP.
import { randomBytes } from "node:crypto";
import { createLucia, createSessionToken, sessionCookieName } from "../../server/auth/lucia.js";
import { teamMembers, type Role } from "../../server/db/schema.js";
import { createAccount, type PublicUser } from "../../server/domain/accounts.js";
import { createTeam } from "../../server/domain/teams.js";
import { ApiClient } from "./api.js";
import type { TestServer } from "./server.js";

export const fixturePassword = "correct horse battery staple";

export function uniqueEmail(label: string): string {
  return `${label}-${randomBytes(5).toString("hex")}@example.test`;
}

export interface Person {
  user: PublicUser;
  client: ApiClient;
}

export async function signedInPerson(server: TestServer, label: string, options: { verified?: boolean } = {}): Promise<Person> {
  const user = await createAccount(server.db, { email: uniqueEmail(label), password: fixturePassword, name: `${label[0].toUpperCase()}${label.slice(1)} Tester`, verified: options.verified ?? true });
  const token = await createSessionToken(createLucia(server.db, { secureCookie: false }), user.id);
  return { user, client: new ApiClient(server.url, { cookie: `${sessionCookieName}=${token}` }) };
}

export type Actor = "anonymous" | "nonMember" | Role;
export const actors: Actor[] = ["anonymous", "nonMember", "viewer", "reviewer", "editor", "owner"];

export interface TeamFixture {
  teamId: string;
  people: Record<Role | "nonMember", Person>;
  clients: Record<Actor, ApiClient>;
}

// One team with a member in each role, and somebody outside it.
export async function teamWithEveryRole(server: TestServer): Promise<TeamFixture> {
  const [owner, editor, reviewer, viewer, nonMember] = await Promise.all(
    ["owner", "editor", "reviewer", "viewer", "outsider"].map((label) => signedInPerson(server, label)),
  );
  const team = await createTeam(server.db, owner.user.id, `Fixture lab ${randomBytes(3).toString("hex")}`);
  await server.db.insert(teamMembers).values([
    { teamId: team.id, userId: editor.user.id, role: "editor" },
    { teamId: team.id, userId: reviewer.user.id, role: "reviewer" },
    { teamId: team.id, userId: viewer.user.id, role: "viewer" },
  ]);
  const people = { owner, editor, reviewer, viewer, nonMember };
  return {
    teamId: team.id,
    people,
    clients: {
      anonymous: new ApiClient(server.url),
      nonMember: nonMember.client,
      viewer: viewer.client,
      reviewer: reviewer.client,
      editor: editor.client,
      owner: owner.client,
    },
  };
}

// A finite-gain amplifier wired as a follower behind a strain-gauge bridge (our own scenario).
export const followerCircuit = {
  ground: "0",
  port: { plus: "out", minus: "0" },
  elements: [
    { name: "Vbridge", kind: "voltage", nodes: ["in", "0"], value: "Vs" },
    { name: "Amp", kind: "voltage", nodes: ["x", "0"], value: "A * across(in, out)" },
    { name: "Rout", kind: "resistor", nodes: ["x", "out"], value: "Ro" },
  ],
};
