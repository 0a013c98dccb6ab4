import { Writable } from "node:stream";
import pino from "pino";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { config } from "../../server/config.js";
import { demoNetworks, demoReviewer, demoShareToken, demoTeam, demoUser } from "../../server/db/demo-data.js";
import { ApiClient } from "../support/api.js";
import { evaluateInfix } from "../support/expressions.js";
import { followerCircuit, signedInPerson } from "../support/fixtures.js";
import { clientShellDir, startTestServer, type TestServer } from "../support/server.js";

describe("the seeded demo", () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ clientDir: clientShellDir() });
  });
  afterAll(async () => {
    await server.close();
  });

  it("signs in with the printed demo login and finds every demo network solved, one under review", async () => {
    const demo = new ApiClient(server.url);
    expect((await demo.post("/api/auth/login", { email: demoUser.email, password: config.demoPassword })).status).toBe(200);
    const me = await demo.get("/api/me");
    expect(me.body.teams).toContainEqual(expect.objectContaining({ id: demoTeam.id, role: "owner" }));
    const list = await demo.get(`/api/teams/${demoTeam.id}/networks?sort=title&pageSize=50`);
    for (const network of demoNetworks) {
      expect(list.body.networks).toContainEqual(expect.objectContaining({ slug: network.slug, latestRevision: expect.any(Number) }));
    }
    const bridge = list.body.networks.find((n: { slug: string }) => n.slug === "bridge-with-current-sense");
    const comments = await demo.get(`/api/networks/${bridge.id}/revisions/1/comments`);
    expect(comments.body.comments.length).toBeGreaterThan(0);
    expect(comments.body.comments[0].replies.length).toBeGreaterThan(0);
    expect((await demo.get(`/api/networks/${bridge.id}/revisions/1`)).body.verdict.verdict).toBe("needs_changes");
    // The line driver is an emitter follower: Rout = RE ∥ r_o ∥ (Rs + r_pi)/(1 + gm·r_pi)
    // (Sedra & Smith, Microelectronic Circuits, emitter follower; from memory).
    const driver = list.body.networks.find((n: { slug: string }) => n.slug === "transistor-line-driver");
    const stage = { gm: 0.04, r_pi: 2_500, r_o: 50_000, RE: 1_000, Rs: 1_000, Vs: 1 };
    const parallel = (...r: number[]) => 1 / r.reduce((sum, x) => sum + 1 / x, 0);
    const rout = parallel(stage.RE, stage.r_o, (stage.Rs + stage.r_pi) / (1 + stage.gm * stage.r_pi));
    expect(evaluateInfix((await demo.get(`/api/networks/${driver.id}/revisions/1`)).body.results.rth.infix, stage)).toBeCloseTo(rout, 9);
    // With the sense source off (beta = 0) the bridge is a plain Wheatstone bridge:
    // Vth = Vx·(Rb/(Ra + Rb) − Rg/(Rc + Rg)) (common practice).
    const arms = { Vx: 5, Ra: 120, Rb: 350, Rc: 120, Rg: 351, beta: 0 };
    const vth = (await demo.get(`/api/networks/${bridge.id}/revisions/1`)).body.results.vth.infix;
    expect(evaluateInfix(vth, arms)).toBeCloseTo(arms.Vx * (arms.Rb / (arms.Ra + arms.Rb) - arms.Rg / (arms.Rc + arms.Rg)), 12);
    const reviewer = new ApiClient(server.url);
    expect((await reviewer.post("/api/auth/login", { email: demoReviewer.email, password: config.demoPassword })).status).toBe(200);
  });

  it("opens the demo share link without an account", async () => {
    const shared = await new ApiClient(server.url).get(`/api/share/${demoShareToken}`);
    expect(shared.status).toBe(200);
    // Finite-gain follower: Rout = Ro/(1 + A) (Sedra & Smith, Microelectronic Circuits; from memory).
    const { rth } = shared.body.revision.results;
    expect(evaluateInfix(rth.infix, { A: 99, Ro: 100 })).toBeCloseTo(1, 12);
    expect(await (await fetch(`${server.url}/s/${demoShareToken}`)).text()).toContain(`Rth = ${rth.compact}`);
  });
});

describe("request logs", () => {
  it("carry request ids but no tokens, cookies or passwords", async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _encoding, done) {
        lines.push(String(chunk));
        done();
      },
    });
    const server = await startTestServer({ logger: pino({ level: "info" }, sink) });
    try {
      const person = await signedInPerson(server, "logged");
      const team = (await person.client.post("/api/teams", { name: "Log lab" })).body.id;
      const network = (await person.client.post(`/api/teams/${team}/networks`, { title: "Logged", circuit: followerCircuit })).body.id;
      await person.client.post(`/api/networks/${network}/solve`);
      const { token } = (await person.client.post(`/api/networks/${network}/revisions/1/share`, {})).body;
      await new ApiClient(server.url).get(`/api/share/${token}`);
      await new ApiClient(server.url).post("/api/auth/login", { email: person.user.email, password: "a password to keep out of logs" });
      const log = lines.join("");
      expect(log).toContain("/api/share/[token]");
      expect(log).not.toContain(token);
      expect(log).not.toContain(person.client.cookie!.split("=")[1]);
      expect(log).not.toContain("a password to keep out of logs");
      expect(lines.map((line) => JSON.parse(line)).filter((entry) => entry.req).every((entry) => entry.req.id !== undefined)).toBe(true);
    } finally {
      await server.close();
    }
  });
});
