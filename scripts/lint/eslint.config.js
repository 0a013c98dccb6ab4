// ESLint for the whole repository, run by `npm test` (scripts/setup.mjs) from the repository root:
//   scripts/lint/node_modules/.bin/eslint --config scripts/lint/eslint.config.js
// It lives in its own package because typescript-eslint's parser needs a TypeScript with the
// JavaScript compiler API (5.x/6.0); the project builds with TypeScript 7.
//
// Besides typescript-eslint's and react-hooks' recommended rules it enforces the code's boundaries:
// - a client feature imports another feature only through that feature's index.ts, and only the
//   features listed for it below (the list is checked to have no cycle);
// - the client reaches the engine only through src/lib/engine*.ts; src/lib and src/components import
//   no feature and no page; nothing in src imports the server, nothing in shared imports src or server;
// - server/solver imports nothing of server/domain.
import { fileURLToPath } from "node:url";
import { dirname, resolve } from "node:path";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import boundaries from "eslint-plugin-boundaries";

const root = resolve(dirname(fileURLToPath(import.meta.url)), "../..");

// Which features each feature may import (through its index.ts). A feature not listed imports none.
export const featureDependencies = {
  account: [],
  analysis: ["value-sets"],
  "api-reference": [],
  attachments: [],
  auth: [],
  canvas: [],
  cells: ["network-editor"],
  derivations: ["review"],
  export: ["value-sets"],
  history: [],
  "network-editor": ["canvas"],
  networks: ["network-editor", "review"],
  review: [],
  sharing: ["teams"],
  teams: [],
  "value-sets": [],
};

// Refuse to load a list with a cycle: the boundaries would then allow one.
export function assertAcyclic(graph) {
  const state = new Map();
  const visit = (name, path) => {
    if (state.get(name) === "done") return;
    if (state.get(name) === "open") throw new Error(`feature dependency cycle: ${[...path, name].join(" -> ")}`);
    state.set(name, "open");
    for (const next of graph[name] ?? []) visit(next, [...path, name]);
    state.set(name, "done");
  };
  for (const name of Object.keys(graph)) visit(name, []);
}
assertAcyclic(featureDependencies);

const featureRules = Object.entries(featureDependencies).map(([name, allowed]) => ({
  from: [["feature", { name }]],
  allow: [["feature", { name }], ...allowed.map((other) => ["feature", { name: other }]), "lib", "engine-door", "ui", "api"],
}));

export default tseslint.config(
  {
    ignores: ["**/node_modules/**", "dist/**", ".runtime/**", ".pgdata/**", "test-results/**", "migrations/**", "coverage/**", "public/**"],
  },
  {
    files: ["**/*.{ts,tsx,js,mjs}"],
    extends: [tseslint.configs.recommended],
    languageOptions: { ecmaVersion: 2022, sourceType: "module" },
    linterOptions: { reportUnusedDisableDirectives: "error" },
    rules: {
      // Unused names are tsc's job (noUnusedLocals, noUnusedParameters); an underscore marks a kept one.
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none" }],
    },
  },
  {
    // Tests read the API's answers loosely typed (tests/support/api.ts) and hold them to the zod schemas.
    files: ["tests/**/*.ts"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    files: ["src/**/*.{ts,tsx}", "server/**/*.ts", "shared/**/*.ts"],
    plugins: { boundaries },
    settings: {
      "import/resolver": { typescript: { project: resolve(root, "tsconfig.json") } },
      "boundaries/root-path": root,
      "boundaries/include": ["src/**/*", "server/**/*", "shared/**/*"],
      "boundaries/elements": [
        { type: "engine-door", pattern: "src/lib/engine*.ts", mode: "file" },
        { type: "lib", pattern: "src/lib", mode: "folder" },
        { type: "ui", pattern: "src/components", mode: "folder" },
        { type: "feature", pattern: "src/features/*", mode: "folder", capture: ["name"] },
        { type: "app", pattern: "src/app", mode: "folder" },
        { type: "client-entry", pattern: "src/main.tsx", mode: "file" },
        { type: "engine", pattern: "shared/engine", mode: "folder" },
        { type: "api", pattern: "shared/api", mode: "folder" },
        { type: "solver", pattern: "server/solver", mode: "folder" },
        { type: "domain", pattern: "server/domain", mode: "folder" },
        { type: "server", pattern: "server", mode: "folder" },
      ],
    },
    rules: {
      "boundaries/element-types": ["error", {
        default: "disallow",
        message: "${file.type} may not import ${dependency.type} (${dependency.source}); what may import what is in scripts/lint/eslint.config.js",
        rules: [
          ...featureRules,
          { from: ["app", "client-entry"], allow: ["app", "feature", "lib", "engine-door", "ui", "api"] },
          { from: ["lib"], allow: ["lib", "engine-door", "api"] },
          { from: ["engine-door"], allow: ["lib", "engine-door", "engine", "api"] },
          { from: ["ui"], allow: ["ui", "lib", "engine-door"] },
          { from: ["engine"], allow: ["engine"] },
          { from: ["api"], allow: ["api", "engine"] },
          { from: ["solver"], allow: ["solver", "server", "engine", "api"] },
          { from: ["domain"], allow: ["domain", "server", "solver", "engine", "api"] },
          { from: ["server"], allow: ["server", "domain", "solver", "engine", "api"] },
        ],
      }],
      "boundaries/entry-point": ["error", {
        default: "allow",
        message: "another feature is reached through its index.ts only: import from \"@/features/${dependency.name}\", not ${dependency.source}",
        rules: [{ target: ["feature"], disallow: ["**"] }, { target: ["feature"], allow: ["index.ts"] }],
      }],
    },
  },
);
