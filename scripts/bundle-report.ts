// The bundle-size report printed by every `vite build` (a rolldown plugin in vite.config.ts's build
// section): first-load JS in gzip against its target, which chunks load lazily, and whether the
// libraries that only some screens need (KaTeX, uPlot) stayed out of the first load; when one did
// not, the chain of static imports from the entry that pulls it in.
import { gzipSync } from "node:zlib";
import { relative } from "node:path";

export interface ChunkFacts {
  fileName: string;
  isEntry: boolean;
  isDynamicEntry: boolean;
  imports: string[];
  dynamicImports: string[];
  moduleIds: string[];
  facadeModuleId: string | null;
  code: string;
}

export interface ModuleFacts {
  importedIds: readonly string[];
}

export interface LazyLibrary {
  name: string;
  // Matches the ids of the library's own modules (paths inside node_modules).
  pattern: RegExp;
}

export interface BundleReport {
  firstLoad: { fileName: string; gzipBytes: number }[];
  firstLoadGzipBytes: number;
  lazy: { fileName: string; gzipBytes: number; libraries: string[] }[];
  libraries: { name: string; lazy: boolean; chunks: string[]; eagerChain: string[] | null }[];
}

export const defaultLazyLibraries: LazyLibrary[] = [
  { name: "KaTeX", pattern: /node_modules\/(katex|react-katex)\// },
  { name: "uPlot", pattern: /node_modules\/uplot\// },
];

const gzipBytes = (code: string) => gzipSync(Buffer.from(code)).length;

/** Chunks a first visit loads: the entry chunks and everything they import statically. */
export function firstLoadChunks(chunks: ChunkFacts[]): Set<string> {
  const byName = new Map(chunks.map((chunk) => [chunk.fileName, chunk]));
  const seen = new Set<string>();
  const visit = (fileName: string) => {
    if (seen.has(fileName) || !byName.has(fileName)) return;
    seen.add(fileName);
    for (const next of byName.get(fileName)!.imports) visit(next);
  };
  for (const chunk of chunks) if (chunk.isEntry) visit(chunk.fileName);
  return seen;
}

/** Shortest chain of static imports from an entry module to a module matching the pattern. */
export function staticImportChain(entries: string[], pattern: RegExp, moduleInfo: (id: string) => ModuleFacts | null): string[] | null {
  const previous = new Map<string, string | null>(entries.map((id) => [id, null]));
  const queue = [...entries];
  while (queue.length > 0) {
    const id = queue.shift()!;
    if (pattern.test(id)) {
      const chain = [id];
      for (let at = previous.get(id); at; at = previous.get(at)) chain.unshift(at);
      return chain;
    }
    for (const next of moduleInfo(id)?.importedIds ?? []) {
      if (previous.has(next)) continue;
      previous.set(next, id);
      queue.push(next);
    }
  }
  return null;
}

export function analyseBundle(chunks: ChunkFacts[], moduleInfo: (id: string) => ModuleFacts | null, libraries = defaultLazyLibraries): BundleReport {
  const first = firstLoadChunks(chunks);
  const sized = chunks.map((chunk) => ({ chunk, gzipBytes: gzipBytes(chunk.code) }));
  const librariesIn = (chunk: ChunkFacts) => libraries.filter((library) => chunk.moduleIds.some((id) => library.pattern.test(id))).map((library) => library.name);
  const entryModules = chunks.filter((chunk) => chunk.isEntry && chunk.facadeModuleId).map((chunk) => chunk.facadeModuleId!);
  return {
    firstLoad: sized.filter(({ chunk }) => first.has(chunk.fileName)).map(({ chunk, gzipBytes }) => ({ fileName: chunk.fileName, gzipBytes })),
    firstLoadGzipBytes: sized.filter(({ chunk }) => first.has(chunk.fileName)).reduce((sum, { gzipBytes }) => sum + gzipBytes, 0),
    lazy: sized.filter(({ chunk }) => !first.has(chunk.fileName)).map(({ chunk, gzipBytes }) => ({ fileName: chunk.fileName, gzipBytes, libraries: librariesIn(chunk) })),
    libraries: libraries.map((library) => {
      const holding = chunks.filter((chunk) => chunk.moduleIds.some((id) => library.pattern.test(id)));
      const lazy = holding.every((chunk) => !first.has(chunk.fileName));
      return { name: library.name, lazy, chunks: holding.map((chunk) => chunk.fileName), eagerChain: lazy ? null : staticImportChain(entryModules, library.pattern, moduleInfo) };
    }),
  };
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(2)} kB`;

export function formatReport(report: BundleReport, targetKb: number, root = process.cwd()): string {
  const name = (id: string) => relative(root, id.replace(/^\0/, ""));
  const within = report.firstLoadGzipBytes <= targetKb * 1000;
  const lines = [
    "bundle report (gzip)",
    `  first-load JS: ${kB(report.firstLoadGzipBytes)}  target ≤ ${targetKb} kB  ${within ? "within target" : "OVER TARGET"}`,
    ...report.firstLoad.map((chunk) => `    first load  ${chunk.fileName}  ${kB(chunk.gzipBytes)}`),
    ...report.lazy.map((chunk) => `    lazy        ${chunk.fileName}  ${kB(chunk.gzipBytes)}${chunk.libraries.length ? `  (${chunk.libraries.join(", ")})` : ""}`),
  ];
  for (const library of report.libraries) {
    if (library.chunks.length === 0) lines.push(`  ${library.name}: not in the bundle`);
    else if (library.lazy) lines.push(`  ${library.name}: lazy (${library.chunks.join(", ")})`);
    else {
      const chain = library.eagerChain ?? [];
      const importer = [...chain].reverse().find((id) => !/node_modules/.test(id));
      lines.push(`  ${library.name}: EAGER, in the first load${importer ? `; imported statically by ${name(importer)}` : ""}`);
      if (chain.length) lines.push(`    chain: ${chain.map(name).join(" → ")}`);
    }
  }
  return lines.join("\n");
}

interface PluginContextLike {
  getModuleInfo(id: string): ModuleFacts | null;
  emitFile(file: { type: "asset"; fileName: string; source: string }): string;
}

// Beside vite's own manifest; express.static skips dot-folders, so it is never served.
export const reportFileName = ".vite/bundle-report.json";

type BundleEntry = ({ type: "chunk" } & ChunkFacts) | { type: "asset" };

/** The rolldown plugin: prints the report once the bundle is generated and keeps it as JSON in the output. */
export function bundleReport(options: { targetKb?: number; libraries?: LazyLibrary[] } = {}) {
  const targetKb = options.targetKb ?? 350;
  return {
    name: "portfold-bundle-report",
    generateBundle(this: PluginContextLike, _output: unknown, bundle: Record<string, BundleEntry>) {
      const chunks = Object.values(bundle).filter((entry): entry is { type: "chunk" } & ChunkFacts => entry.type === "chunk");
      const report = analyseBundle(chunks, (id) => this.getModuleInfo(id), options.libraries);
      process.stdout.write(`\n${formatReport(report, targetKb)}\n\n`);
      this.emitFile({ type: "asset", fileName: reportFileName, source: JSON.stringify({ targetKb, ...report }, null, 2) });
    },
  };
}
