// Port set-ups: the open port (Vth), the test source with independent sources zeroed (Rth),
// and the shorted port (Isc), each as a linear system derived from the assembled one.

import { Poly, RationalFunction } from "../algebra";
import type { Network, Port } from "../types";
import { isControlled, isSource } from "./elements";
import type { NodalSystem, Row, Unknown } from "./mna";
import { kclRow, voltageUnknown } from "./stamps";

/** The port vector c: +1 at plus, −1 at minus (ground left out), so V(plus) − V(minus) = cᵀx. */
export function portVector(sys: NodalSystem, port: Port): Poly[] {
  const c = new Array<Poly>(sys.unknowns.length).fill(Poly.zero());
  const p = sys.colIndex.get(voltageUnknown(port.plus));
  const m = sys.colIndex.get(voltageUnknown(port.minus));
  if (p !== undefined) c[p] = Poly.one();
  if (m !== undefined) c[m] = Poly.constant(-1);
  return c;
}

/**
 * Independent sources set to zero for the test-source solve: V -> short, I -> open. A controlled
 * source stays; only an independent part it adds to its controlled parts is set to zero (partly).
 */
export function zeroIndependentSources(
  network: Network,
  independent: ReadonlyMap<string, RationalFunction>,
): { shorted: string[]; opened: string[]; partly: string[] } {
  const shorted: string[] = [];
  const opened: string[] = [];
  const partly: string[] = [];
  for (const e of network.elements) {
    if (!isSource(e)) continue;
    if (!isControlled(e)) (e.kind === "voltage" ? shorted : opened).push(e.name);
    else if (!(independent.get(e.name)?.isZero() ?? true)) partly.push(e.name);
  }
  return { shorted, opened, partly };
}

export interface ShortedSystem<T> {
  /** The node that disappears into the other port node (or into ground). */
  merged: string;
  into: string;
  unknowns: Unknown[];
  rows: Row[];
  a: T[][];
  b: T[];
  /** The KCL row of the merged node, kept aside: Isc = sign · (probeRhs − probeRow · x'). */
  probeRow: T[];
  probeRhs: T;
  sign: 1 | -1;
}

/**
 * Short the port by joining its nodes: V(plus) = V(minus). The short's current is read from the
 * KCL equation of the node that disappears (the other node's KCL becomes the supernode's).
 */
export function shortPort<T>(
  sys: NodalSystem,
  port: Port,
  a: T[][],
  b: T[],
  ring: { add: (x: T, y: T) => T },
): ShortedSystem<T> {
  const ground = sys.ground;
  const plusIsGround = port.plus === ground;
  const merged = plusIsGround ? port.minus : port.plus;
  const into = plusIsGround ? port.plus : port.minus;
  const sign: 1 | -1 = plusIsGround ? -1 : 1;
  const from = sys.colIndex.get(voltageUnknown(merged))!;
  const fromRow = sys.rowIndex.get(kclRow(merged))!;
  const intoCol = into === ground ? undefined : sys.colIndex.get(voltageUnknown(into));
  const intoRow = into === ground ? undefined : sys.rowIndex.get(kclRow(into));

  const mergeColumns = (row: T[]): T[] => {
    const out = row.slice();
    if (intoCol !== undefined) out[intoCol] = ring.add(out[intoCol], row[from]);
    out.splice(from, 1);
    return out;
  };
  const rowsMerged = a.map(mergeColumns);
  const probeRow = rowsMerged[fromRow];
  const probeRhs = b[fromRow];
  const a2: T[][] = [];
  const b2: T[] = [];
  rowsMerged.forEach((row, i) => {
    if (i === fromRow) return;
    if (i === intoRow) {
      a2.push(row.map((x, j) => ring.add(x, probeRow[j])));
      b2.push(ring.add(b[i], probeRhs));
    } else {
      a2.push(row);
      b2.push(b[i]);
    }
  });
  return {
    merged,
    into,
    unknowns: sys.unknowns.filter((_, j) => j !== from),
    rows: sys.rows.filter((_, i) => i !== fromRow),
    a: a2,
    b: b2,
    probeRow,
    probeRhs,
    sign,
  };
}

export const polyRing = { add: (x: Poly, y: Poly) => x.add(y) };
export const displayRing = { add: (x: RationalFunction, y: RationalFunction) => x.add(y) };
