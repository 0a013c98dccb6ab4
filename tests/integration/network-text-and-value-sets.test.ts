// The netlist as typed is kept beside its circuit, and value sets are kept on the network and
// shown behind its share links.
import { execFileSync } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

// A divider with the designer's comments, blank lines and spacing, which a printer would not reproduce.
const typed = `# bridge divider, top leg first
ground 0
port mid 0

Rtop   resistor in mid = R_top   # 10k nominal
Rbot resistor mid 0 = R_bot
`;

describe("network text and value sets", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer();
    editor = await signedInPerson(server, "texter");
    teamId = (await editor.client.post("/api/teams", { name: "Bridge bench" })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  it("keeps the netlist exactly as typed, reads the circuit from it, and sets it to null for a circuit sent as JSON", async () => {
    const created = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Bridge divider", netlist: typed });
    expect(created.status).toBe(201);
    expect(created.body.netlist).toBe(typed);
    expect(created.body.circuit.elements.map((e: { name: string }) => e.name)).toEqual(["Rtop", "Rbot"]);
    const read = await editor.client.get(`/api/networks/${created.body.id}`);
    expect(read.body.netlist).toBe(typed);

    const edited = typed.replace("R_bot", "R_bot  # trimmed");
    const patched = await editor.client.patch(`/api/networks/${created.body.id}`, { netlist: edited, expectedUpdatedAt: read.body.updatedAt });
    expect(patched.status).toBe(200);
    expect(patched.body.netlist).toBe(edited);

    const asJson = await editor.client.patch(`/api/networks/${created.body.id}`, { circuit: followerCircuit });
    expect(asJson.body.netlist).toBeNull();
    const fromJson = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "From JSON", circuit: followerCircuit });
    expect(fromJson.body.netlist).toBeNull();
  });

  it("refuses text that does not read, with each line's diagnostic, and changes nothing", async () => {
    const created = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Kept", netlist: typed });
    const bad = await editor.client.patch(`/api/networks/${created.body.id}`, { netlist: `${typed}Rload resistr mid 0 = RL\n` });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe("invalid_netlist");
    expect(bad.body.error.diagnostics[0]).toMatchObject({ line: 7 });
    expect((await editor.client.get(`/api/networks/${created.body.id}`)).body.netlist).toBe(typed);
  });

  it("keeps an imported netlist file's text", async () => {
    const imported = await editor.client.upload(`/api/teams/${teamId}/networks/import`, { name: "bridge.pfn", type: "text/plain", content: typed });
    expect(imported.status).toBe(201);
    expect(imported.body.netlist).toBe(typed);
  });

  it("saves named value sets, replaces one saved again under its name, and deletes", async () => {
    const network = (await editor.client.post(`/api/teams/${teamId}/networks`, { title: "With numbers", netlist: typed })).body;
    const path = `/api/networks/${network.id}/value-sets`;
    const nominal = await editor.client.post(path, { name: "nominal", values: { R_top: "10k", R_bot: "4.7k" } });
    expect(nominal.status).toBe(201);
    await editor.client.post(path, { name: "worst case", values: { R_top: "10.1k", R_bot: "4.65k" } });
    const again = await editor.client.post(path, { name: "nominal", values: { R_top: "10k", R_bot: "4.75k" } });
    expect(again.body.id).toBe(nominal.body.id);
    const list = await editor.client.get(path);
    expect(list.body.valueSets.map((v: { name: string; values: Record<string, string> }) => [v.name, v.values.R_bot])).toEqual([
      ["nominal", "4.75k"],
      ["worst case", "4.65k"],
    ]);
    expect((await editor.client.post(path, { name: "", values: {} })).status).toBe(400);
    expect((await editor.client.post(path, { name: "odd", values: { "1x": "2" } })).status).toBe(400);
    expect((await editor.client.delete(`${path}/${nominal.body.id}`)).status).toBe(204);
    expect((await editor.client.delete(`${path}/${nominal.body.id}`)).status).toBe(404);
    expect((await editor.client.get(path)).body.valueSets).toHaveLength(1);
  });
});

describe("links back to the app", () => {
  // Run apart, so the settings are read from this environment alone.
  const publicUrlWith = (env: Record<string, string>) => {
    const { PUBLIC_URL: _unset, ...rest } = process.env;
    return execFileSync("node_modules/.bin/tsx", ["-e", 'import("./server/config.ts").then((m) => console.log(m.config.publicUrl))'], { env: { ...rest, ...env }, encoding: "utf8" }).trim();
  };

  it("defaults PUBLIC_URL to the address the server serves on, so a mailed link keeps the session", () => {
    expect(publicUrlWith({ HOST: "127.0.0.1", PORT: "4999" })).toBe("http://127.0.0.1:4999");
    expect(publicUrlWith({ HOST: "0.0.0.0", PORT: "4999" })).toBe("http://localhost:4999");
    expect(publicUrlWith({ HOST: "127.0.0.1", PORT: "4999", PUBLIC_URL: "https://portfold.example/" })).toBe("https://portfold.example");
  }, 60_000);

  it("the development mailbox links back to the app", async () => {
    const server = await startTestServer();
    try {
      const page = await (await fetch(`${server.url}/dev/mailbox`)).text();
      expect(page).toContain('<a href="/">← Back to Portfold</a>');
    } finally {
      await server.close();
    }
  });
});
