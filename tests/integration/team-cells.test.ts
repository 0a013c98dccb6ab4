// A team's own cells: saved definitions, placed in the team's networks, resolved when solving.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { evaluateInfix } from "../support/expressions.js";
import { teamWithEveryRole, type TeamFixture } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

// A common-source gain stage as one block: the gate bias resistor RG, gm·v_in pulled from the
// output, ro and the drain load RD to ground. (The engine's definition check wants every terminal
// on an element's own nodes; a control connection alone does not count, hence RG.)
const csStage = {
  id: "cs-stage",
  title: "Common-source stage, resistive load",
  terminals: ["in", "out"],
  symbols: ["RG", "gm", "ro", "RD"],
  elements: [
    { name: "RG", kind: "resistor", nodes: ["in", "0"], value: "RG" },
    { name: "gm", kind: "current", nodes: ["out", "0"], value: "gm * across(in, 0)" },
    { name: "ro", kind: "resistor", nodes: ["out", "0"], value: "ro" },
    { name: "RD", kind: "resistor", nodes: ["out", "0"], value: "RD" },
  ],
};

// A photodiode front end's second stage (our scenario): the sensor's voltage drives the stage.
const withCell = {
  ground: "0",
  port: { plus: "vo", minus: "0" },
  elements: [{ name: "Vsense", kind: "voltage", nodes: ["vg", "0"], value: "Vs" }],
  cells: [{ name: "Dev1", cell: "cs-stage", terminals: { in: "vg", out: "vo" }, symbols: { gm: "gm1" } }],
};

// The same network with the cell written out element by element.
const expanded = {
  ground: "0",
  port: { plus: "vo", minus: "0" },
  elements: [
    { name: "Vsense", kind: "voltage", nodes: ["vg", "0"], value: "Vs" },
    { name: "Rbias", kind: "resistor", nodes: ["vg", "0"], value: "RG" },
    { name: "M", kind: "current", nodes: ["vo", "0"], value: "gm1 * across(vg, 0)" },
    { name: "Rds", kind: "resistor", nodes: ["vo", "0"], value: "ro" },
    { name: "Rload", kind: "resistor", nodes: ["vo", "0"], value: "RD" },
  ],
};

