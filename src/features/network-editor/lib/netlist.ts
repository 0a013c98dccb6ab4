import { parseNetlistText, printNetlistText, validateNetworkJson, type EngineNetwork } from "@/lib/engine-netlist";
import type { Circuit, Diagnostic } from "@/lib/api-contract";

export interface ReadNetlist {
  network: EngineNetwork | null;
  diagnostics: Diagnostic[];
}

export function readNetlist(text: string): ReadNetlist {
  const parsed = parseNetlistText(text);
  return { network: parsed.network, diagnostics: parsed.diagnostics };
}

export function netlistOf(circuit: Circuit, title?: string): string {
  return printNetlistText({ ground: circuit.ground ?? "0", ...circuit } as EngineNetwork, title);
}

export function circuitOf(network: EngineNetwork): Circuit {
  return JSON.parse(JSON.stringify(network)) as Circuit;
}

export function nodesOf(network: EngineNetwork | null): string[] {
  if (!network) return [];
  const nodes = new Set<string>([network.ground]);
  for (const e of network.elements) {
    if (e.kind === "opamp") {
      nodes.add(e.inputs[0]);
      nodes.add(e.inputs[1]);
      nodes.add(e.output);
    } else {
      nodes.add(e.nodes[0]);
      nodes.add(e.nodes[1]);
    }
  }
  return [...nodes];
}

// The port lives on its own line; rewriting only that line keeps the designer's comments and layout.
export function withPort(text: string, plus: string, minus: string): string {
  const lines = text.split("\n");
  const index = lines.findIndex((line) => /^\s*port\b/.test(line));
  const portLine = `port ${plus} ${minus}`;
  if (index >= 0) {
    const comment = lines[index].indexOf("#");
    lines[index] = comment >= 0 ? `${portLine}  ${lines[index].slice(comment)}` : portLine;
    return lines.join("\n");
  }
  const ground = lines.findIndex((line) => /^\s*ground\b/.test(line));
  lines.splice(ground + 1, 0, portLine);
  return lines.join("\n");
}

export function looksLikeJson(text: string): boolean {
  return /^\s*\{/.test(text);
}

/** Either of our two forms: the JSON interchange format or the Portfold netlist. */
export function readNetworkText(text: string): ReadNetlist {
  if (!looksLikeJson(text)) return readNetlist(text);
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    return { network: null, diagnostics: [{ code: "invalid-json", severity: "error", message: error instanceof Error ? error.message : "not valid JSON", elements: [], nodes: [] }] };
  }
  const checked = validateNetworkJson(json);
  return { network: checked.network, diagnostics: checked.diagnostics };
}
