// The linter's boundaries (scripts/lint/eslint.config.js) hold what the code's structure promises:
// each probe imports across a boundary and must be refused, and the allowed form must pass.
// Needs the lint package installed (npm test does it: npm ci in scripts/lint).
import { createRequire } from "node:module";
import { resolve } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";

const root = resolve(import.meta.dirname, "../..");
const lintRequire = createRequire(resolve(root, "scripts/lint/package.json"));

type Message = { ruleId: string | null; message: string };
let lint: (code: string, file: string) => Promise<Message[]>;
let config: { featureDependencies: Record<string, string[]>; assertAcyclic: (graph: Record<string, string[]>) => void };

beforeAll(async () => {
  type LintResult = { messages: Message[] };
  const { ESLint } = lintRequire("eslint") as { ESLint: new (options: object) => { lintText(code: string, options: { filePath: string }): Promise<LintResult[]> } };
  const eslint = new ESLint({ cwd: root, overrideConfigFile: resolve(root, "scripts/lint/eslint.config.js") });
  lint = async (code, file) => (await eslint.lintText(code, { filePath: resolve(root, file) }))[0].messages;
  config = await import(resolve(root, "scripts/lint/eslint.config.js"));
}, 60_000);

const boundaryErrors = (messages: Message[]) => messages.filter((m) => m.ruleId?.startsWith("boundaries/"));

describe("import boundaries", () => {
  it("a feature reaches another only through its index.ts", async () => {
    const deep = await lint('import { layoutFor } from "@/features/canvas/model/sync";\nexport const x = layoutFor;\n', "src/app/routes/probe.ts");
    expect(boundaryErrors(deep).map((m) => m.ruleId)).toEqual(["boundaries/entry-point"]);
    const door = await lint('import { layoutFor } from "@/features/canvas";\nexport const x = layoutFor;\n', "src/app/routes/probe.ts");
    expect(boundaryErrors(door)).toEqual([]);
  });

  it("a feature imports only the features listed for it, so no two features import each other", async () => {
    // network-editor uses canvas (the drawing); the way back would close a cycle.
    const back = await lint('import { NetworkPanel } from "@/features/network-editor";\nexport const x = NetworkPanel;\n', "src/features/canvas/probe.ts");
    expect(boundaryErrors(back).map((m) => m.ruleId)).toEqual(["boundaries/element-types"]);
    const forward = await lint('import { DrawingView } from "@/features/canvas";\nexport const x = DrawingView;\n', "src/features/network-editor/probe.ts");
    expect(boundaryErrors(forward)).toEqual([]);
  });

  it("the feature list has no cycle, and a list with one is refused", () => {
    expect(() => config.assertAcyclic(config.featureDependencies)).not.toThrow();
    expect(() => config.assertAcyclic({ ...config.featureDependencies, canvas: ["network-editor"] })).toThrow(/cycle: .*canvas.*network-editor/);
  });

  it("the client reaches the engine only through src/lib/engine*", async () => {
    const deep = await lint('import { parseNetlistText } from "../../../../shared/engine/circuit/netlist-text";\nexport const x = parseNetlistText;\n', "src/features/cells/components/probe.ts");
    expect(boundaryErrors(deep).map((m) => m.ruleId)).toEqual(["boundaries/element-types"]);
    const door = await lint('import { parseNetlistText } from "@/lib/engine-netlist";\nexport const x = parseNetlistText;\n', "src/features/cells/components/probe.ts");
    expect(boundaryErrors(door)).toEqual([]);
  });

  it("src/lib and src/components import no feature; shared imports neither client nor server", async () => {
    const lib = await lint('import { AnalysisColumn } from "@/features/analysis";\nexport const x = AnalysisColumn;\n', "src/lib/probe.ts");
    expect(boundaryErrors(lib).map((m) => m.ruleId)).toEqual(["boundaries/element-types"]);
    const ui = await lint('import { AnalysisColumn } from "@/features/analysis";\nexport const x = AnalysisColumn;\n', "src/components/ui/probe.ts");
    expect(boundaryErrors(ui).map((m) => m.ruleId)).toEqual(["boundaries/element-types"]);
    const engine = await lint('import { config } from "../../../server/config";\nexport const x = config;\n', "shared/engine/circuit/probe.ts");
    expect(boundaryErrors(engine).map((m) => m.ruleId)).toEqual(["boundaries/element-types"]);
  });

  it("the solver imports nothing of the domain", async () => {
    const messages = await lint('import { memberRole } from "../domain/access";\nexport const x = memberRole;\n', "server/solver/probe.ts");
    expect(boundaryErrors(messages).map((m) => m.ruleId)).toEqual(["boundaries/element-types"]);
    const engine = await lint('import { solveNetwork } from "../../shared/engine/index.js";\nexport const x = solveNetwork;\n', "server/solver/probe.ts");
    expect(boundaryErrors(engine)).toEqual([]);
  });
});

describe("hooks", () => {
  it("react-hooks runs on the client: a hook called conditionally is refused", async () => {
    const messages = await lint('import { useState } from "react";\nexport function Probe({ on }: { on: boolean }) {\n  if (on) useState(0);\n  return null;\n}\n', "src/components/ui/probe.tsx");
    expect(messages.map((m) => m.ruleId)).toContain("react-hooks/rules-of-hooks");
  });
});
