// The migration to the element vocabulary, run on a database seeded in the earlier shape: every
// stored circuit (networks, revisions, the ledger's "network as given" step, team cells) moves to
// kinds voltage/current with the controls in the value, in one transaction; the solve cache empties.
// A throwaway cluster of its own: migrated up to the earlier shape, seeded, then migrated on.
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseNetwork } from "../../shared/engine";
import { createDatabase, createPool } from "../../server/db/client.js";
import { createThrowawayCluster, type ThrowawayCluster } from "../support/throwaway-postgres.js";

const VOCABULARY_MIGRATION = "0004_element-vocabulary";

// The earlier shape, as the product stored it before the vocabulary changed.
const earlierCircuit = {
  ground: "0",
  port: { plus: "out", minus: "0" },
  elements: [
    { name: "Vbridge", kind: "vsource", nodes: ["in", "0"], value: "Vs" },
    { name: "Amp", kind: "vcvs", nodes: ["x", "0"], control: { nodes: ["in", "out"] }, value: "A" },
    { name: "Rout", kind: "resistor", nodes: ["x", "out"], value: "Ro" },
    { name: "Bias", kind: "isource", nodes: ["0", "out"], value: "Ib" },
    { name: "Sense", kind: "ccvs", nodes: ["y", "0"], control: { element: "Rout" }, value: "R1 + R2" },
    { name: "Ry", kind: "resistor", nodes: ["y", "out"], value: "Ry" },
    { name: "Mirror", kind: "cccs", nodes: ["0", "y"], control: { element: "Ry" }, value: "-1" },
  ],
  cells: [{ name: "Lower", cell: "mosfet", terminals: { g: "in", d: "out", s: "0", b: "0" }, include: ["Cgs"] }],
  cellDefinitions: [
    { id: "gain-stage", title: "Gain stage", terminals: ["i", "o"], symbols: ["gm"], elements: [{ name: "Gm", kind: "vccs", nodes: ["o", "0"], control: { nodes: ["i", "0"] }, value: "gm" }] },
  ],
};

describe("migration to the element vocabulary", () => {
  let cluster: ThrowawayCluster;
  let earlierFolder: string;
  let client: pg.Client;

  beforeAll(async () => {
    // The project's migrations up to (not including) the vocabulary migration.
    earlierFolder = mkdtempSync(join(tmpdir(), "portfold-migrations-"));
    cpSync("migrations", earlierFolder, { recursive: true });
    const journalPath = join(earlierFolder, "meta", "_journal.json");
    const journal = JSON.parse(readFileSync(journalPath, "utf8"));
    const at = journal.entries.findIndex((e: { tag: string }) => e.tag === VOCABULARY_MIGRATION);
    expect(at).toBeGreaterThan(0);
    journal.entries = journal.entries.slice(0, at);
    writeFileSync(journalPath, JSON.stringify(journal));
    cluster = await createThrowawayCluster({ migrationsFolder: earlierFolder });
    client = new pg.Client({ connectionString: cluster.url });
    await client.connect();

    await client.query(`insert into users (id, email, name) values ('u1', 'dana@example.test', 'Dana')`);
    const team = await client.query(`insert into teams (name) values ('Lab') returning id`);
    const teamId = team.rows[0].id;
    const network = await client.query(`insert into networks (team_id, slug, title, circuit) values ($1, 'bridge-buffer', 'Bridge buffer', $2) returning id`, [teamId, earlierCircuit]);
    const revision = await client.query(`insert into revisions (network_id, number, circuit, results) values ($1, 1, $2, '{}') returning id`, [network.rows[0].id, earlierCircuit]);
    await client.query(`insert into revision_steps (revision_id, ordinal, step_key, kind, title, explanation, tex, data) values ($1, 0, 'network', 'network', 'The network as given', '', '', $2), ($1, 1, 'port', 'port', 'The port', '', '', '{"plus":"out"}')`, [revision.rows[0].id, { elements: earlierCircuit.elements, nodes: ["in", "x", "out", "y"] }]);
    await client.query(`insert into cells (team_id, slug, title, definition) values ($1, 'gain-stage', 'Gain stage', $2)`, [teamId, earlierCircuit.cellDefinitions[0]]);
    await client.query(`insert into solve_cache (key, derivation) values ('earlier', '{}')`);

    const pool = createPool(cluster.url, 1);
    try {
      await migrate(createDatabase(pool), { migrationsFolder: "migrations" });
    } finally {
      await pool.end();
    }
  }, 120_000);

  afterAll(async () => {
    await client?.end();
    cluster?.destroy();
    if (earlierFolder) rmSync(earlierFolder, { recursive: true, force: true });
  });

  const expectedElements = [
    { name: "Vbridge", kind: "voltage", nodes: ["in", "0"], value: "Vs" },
    { name: "Amp", kind: "voltage", nodes: ["x", "0"], value: "A * across(in, out)" },
    { name: "Rout", kind: "resistor", nodes: ["x", "out"], value: "Ro" },
    { name: "Bias", kind: "current", nodes: ["0", "out"], value: "Ib" },
    { name: "Sense", kind: "voltage", nodes: ["y", "0"], value: "(R1 + R2) * through(Rout)" },
    { name: "Ry", kind: "resistor", nodes: ["y", "out"], value: "Ry" },
    { name: "Mirror", kind: "current", nodes: ["0", "y"], value: "-through(Ry)" },
  ];

  it("converts a network's circuit, which the engine then reads without a diagnostic", async () => {
    const { rows } = await client.query(`select circuit from networks where slug = 'bridge-buffer'`);
    const circuit = rows[0].circuit;
    expect(circuit.elements).toEqual(expectedElements);
    expect(circuit.cells).toEqual([{ name: "Lower", cell: "mosfet", terminals: { g: "in", d: "out", s: "0", b: "0" }, with: ["Cgs"] }]);
    expect(circuit.cellDefinitions[0].elements).toEqual([{ name: "Gm", kind: "current", nodes: ["o", "0"], value: "gm * across(i, 0)" }]);
    const read = parseNetwork(circuit);
    expect(read.diagnostics).toEqual([]);
  });

  it("converts revisions, the stored network step and team cells; empties the solve cache", async () => {
    const revision = await client.query(`select circuit from revisions`);
    expect(revision.rows[0].circuit.elements).toEqual(expectedElements);
    const steps = await client.query(`select kind, data from revision_steps order by ordinal`);
    expect(steps.rows[0].data.elements).toEqual(expectedElements);
    expect(steps.rows[1].data).toEqual({ plus: "out" });
    const cells = await client.query(`select definition from cells`);
    expect(cells.rows[0].definition.elements).toEqual([{ name: "Gm", kind: "current", nodes: ["o", "0"], value: "gm * across(i, 0)" }]);
    const cache = await client.query(`select count(*)::int as n from solve_cache`);
    expect(cache.rows[0].n).toBe(0);
  });
});
