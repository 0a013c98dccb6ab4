// The Portfold netlist, one entry per construct, each with a tiny example that reads as it stands.

export interface SyntaxEntry {
  id: string;
  title: string;
  /** What the line means, in one or two sentences. */
  text: string;
  example: string;
}

export const SYNTAX_ENTRIES: SyntaxEntry[] = [
  { id: "lines", title: "One element a line", text: "Each line is name, kind word, its two nodes, = and its value. Names are yours (letters, digits, _) and say what the part is; nodes are any names, and 0 is ground unless a ground line says otherwise.", example: "Rsens resistor in 0 = Rs" },
  { id: "resistor", title: "resistor", text: "A resistance between two nodes; its value is in ohms. A symbol on a resistor is taken as a resistance, and as positive.", example: "Rload resistor out 0 = 4.7k" },
  { id: "conductance", title: "conductance", text: "A conductance between two nodes, in siemens: the same part as a resistor of 1/G, written the way the equations use it.", example: "Gleak conductance in 0 = G_leak" },
  { id: "capacitor", title: "capacitor", text: "A capacitance, impedance 1/(sC). With a capacitor or inductor in the network the results are functions of s and the port has an impedance Zth(s).", example: "Cfilt capacitor out 0 = 100n" },
  { id: "inductor", title: "inductor", text: "An inductance, impedance sL.", example: "Ltrace inductor in mid = L_t" },
  { id: "voltage", title: "voltage", text: "A voltage source: holds V(a) − V(b) at its value. With across(…) or through(…) in the value it is a controlled source (VCVS, CCVS).", example: "Sensor voltage in 0 = Vs" },
  { id: "current", title: "current", text: "A current source: drives its value from a to b through itself. With a control in the value it is a VCCS or CCCS.", example: "Bias current 0 e = I_bias" },
  { id: "across", title: "across(n1, n2) — voltage control", text: "The voltage V(n1) − V(n2), inside a source's value. The value must be linear in its controls; several may be added.", example: "Amp voltage x 0 = A * across(in, out)\nGm1 current d s = gm*across(g, s) + gmb*across(b, s)" },
  { id: "through", title: "through(element) — current control", text: "The current through a named two-terminal element, in its a → b direction, inside a source's value.", example: "Readout voltage o 0 = rm * through(Rshunt)" },
  { id: "opamp", title: "opamp", text: "An ideal op-amp (nullor): non-inverting input, inverting input, -> output. Its inputs draw no current and are held at the same voltage.", example: "Buf opamp p n -> out" },
  { id: "cell", title: "cell — a small-signal device model", text: "An instance of a cell: built-in (bjt-hybrid-pi, mosfet, amplifier) or one of your team's. Terminals as terminal=node; with names optional parts to include; rename gives this instance its own symbols.", example: "Stage cell bjt-hybrid-pi b=base c=col e=emit rename gm:gm1\nInput cell mosfet g=in d=drain s=src b=0 with Cgs" },
  { id: "ground", title: "ground", text: "Names the reference node (0 when there is no ground line).", example: "ground gnd" },
  { id: "port", title: "port", text: "The two nodes the equivalents are seen from: plus, then minus. Exactly one port line.", example: "port out 0" },
  { id: "quantity", title: "quantity", text: "Says what a symbol stands for when the elements it sits on cannot tell (resistance, conductance, voltage, current, dimensionless, transconductance, transresistance, capacitance, inductance, frequency, time). Units and signs of limits follow from it.", example: "quantity A dimensionless" },
  { id: "assume", title: "assume", text: "A design assumption: each result is also shown with only its dominant terms under it.", example: "assume gm*ro >> 1" },
  { id: "comments", title: "Comments", text: "From # to the end of the line. Blank lines and spacing are kept exactly as typed.", example: "Rtop resistor in mid = R_top   # 10k nominal" },
  { id: "values", title: "Values and SI prefixes", text: "A value is a number or an expression of symbols with + − * / ^ and parentheses. SI prefixes follow the digits with no space: T G M k m u µ n p f. As the SI Brochure has it, M is mega (10⁶) and m is milli (10⁻³); 2.2M is 2.2 MΩ on a resistor, and words like Meg are not prefixes.", example: "Rbig resistor a b = 2.2M\nRsmall resistor b 0 = 470m" },
];

// Which entry explains a diagnostic, by the engine's stable code.
const ENTRY_FOR_CODE: Record<string, string> = {
  "parse-error": "lines",
  "value-syntax": "values",
  "duplicate-name": "lines",
  "empty-network": "lines",
  "port-unknown-node": "port",
  "port-same-node": "port",
  "control-missing-element": "through",
  "control-self": "through",
  "control-unknown-node": "across",
  "control-kind-mismatch": "across",
  "control-unsupported": "through",
  "value-zero": "resistor",
  "floating-node": "ground",
  "no-dc-path": "capacitor",
  "voltage-source-loop": "voltage",
  "current-source-cutset": "current",
  "quantity-conflict": "quantity",
  "dimension-mismatch": "quantity",
  "cell-unknown": "cell",
  "cell-terminals": "cell",
  "cell-symbols": "cell",
};

/** The entry for a diagnostic: by its code, or by a kind word its message names. */
export function entryForDiagnostic(code: string, message = ""): string | undefined {
  if (code === "parse-error") {
    const named = SYNTAX_ENTRIES.find((e) => /^[a-z]+$/.test(e.title) && new RegExp(`\\b${e.title}\\b`).test(message));
    if (named) return named.id;
  }
  return ENTRY_FOR_CODE[code];
}
