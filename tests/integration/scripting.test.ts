// The README's Scripting examples (curl, Python) and the command line's --server mode, run against the real server.
import { execFile } from "node:child_process";
import { readFileSync } from "node:fs";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { teamWithEveryRole, type TeamFixture } from "../support/fixtures.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

const run = promisify(execFile);
// The command line as the README gives it: `npm run -s solve -- FILE ...` (the compiled CLI, scripts/solve.sh).
const solve = (args: string[], env?: NodeJS.ProcessEnv) => run("npm", ["run", "-s", "solve", "--", ...args], { env, timeout: 120_000 });

// The fenced blocks of one README section, in order, with their language.
function sectionBlocks(heading: string): { lang: string; code: string }[] {
  const readme = readFileSync("README.md", "utf8");
  const start = readme.indexOf(`## ${heading}\n`);
  expect(start, `README has a "${heading}" section`).toBeGreaterThanOrEqual(0);
  const end = readme.indexOf("\n## ", start + 3);
  const section = readme.slice(start, end < 0 ? undefined : end);
  return [...section.matchAll(/```(\w+)\n([\s\S]*?)```/g)].map((m) => ({ lang: m[1], code: m[2] }));
}

// The follower's output resistance falls by the loop gain: Ro / (1 + A) (negative-feedback result; Sedra & Smith,
// Microelectronic Circuits, 7th ed., ch. 11, from memory). With Ro = 4.7 kΩ and A = 99 that is 47 Ω.
const followerRth = /^Ro\/\(A \+ 1\)$|^Ro\/\(1 \+ A\)$/;

describe("scripting against a real server", () => {
  let server: TestServer;
  let team: TeamFixture;
  let token: string;
  let env: NodeJS.ProcessEnv;
  beforeAll(async () => {
    server = await startTestServer({ clientDir: clientShellDir() });
    team = await teamWithEveryRole(server);
    token = (await team.clients.editor.post("/api/account/tokens", { name: "README examples", scope: "solve", teamId: team.teamId, expiresInDays: 1 })).body.secret;
    env = { ...process.env, PORTFOLD_URL: server.url, PORTFOLD_TOKEN: token, PORTFOLD_TEAM: team.teamId };
  });
  afterAll(async () => {
    await server.close();
  });

  it("runs the curl example", { timeout: 120_000 }, async () => {
    const curl = sectionBlocks("Scripting").filter((b) => b.lang === "sh" && b.code.includes("curl"));
    expect(curl).toHaveLength(1);
    const { stdout } = await run("bash", ["-euo", "pipefail", "-c", curl[0].code], { env, timeout: 60_000 });
    const match = /^(\S+) Rth = (.+)$/.exec(stdout.trim());
    expect(match, stdout).not.toBeNull();
    expect(match![1]).toMatch(/^\/n\/[a-z0-9-]+\/r\/1$/);
    expect(match![2]).toMatch(followerRth);
  });

  it("runs the Python example with the standard library only", { timeout: 120_000 }, async () => {
    const python = sectionBlocks("Scripting").filter((b) => b.lang === "python");
    expect(python).toHaveLength(1);
    const { stdout } = await run("/usr/bin/python3", ["-I", "-c", python[0].code], { env, timeout: 60_000 });
    const match = /^Rth = (.+) = ([0-9.e+-]+) ohm$/.exec(stdout.trim());
    expect(match, stdout).not.toBeNull();
    expect(match![1]).toMatch(followerRth);
    expect(Number(match![2])).toBeCloseTo(47, 9);
  });

  it("stores and solves from the command line with --server, printing the same JSON plus the permanent link", async () => {
    const file = "fixtures/sensor-buffer.pfn";
    const local = JSON.parse((await solve([file, "--set", "Ro=4.7k,A=99", "--no-steps"])).stdout);
    const teamName = (await team.clients.editor.get(`/api/teams/${team.teamId}`)).body.name;
    const remote = JSON.parse((await solve([file, "--set", "Ro=4.7k,A=99", "--no-steps", "--server", server.url, "--team", teamName], env)).stdout);
    const { link, stored, ...rest } = remote;
    expect(rest).toEqual(local);
    expect(stored.teamId).toBe(team.teamId);
    const revision = (await team.clients.viewer.get(`/api/networks/${stored.networkId}/revisions/${stored.revision}`)).body;
    expect(link).toBe(`${server.url}${revision.permalink}`);
    expect(revision.results.rth.infix).toMatch(followerRth);
    // Without --team the token's own team is used.
    const again = JSON.parse((await solve([file, "--no-steps", "--compact", "--server", server.url], env)).stdout);
    expect(again.stored.teamId).toBe(team.teamId);
  }, 360_000);

  it("says why when the server refuses, and exits 1", async () => {
    const failed = await solve(["fixtures/sensor-buffer.pfn", "--server", server.url], { ...env, PORTFOLD_TOKEN: `pft_${"z".repeat(43)}` }).catch((error) => error);
    expect(failed.code).toBe(1);
    expect(failed.stderr).toContain("invalid_token");
    expect(failed.stdout).toBe("");
  }, 120_000);
});
