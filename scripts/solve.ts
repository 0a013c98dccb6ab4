// Command line: solve one network file (JSON or Portfold netlist) and print one JSON object.
//
//   npm run -s solve -- FILE [--limit SYMBOL=inf|0]... [--set NAME=VALUE,...]... [--float]
//                            [--solve-for SYMBOL:RESULT=VALUE]... [--quantity SYMBOL=QUANTITY]...
//                            [--no-steps] [--compact] [--server URL [--team TEAM]]
//
// Exit status: 0 solved (degenerate ports included), 2 invalid input (diagnostics printed), 1 otherwise.

import { readFileSync } from "node:fs";
import { startupSnapshot } from "node:v8";
import { QUANTITIES, solveNetwork, toSolveOutput, type Quantity, type ResultName, type SolveOptions } from "../shared/engine";
import { ServerError, storeOnServer, type ServerTarget } from "./solve-remote";

const USAGE = `usage: npm run -s solve -- FILE [--limit SYMBOL=inf|0] [--set NAME=VALUE,...] [--float]
       [--solve-for SYMBOL:RESULT=VALUE] [--quantity SYMBOL=QUANTITY] [--assume "PRODUCT>>1"]
       [--no-steps] [--compact] [--server URL [--team TEAM]]
  FILE       a network as JSON or as a Portfold netlist (.pfn)
  --limit    take every result to the limit SYMBOL -> inf or SYMBOL -> 0 (repeatable)
  --set      give symbols values, exact, SI prefixes allowed: --set R0=4.7k,mu=1e5
  --float    also print floating-point values for --set
  --solve-for  solve RESULT (vth, isc, rth) = VALUE for SYMBOL: --solve-for RL:rth=50
  --quantity declare a symbol's quantity (${QUANTITIES.join(", ")})
  --assume   also give each result with its dominant terms only: --assume "gm*ro>>1" (repeatable)
  --no-steps leave the derivation steps out
  --compact  print the JSON on one line
  --server   also store the network and its revision on that Portfold server (API token in
             PORTFOLD_TOKEN) and add the revision's permanent link to the JSON
  --team     the team to store it in (id or exact name); default: the token's own team, else
             your personal team`;

class UsageError extends Error {}

function parseArgs(argv: string[]): { file: string; options: SolveOptions; compact: boolean; server: ServerTarget | null } {
  let file: string | null = null;
  let server: ServerTarget | null = null;
  let team: string | null = null;
  const options: SolveOptions = { limits: [], values: {}, solveFor: [], quantities: {}, assume: [] };
  let compact = false;
  const take = (i: number, flag: string): string => {
    const v = argv[i + 1];
    if (v === undefined || v.startsWith("--")) throw new UsageError(`${flag} needs a value`);
    return v;
  };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    const [flag, inline] = arg.startsWith("--") && arg.includes("=") ? [arg.slice(0, arg.indexOf("=")), arg.slice(arg.indexOf("=") + 1)] : [arg, undefined];
    const value = () => (inline !== undefined ? inline : take(i++, flag));
    switch (flag) {
      case "--limit": {
        const v = value();
        const m = /^([^=]+)=(inf|\+inf|infinity|oo|0|zero)$/i.exec(v);
        if (!m) throw new UsageError(`--limit ${v}: write SYMBOL=inf or SYMBOL=0`);
        options.limits!.push({ symbol: m[1].trim(), to: m[2] === "0" || m[2].toLowerCase() === "zero" ? "zero" : "inf" });
        break;
      }
      case "--set": {
        for (const pair of value().split(",")) {
          if (pair.trim() === "") continue;
          const eq = pair.indexOf("=");
          if (eq <= 0) throw new UsageError(`--set ${pair}: write NAME=VALUE`);
          options.values![pair.slice(0, eq).trim()] = pair.slice(eq + 1).trim();
        }
        break;
      }
      case "--solve-for": {
        const v = value();
        const m = /^([^:]+):(vth|isc|rth|rthFromVocIsc)=(.+)$/.exec(v);
        if (!m) throw new UsageError(`--solve-for ${v}: write SYMBOL:RESULT=VALUE, e.g. RL:rth=50`);
        options.solveFor!.push({ symbol: m[1].trim(), result: m[2] as ResultName, target: m[3].trim() });
        break;
      }
      case "--quantity": {
        const v = value();
        const m = /^([^=]+)=(.+)$/.exec(v);
        if (!m || !(QUANTITIES as readonly string[]).includes(m[2])) throw new UsageError(`--quantity ${v}: write SYMBOL=QUANTITY (${QUANTITIES.join(", ")})`);
        options.quantities![m[1].trim()] = m[2] as Quantity;
        break;
      }
      case "--assume":
        options.assume!.push(value());
        break;
      case "--float":
        options.float = true;
        break;
      case "--no-steps":
        options.steps = false;
        break;
      case "--compact":
        compact = true;
        break;
      case "--server": {
        const url = value();
        if (!/^https?:\/\/[^/]/.test(url)) throw new UsageError(`--server ${url}: write the server's address, e.g. http://127.0.0.1:4317`);
        server = { url, token: process.env.PORTFOLD_TOKEN ?? "", team: null };
        break;
      }
      case "--team":
        team = value();
        break;
      case "--help":
      case "-h":
        throw new UsageError("");
      default:
        if (arg.startsWith("-")) throw new UsageError(`unknown option ${arg}`);
        if (file !== null) throw new UsageError(`one FILE only (got "${file}" and "${arg}")`);
        file = arg;
    }
  }
  if (file === null) throw new UsageError("FILE is missing");
  if (team !== null && server === null) throw new UsageError("--team needs --server");
  if (server !== null) server = { ...server, team };
  return { file, options, compact, server };
}

async function main(argv: string[]): Promise<number> {
  let args: ReturnType<typeof parseArgs>;
  try {
    args = parseArgs(argv);
  } catch (e) {
    if (!(e instanceof UsageError)) throw e;
    if (e.message) process.stderr.write(`solve: ${e.message}\n`);
    process.stderr.write(USAGE + "\n");
    return 1;
  }
  let text: string;
  try {
    text = readFileSync(args.file, "utf8");
  } catch (e) {
    process.stderr.write(`solve: cannot read ${args.file}: ${e instanceof Error ? e.message : String(e)}\n`);
    return 1;
  }
  const result = solveNetwork(text, args.options);
  let output: object = toSolveOutput(result);
  // Invalid input never reaches the server: the diagnostics above are the answer.
  if (args.server && result.ok) {
    try {
      output = { ...output, ...(await storeOnServer(args.server, args.file, text)) };
    } catch (e) {
      if (!(e instanceof ServerError)) throw e;
      process.stderr.write(`solve: ${e.message}\n`);
      return 1;
    }
  }
  process.stdout.write(JSON.stringify(output, null, args.compact ? undefined : 2) + "\n");
  return result.ok ? 0 : 2;
}

function run(argv: string[]): void {
  main(argv).then(
    (code) => (process.exitCode = code),
    (e) => {
      process.stderr.write(`solve: internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
      process.exitCode = 1;
    },
  );
}

// `npm run solve` starts from a startup snapshot of this file (scripts/build-solve.mjs): the engine is
// loaded and warmed once at build time, and a run from the snapshot gets its arguments after node alone.
if (startupSnapshot.isBuildingSnapshot()) {
  solveNetwork("port out 0\nSensor voltage emf 0 = Vs\nWinding resistor emf out = Rs\n");
  startupSnapshot.setDeserializeMainFunction(() => run(process.argv.slice(1)));
} else {
  run(process.argv.slice(2));
}
