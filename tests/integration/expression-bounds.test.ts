// Typed expressions that could hold the request thread: refused by size before any parse (422
// naming the bound), and whatever is read runs on a reader thread under the time cap, so health
// keeps answering. The sizes are the ones a hostile probe used: (a+b+c+d)^60, x0+…+x999.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ApiClient } from "../support/api.js";
import { signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

const loadCircuit = (value: string) => ({ port: { plus: "out", minus: "0" }, elements: [{ name: "Rload", kind: "resistor", nodes: ["out", "0"], value }] });

describe("size bounds on typed expressions, and reading off the request thread", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  beforeAll(async () => {
    server = await startTestServer({ solve: { timeLimitMs: 1_500 } });
    editor = await signedInPerson(server, "bounded");
    teamId = (await editor.client.post("/api/teams", { name: "Bounds bench" })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  const create = (value: string) => editor.client.post(`/api/teams/${teamId}/networks`, { title: "Bounded", circuit: loadCircuit(value) });

  it("refuses each bound with 422 naming it and its setting, before parsing", async () => {
    const cases: [string, string, string][] = [
      ["(a+b+c+d)^60", "exponent", "EXPRESSION_MAX_EXPONENT"],
      ["((a+b)^5)^5", "exponent", "EXPRESSION_MAX_EXPONENT"],
      [Array.from({ length: 300 }, (_, i) => `x${i}`).join("+"), "terms", "EXPRESSION_MAX_TERMS"],
      [`${"(".repeat(40)}a${")".repeat(40)}`, "depth", "EXPRESSION_MAX_DEPTH"],
      [`Ro${" ".repeat(5_000)}`, "characters", "EXPRESSION_MAX_CHARS"],
    ];
    for (const [value, bound, setting] of cases) {
      const answer = await create(value);
      expect(answer.status, value.slice(0, 30)).toBe(422);
      expect(answer.body.error).toMatchObject({ code: "expression_too_large", bound: { bound, setting, where: "elements[0].value" } });
      expect(answer.body.error.message).toContain(setting);
    }
    // The same bounds hold for a netlist file, a team cell and a patch.
    const file = await editor.client.upload(`/api/teams/${teamId}/networks/import`, { name: "big.pfn", type: "text/plain", content: "port out 0\nRload resistor out 0 = (a+b+c+d)^60\n" });
    expect(file.status).toBe(422);
    expect(file.body.error.bound).toMatchObject({ bound: "exponent", where: "line 2" });
    const cell = await editor.client.post(`/api/teams/${teamId}/cells`, {
      definition: { id: "bigcell", title: "Big cell", terminals: ["a", "b"], symbols: ["a", "b", "c", "d"], elements: [{ name: "Rbig", kind: "resistor", nodes: ["a", "b"], value: "(a+b+c+d)^60" }] },
    });
    expect(cell.status).toBe(422);
    expect(cell.body.error.bound.where).toBe("elements[0].value");
    const network = (await create("Rl")).body;
    expect((await editor.client.patch(`/api/networks/${network.id}`, { circuit: loadCircuit("(a+b+c+d)^60") })).status).toBe(422);
    // Within the bounds a power still reads: (Ra+Rb)^2 is an ordinary value.
    expect((await create("(Ra+Rb)^2")).status).toBe(201);
  });

  it("reads a slow value on the reader thread: health answers meanwhile, the read stops at the time cap", async () => {
    // 24 binomials multiplied out: 2^24 terms, within every size bound, far beyond the time cap.
    const symbols = Array.from({ length: 24 }, (_, i) => [`p${i}`, `q${i}`]).flat();
    const product = Array.from({ length: 24 }, (_, i) => `(p${i}+q${i})`).join("*");
    const slow = editor.client.post(`/api/teams/${teamId}/cells`, {
      definition: { id: "slowcell", title: "Slow cell", terminals: ["a", "b"], symbols, elements: [{ name: "Rslow", kind: "resistor", nodes: ["a", "b"], value: product }] },
    });
    let slowDone = false;
    void slow.then(() => (slowDone = true));
    await new Promise((resolve) => setTimeout(resolve, 200));
    const health = await new ApiClient(server.url).get("/api/health");
    expect(health.status).toBe(200);
    expect(slowDone).toBe(false);
    const answer = await slow;
    expect(answer.status).toBe(422);
    expect(answer.body.error).toMatchObject({ code: "read_cap_exceeded", cap: { cap: "time", setting: "SOLVE_TIME_LIMIT_MS" } });
    // The reader thread was replaced: the next edit reads normally.
    expect((await create("Rl")).status).toBe(201);
  });
});
