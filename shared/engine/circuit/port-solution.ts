// Solve the three port set-ups by Cramer's rule on division-free determinants and cofactors,
// then return to the user's symbols exactly.
//
//   open port:    x = A⁻¹ b,   Vth = cᵀx        = Σ_j b_j (C_j,plus − C_j,minus) / det A
//   test source:  x = A⁻¹ c,   Rth = cᵀx        = (C_pp − C_pm − C_mp + C_mm) / det A
//   short:        A' x' = b',  Isc = ±(β − rᵀx') on the system with the port nodes joined
//
// The short is solved on its own matrix (nodes merged), so Voc/Isc is an independent check of Rth.

import { Poly, RationalFunction, cofactorsOf } from "../algebra";
import type { Port } from "../types";
import type { NodalSystem } from "./mna";
import { polyRing, portVector, shortPort, type ShortedSystem } from "./ports";
import { restoreUserSymbols } from "./restore-symbols";

export interface OpenPortSolution {
  /** det A in user symbols (times the conversion multiplier, same as the numerators). */
  determinant: Poly;
  vth: RationalFunction | null;
  rth: RationalFunction | null;
  singular: boolean;
}

export interface ShortPortSolution {
  system: ShortedSystem<Poly>;
  determinant: Poly;
  isc: RationalFunction | null;
  singular: boolean;
}

export function solveOpenPort(sys: NodalSystem, port: Port): OpenPortSolution {
  const c = portVector(sys, port);
  const portCols = c.map((x, i) => (x.isZero() ? -1 : i)).filter((i) => i >= 0);
  // The port's row first: its cofactor is then one of the determinant's own first minors.
  const table = cofactorsOf(sys.a, portCols[0] ?? -1);
  const det = table.determinant();
  // cᵀ adj(A) v for a right side v: adj(A)_{ij} = C_ji.
  const along = (v: Poly[]): Poly => {
    let s = Poly.zero();
    for (let j = 0; j < v.length; j++) {
      if (v[j].isZero()) continue;
      for (const i of portCols) s = s.add(c[i].mul(v[j]).mul(table.cofactor(j, i)));
    }
    return s;
  };
  if (det.isZero()) return { determinant: det, vth: null, rth: null, singular: true };
  const [vthNum, rthNum, detUser] = restoreUserSymbols([along(sys.b), along(c), det], sys.internals);
  if (detUser.isZero()) return { determinant: detUser, vth: null, rth: null, singular: true };
  return {
    determinant: detUser,
    vth: RationalFunction.from(vthNum, detUser),
    rth: RationalFunction.from(rthNum, detUser),
    singular: false,
  };
}

export function solveShortedPort(sys: NodalSystem, port: Port): ShortPortSolution {
  const system = shortPort(sys, port, sys.a, sys.b, polyRing);
  const table = cofactorsOf(system.a);
  const det = table.determinant();
  if (det.isZero()) return { system, determinant: det, isc: null, singular: true };
  // Isc·det = sign · (β det − Σ_i r_i Σ_j b'_j C'_ji)
  let num = system.probeRhs.mul(det);
  for (let i = 0; i < system.probeRow.length; i++) {
    const r = system.probeRow[i];
    if (r.isZero()) continue;
    for (let j = 0; j < system.b.length; j++) {
      if (system.b[j].isZero()) continue;
      num = num.sub(r.mul(system.b[j]).mul(table.cofactor(j, i)));
    }
  }
  if (system.sign < 0) num = num.neg();
  const [iscNum, detUser] = restoreUserSymbols([num, det], sys.internals);
  if (detUser.isZero()) return { system, determinant: detUser, isc: null, singular: true };
  return { system, determinant: detUser, isc: RationalFunction.from(iscNum, detUser), singular: false };
}
