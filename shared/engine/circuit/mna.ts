// Modified nodal analysis: assemble the element stamps into A x = b.

import { Poly, RationalFunction } from "../algebra";
import type { Network } from "../types";
import { currentInfix, currentTex, voltageInfix, voltageTex } from "./display";
import { currentControlledElements, isOpamp, isVoltageType, networkNodes } from "./elements";
import { branchRow, currentUnknown, kclRow, stampElement, voltageUnknown, type ElementStamp } from "./stamps";
import type { InternalSymbol, SourceTerms } from "./values";

export interface Unknown {
  key: string;
  kind: "voltage" | "current";
  /** Node or element it belongs to. */
  of: string;
  infix: string;
  tex: string;
}

export interface Row {
  key: string;
  kind: "kcl" | "branch";
  of: string;
}

export interface NodalSystem {
  ground: string;
  nodes: string[];
  unknowns: Unknown[];
  rows: Row[];
  /** A, in polynomials over user symbols and internal variables. */
  a: Poly[][];
  /** b: the independent sources. */
  b: Poly[];
  /** The same A and b in user symbols, for the ledger. */
  aDisplay: RationalFunction[][];
  bDisplay: RationalFunction[];
  stamps: ElementStamp[];
  internals: InternalSymbol[];
  /** Row index of each row key, column index of each unknown key. */
  rowIndex: ReadonlyMap<string, number>;
  colIndex: ReadonlyMap<string, number>;
}

/** Elements whose current is an unknown: V-type sources, op-amps, and every element some source is controlled by. */
function branchFormElements(network: Network): Set<string> {
  const out = currentControlledElements(network);
  for (const e of network.elements) if (isOpamp(e) || isVoltageType(e.kind)) out.add(e.name);
  return out;
}

export function assembleNodalSystem(network: Network, values: ReadonlyMap<string, RationalFunction>, terms: SourceTerms = new Map()): NodalSystem {
  const ground = network.ground;
  const nodes = networkNodes(network);
  const branch = branchFormElements(network);
  const stamps = network.elements.map((e, index) =>
    stampElement(e, { ground, index, value: values.get(e.name) ?? null, branchForm: branch.has(e.name), terms: terms.get(e.name) ?? [] }),
  );

  const unknowns: Unknown[] = nodes.map((n) => ({ key: voltageUnknown(n), kind: "voltage", of: n, infix: voltageInfix(n), tex: voltageTex(n) }));
  const rows: Row[] = nodes.map((n) => ({ key: kclRow(n), kind: "kcl", of: n }));
  for (const e of network.elements) {
    if (!branch.has(e.name)) continue;
    unknowns.push({ key: currentUnknown(e.name), kind: "current", of: e.name, infix: currentInfix(e.name), tex: currentTex(e.name) });
    rows.push({ key: branchRow(e.name), kind: "branch", of: e.name });
  }
  const rowIndex = new Map(rows.map((r, i) => [r.key, i]));
  const colIndex = new Map(unknowns.map((u, i) => [u.key, i]));
  const n = unknowns.length;

  const a: Poly[][] = Array.from({ length: n }, () => new Array<Poly>(n).fill(Poly.zero()));
  const aDisplay: RationalFunction[][] = Array.from({ length: n }, () => new Array<RationalFunction>(n).fill(RationalFunction.constant(0)));
  const b: Poly[] = new Array<Poly>(n).fill(Poly.zero());
  const bDisplay: RationalFunction[] = new Array<RationalFunction>(n).fill(RationalFunction.constant(0));

  for (const s of stamps) {
    for (const en of s.entries) {
      const r = rowIndex.get(en.row);
      const c = colIndex.get(en.col);
      // Rows and columns of the ground node are dropped: V(ground) = 0 and its KCL is implied.
      if (r === undefined || c === undefined) continue;
      a[r][c] = a[r][c].add(en.coeff);
      aDisplay[r][c] = aDisplay[r][c].add(en.display);
    }
    for (const so of s.sources) {
      const r = rowIndex.get(so.row);
      if (r === undefined) continue;
      b[r] = b[r].add(so.value);
      bDisplay[r] = bDisplay[r].add(so.display);
    }
  }
  return {
    ground,
    nodes,
    unknowns,
    rows,
    a,
    b,
    aDisplay,
    bDisplay,
    stamps,
    internals: stamps.flatMap((s) => s.internals),
    rowIndex,
    colIndex,
  };
}
