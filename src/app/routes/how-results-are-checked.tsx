import { Caution } from "@/components/ui/caution";

// Every check behind a result, and every outside reference the test suite holds the engine to.
// Keep in step with "How results are checked" in README.md.

const MARKS: { mark: string; what: string; fails: string }[] = [
  {
    mark: "test source",
    what: "The network is written again as a sparse tableau (every node voltage and every element current an unknown, one equation per element), with no code shared with the nodal solve. With the independent sources zeroed, 1 A is driven into the port and the tableau is solved in floating point at three random points (values m/64 between 0.5 and 2); the port voltage is compared with Rth evaluated exactly at the same point.",
    fails: "when the relative difference reaches 10⁻⁶ anywhere, or when the tableau solves where the exact solve found no Rth.",
  },
  {
    mark: "Voc/Isc",
    what: "Vth from the open port divided by Isc from the shorted port, two solves apart from the test source, minus Rth, reduced exactly.",
    fails: "when the difference does not cancel to 0.",
  },
  {
    mark: "numeric",
    what: "The open, test-source and shorted set-ups of the sparse tableau solved in floating point at three further random points; Vth, Rth and Isc compared with the exact results there.",
    fails: "when any relative difference reaches 10⁻⁶, or a result exists on one side only.",
  },
  {
    mark: "exact point",
    what: "The same tableau with the symbols replaced by random rationals (small numerators over one odd prime), solved by exact rational elimination; Vth, Rth and Isc compared with the results substituted at the same values, digit for digit.",
    fails: "on any difference at all, however small: it sees what floating point cannot.",
  },
];

const OTHER_CHECKS = [
  "Dimension check: every symbol's quantity is inferred from the element it sits on (or declared); Vth must come out in V, Rth in Ω, Isc in A. A mismatch is a warning beside the badge.",
  "A singular system names the elements and nodes it leaves undetermined, found from the null space of the same exact tableau, and the controlled sources among them.",
];

const SUITE: { what: string; count: string }[] = [
  { what: "Generated networks (every element kind, with and without s) solved by an independent sympy formulation; Vth, Rth and Isc must cancel exactly against ours", count: "66 networks" },
  { what: "Every printed form (infix, compact, TeX, compact TeX) and every ledger formula (equations, matrices, solutions, equivalents, limits) read back by a separate reader in the tests and compared with the exact result at random points", count: "115 networks: 18 fixture files, 66 generated, 30 with op-amps, 1 sign case" },
  { what: "Random networks against a floating-point tableau solve written in the test, results read by nerdamer", count: "150 runs" },
  { what: "Planted faults (a wrong stamp, a wrong Rth, a wrong Vth, an Rth off by one part in 10¹²), each turning the marks that should see it to ✗", count: "4 faults" },
  { what: "The ledger's KCL and branch equations solved by sympy give Vth", count: "7 fixtures" },
  { what: "Polynomial and rational-function arithmetic, GCDs, determinants and limits against sympy", count: "hundreds of random cases" },
  { what: "An outside review with its own sympy solver on networks the tests do not contain", count: "108 networks: 105 agreed, 2 timed out, 1 diagnostic; its one printing fault (a lost bracket in compact TeX) is fixed and tested" },
];

const TEXTBOOK: { result: string; source: string }[] = [
  { result: "Finite-gain voltage follower: Rout = Ro/(1 + A), Vth = A·Vs/(1 + A)", source: "Sedra & Smith, Microelectronic Circuits, 7th ed., ch. 2" },
  { result: "Inverting and non-inverting amplifiers on an ideal op-amp; finite open-loop gain A", source: "Sedra & Smith, 7th ed., ch. 2" },
  { result: "Emitter follower output resistance and gain; CE with degeneration; CE, CB, CC stages of the hybrid-π cell", source: "Sedra & Smith, 7th ed., ch. 7" },
  { result: "Miller input admittance s(Cgs + Cgd(1 + gm·RD))", source: "Sedra & Smith, 7th ed., ch. 10" },
  { result: "Degenerated common source, cascode (with and without body effect), source follower; gm·ro ≫ 1 approximations", source: "Razavi, Design of Analog CMOS Integrated Circuits, 2nd ed., ch. 3" },
  { result: "Source transformation, maximum power transfer, Wheatstone bridge", source: "Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed., ch. 5" },
  { result: "Voltage divider, RC low-pass, series RL and RLC, coupling capacitor, RC corner", source: "common practice" },
];

export function HowResultsAreCheckedRoute() {
  return (
    <article className="max-w-3xl text-sm leading-relaxed">
      <h1 className="text-2xl font-semibold tracking-tight">How results are checked</h1>
      <p className="mt-2 text-ink/80">
        Every solve runs four checks on its own result, shown as the marks of the check badge above the ledger; ✓ agrees, ✗ disagrees, – could not run.
        Open “What each check did” under the badge to read what each one compared and found.
      </p>

      <h2 className="mt-6 text-lg font-semibold">The check badge</h2>
      <dl className="mt-2 space-y-3">
        {MARKS.map((m) => (
          <div key={m.mark}>
            <dt className="font-medium">{m.mark}</dt>
            <dd className="text-ink/80">
              {m.what} <span className="text-ink">It turns ✗ {m.fails}</span>
            </dd>
          </div>
        ))}
      </dl>

      <h2 className="mt-6 text-lg font-semibold">Also on every solve</h2>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-ink/80">
        {OTHER_CHECKS.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>

      <h2 className="mt-6 text-lg font-semibold">In the test suite</h2>
      <table className="mt-2 w-full border-collapse text-left">
        <thead>
          <tr className="border-b border-rule text-ink/60">
            <th className="py-1 pr-3 font-normal">Check</th>
            <th className="py-1 font-normal">How many</th>
          </tr>
        </thead>
        <tbody>
          {SUITE.map((s) => (
            <tr key={s.what} className="border-b border-rule/60 align-top">
              <td className="py-1 pr-3">{s.what}</td>
              <td className="py-1 text-ink/80">{s.count}</td>
            </tr>
          ))}
        </tbody>
      </table>

      <h2 className="mt-6 text-lg font-semibold">Textbook cases</h2>
      <p className="mt-1 text-ink/70">Formulas recalled from these books (not re-read), each a test that compares our result at random points.</p>
      <table className="mt-2 w-full border-collapse text-left">
        <thead>
          <tr className="border-b border-rule text-ink/60">
            <th className="py-1 pr-3 font-normal">Result</th>
            <th className="py-1 font-normal">Source</th>
          </tr>
        </thead>
        <tbody>
          {TEXTBOOK.map((t) => (
            <tr key={t.result} className="border-b border-rule/60 align-top">
              <td className="py-1 pr-3">{t.result}</td>
              <td className="py-1 text-ink/80">{t.source}</td>
            </tr>
          ))}
        </tbody>
      </table>

      <div className="mt-6">
        <Caution />
      </div>
    </article>
  );
}