describe("team cells", () => {
  let server: TestServer;
  let team: TeamFixture;
  const cellsOf = () => `/api/teams/${team.teamId}/cells`;
  beforeAll(async () => {
    server = await startTestServer();
    team = await teamWithEveryRole(server);
  });
  afterAll(async () => {
    await server.close();
  });

  it("saves a cell, lists it, and solves a network placing it exactly as the expanded network", async () => {
    const created = await team.clients.editor.post(cellsOf(), { definition: csStage });
    expect(created.status).toBe(201);
    expect(created.body).toEqual(expect.objectContaining({ id: "cs-stage", title: csStage.title, teamId: team.teamId, definition: csStage, author: expect.objectContaining({ id: team.people.editor.user.id }) }));
    const listed = await team.clients.viewer.get(cellsOf());
    expect(listed.status).toBe(200);
    expect(listed.body.cells.map((c: { id: string }) => c.id)).toEqual(["cs-stage"]);

    const owner = team.clients.owner;
    const a = (await owner.post(`/api/teams/${team.teamId}/networks`, { title: "Photodiode stage, cell", circuit: withCell })).body;
    const b = (await owner.post(`/api/teams/${team.teamId}/networks`, { title: "Photodiode stage, written out", circuit: expanded })).body;
    const solvedA = await owner.post(`/api/networks/${a.id}/solve`);
    const solvedB = await owner.post(`/api/networks/${b.id}/solve`);
    expect(solvedA.status).toBe(201);
    expect(solvedB.status).toBe(201);

    // Common-source stage: gain −gm·(RD ‖ ro), output resistance RD ‖ ro
    // (Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3; from memory).
    for (const at of [{ gm1: 2e-3, ro: 50e3, RD: 10e3, RG: 1e6, Vs: 0.01 }, { gm1: 7, ro: 3, RD: 5, RG: 11, Vs: 2 }]) {
      const parallel = (at.ro * at.RD) / (at.ro + at.RD);
      for (const results of [solvedA.body.results, solvedB.body.results]) {
        expect(evaluateInfix(results.vth.infix, at) / (-at.gm1 * parallel * at.Vs)).toBeCloseTo(1, 12);
        expect(evaluateInfix(results.rth.infix, at) / parallel).toBeCloseTo(1, 12);
        expect(evaluateInfix(results.isc.infix, at) / (-at.gm1 * at.Vs)).toBeCloseTo(1, 12);
      }
    }
    expect(solvedA.body.results.agree).toBe(true);
    // The revision is self-contained: it keeps the definition it was solved with.
    expect(solvedA.body.circuit.cellDefinitions).toEqual([csStage]);
    expect(solvedA.body.circuit.cells).toEqual(withCell.cells);
  });

  it("refuses an invalid definition with the engine's diagnostics", async () => {
    const editor = team.clients.editor;
    // A terminal no element touches.
    const dangling = await editor.post(cellsOf(), { definition: { ...csStage, id: "dangling", terminals: ["in", "out", "bulk"] } });
    expect(dangling.status).toBe(400);
    expect(dangling.body.error.code).toBe("invalid_cell");
    expect(dangling.body.error.diagnostics).toEqual([expect.objectContaining({ code: "schema-invalid", message: expect.stringContaining('"bulk"'), path: ["definition"] })]);
    // An unknown element kind, named by the engine's schema check.
    const kind = await editor.post(cellsOf(), { definition: { ...csStage, id: "odd-kind", elements: [{ name: "x", kind: "memristor", nodes: ["in", "out"], value: "M" }] } });
    expect(kind.status).toBe(400);
    expect(kind.body.error.diagnostics[0]).toEqual(expect.objectContaining({ code: "schema-invalid", path: ["definition", "elements", 0, "kind"] }));
    // A value that is not an expression.
    const value = await editor.post(cellsOf(), { definition: { ...csStage, id: "bad-value", elements: [{ ...csStage.elements[2], value: "ro*/2" }, ...csStage.elements.filter((e) => e.name !== "ro")] } });
    expect(value.status).toBe(400);
    expect(value.body.error.diagnostics[0]).toEqual(expect.objectContaining({ code: "value-syntax", elements: ["ro"], path: ["definition", "elements", 0, "value"] }));
    // One terminal only, and not even an object.
    expect((await editor.post(cellsOf(), { definition: { ...csStage, id: "one", terminals: ["in"] } })).status).toBe(400);
    expect((await editor.post(cellsOf(), { definition: "cs-stage" })).body.error.code).toBe("invalid_body");
    expect((await team.clients.viewer.get(cellsOf())).body.cells.map((c: { id: string }) => c.id)).toEqual(["cs-stage"]);
  });

  it("refuses a second cell of the same id, and the id of a built-in cell", async () => {
    const again = await team.clients.owner.post(cellsOf(), { definition: { ...csStage, title: "Another" } });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("cell_name_taken");
    const builtIn = await team.clients.owner.post(cellsOf(), { definition: { ...csStage, id: "mosfet" } });
    expect(builtIn.status).toBe(409);
  });

  it("lets viewers read, editors create and delete; outsiders see nothing", async () => {
    const follower = { ...csStage, id: "probe-cell", title: "Probe" };
    expect((await team.clients.viewer.post(cellsOf(), { definition: follower })).status).toBe(403);
    expect((await team.clients.reviewer.post(cellsOf(), { definition: follower })).status).toBe(403);
    expect((await team.clients.nonMember.get(cellsOf())).status).toBe(404);
    expect((await team.clients.anonymous.get(cellsOf())).status).toBe(401);
    expect((await team.clients.editor.post(cellsOf(), { definition: follower })).status).toBe(201);
    expect((await team.clients.reviewer.delete(`${cellsOf()}/probe-cell`)).status).toBe(403);
    expect((await team.clients.nonMember.delete(`${cellsOf()}/probe-cell`)).status).toBe(404);
    expect((await team.clients.editor.delete(`${cellsOf()}/probe-cell`)).status).toBe(204);
    expect((await team.clients.editor.delete(`${cellsOf()}/probe-cell`)).status).toBe(404);
  });

  it("does not resolve another team's cells, and a deleted cell no longer solves", async () => {
    const other = await teamWithEveryRole(server);
    const foreign = (await other.clients.owner.post(`/api/teams/${other.teamId}/networks`, { title: "Borrowed cell", circuit: withCell })).body;
    const refused = await other.clients.owner.post(`/api/networks/${foreign.id}/solve`);
    expect(refused.status).toBe(422);
    expect(refused.body.error.diagnostics).toEqual(expect.arrayContaining([expect.objectContaining({ code: "cell-unknown" })]));

    await team.clients.owner.post(cellsOf(), { definition: { ...csStage, id: "short-lived" } });
    const circuit = { ...withCell, cells: [{ ...withCell.cells[0], cell: "short-lived" }] };
    const net = (await team.clients.owner.post(`/api/teams/${team.teamId}/networks`, { title: "Short-lived cell", circuit })).body;
    expect((await team.clients.owner.post(`/api/networks/${net.id}/solve`)).status).toBe(201);
    expect((await team.clients.owner.delete(`${cellsOf()}/short-lived`)).status).toBe(204);
    expect((await team.clients.owner.post(`/api/networks/${net.id}/solve`)).status).toBe(422);
    // The revision solved before still reads back with its definition.
    expect((await team.clients.viewer.get(`/api/networks/${net.id}/revisions/1`)).body.circuit.cellDefinitions[0].id).toBe("short-lived");
  });
});
