// The check badge can fail: faults planted in the engine's own solve (a wrong stamp, a wrong
// Rth, a wrong Vth, a result off by one part in 10^12) turn the marks that should see them to ✗,
// and correct results over the fixtures and the generated corpus keep every mark from ✗.

import { beforeEach, describe, expect, it, vi } from "vitest";
import { solveNetwork, type SolveResult } from "../../shared/engine";
import { Rational, type RationalFunction } from "../../shared/engine/algebra";
import { fixtureNetworks, generatedCorpus } from "./circuit-generators";

const plant = vi.hoisted(() => ({
  /** Elements stamped with twice their value: a wrong stamp, so every exact result is consistently wrong. */
  doubledStamp: new Set<string>(),
  /** Change the open-port Rth or Vth after the engine found them. */
  rth: null as null | ((f: RationalFunction) => RationalFunction),
  vth: null as null | ((f: RationalFunction) => RationalFunction),
}));

vi.mock("../../shared/engine/circuit/stamps", async (importOriginal) => {
  const real = await importOriginal<typeof import("../../shared/engine/circuit/stamps")>();
  return {
    ...real,
    stampElement: (e: Parameters<typeof real.stampElement>[0], ctx: Parameters<typeof real.stampElement>[1]) =>
      real.stampElement(e, plant.doubledStamp.has(e.name) && ctx.value ? { ...ctx, value: ctx.value.add(ctx.value) } : ctx),
  };
});

vi.mock("../../shared/engine/circuit/port-solution", async (importOriginal) => {
  const real = await importOriginal<typeof import("../../shared/engine/circuit/port-solution")>();
  return {
    ...real,
    solveOpenPort: (...args: Parameters<typeof real.solveOpenPort>) => {
      const r = real.solveOpenPort(...args);
      return { ...r, rth: r.rth && plant.rth ? plant.rth(r.rth) : r.rth, vth: r.vth && plant.vth ? plant.vth(r.vth) : r.vth };
    },
  };
});

// Emitter follower with its current gain: every element kind of a transistor stage's small-signal model.
const FOLLOWER = `
port e 0
Sig voltage s 0 = Vs
Rsrc resistor s b = Rs
Rpi resistor b e = r_pi
Fb current 0 e = beta * through(Rpi)
Remit resistor e 0 = RE
`;

function marks(r: SolveResult) {
  const { testSource, vocIsc, numeric, exactPoint } = r.checks;
  return { testSource, vocIsc, numeric, exactPoint };
}

beforeEach(() => {
  plant.doubledStamp.clear();
  plant.rth = null;
  plant.vth = null;
});

describe("planted faults turn the check badge's marks to ✗", () => {
  it("with nothing planted, every mark is ✓", () => {
    expect(marks(solveNetwork(FOLLOWER, { steps: false }))).toEqual({ testSource: true, vocIsc: true, numeric: true, exactPoint: true });
  });

  it("a wrong stamp (Rpi stamped as 2·r_pi): Voc/Isc still agrees with itself, every independent mark is ✗", () => {
    plant.doubledStamp.add("Rpi");
    const r = solveNetwork(FOLLOWER, { steps: false });
    expect(marks(r)).toEqual({ testSource: false, vocIsc: true, numeric: false, exactPoint: false });
    expect(r.checks.details.testSource.outcome).toMatch(/Rth differs/);
  });

  it("a wrong Rth (twice the true one): the test-source, Voc/Isc, numeric and exact-point marks are ✗", () => {
    plant.rth = (f) => f.add(f);
    const r = solveNetwork(FOLLOWER, { steps: false });
    expect(marks(r)).toEqual({ testSource: false, vocIsc: false, numeric: false, exactPoint: false });
  });

  it("a wrong Vth (sign flipped): Rth is still right, so only the test-source mark stays ✓", () => {
    plant.vth = (f) => f.neg();
    const r = solveNetwork(FOLLOWER, { steps: false });
    expect(marks(r)).toEqual({ testSource: true, vocIsc: false, numeric: false, exactPoint: false });
    expect(r.checks.details.numeric.outcome).toMatch(/Vth differs/);
  });

  it("an Rth off by one part in 10^12: below floating point's reach, the exact-point mark alone is ✗", () => {
    plant.rth = (f) => f.scale(Rational.of(1_000_000_000_001n, 1_000_000_000_000n));
    const r = solveNetwork(FOLLOWER, { steps: false });
    expect(marks(r).exactPoint).toBe(false);
    expect(marks(r).numeric).toBe(true);
    expect(r.checks.details.exactPoint.outcome).toMatch(/Rth is .* by the result but .* by the tableau/);
  });
});

describe("correct results keep every mark from ✗", () => {
  const cases = [
    ...fixtureNetworks().map((f) => ({ id: f.file, network: f.text as string | object })),
    ...generatedCorpus(66).map((network, i) => ({ id: `generated ${i}`, network: network as string | object })),
  ];
  it.each(cases.map((c, i) => [c.id, i] as const))("%s", (_id, i) => {
    const r = solveNetwork(cases[i].network as string, { steps: false, sensitivities: false, dimensions: false });
    for (const [name, d] of Object.entries(r.checks.details)) expect(d.agree, `${name}: ${d.outcome}`).not.toBe(false);
    if (r.vth !== null || r.isc !== null) {
      expect(r.checks.numeric, r.checks.details.numeric.outcome).toBe(true);
      expect(r.checks.exactPoint, r.checks.details.exactPoint.outcome).toBe(true);
    }
  });
});
