// Starting networks for the new-network dialog: our own sensor-interface scenario, in the netlist's words.

export interface StartingNetwork {
  id: string;
  title: string;
  summary: string;
  netlist: string;
}

export const STARTING_NETWORKS: StartingNetwork[] = [
  {
    id: "sensor-buffer",
    title: "Sensor buffer",
    summary: "A finite-gain amplifier wired as a follower behind the sensor's own resistance.",
    netlist: `# sensor buffer: finite-gain amplifier wired as a follower
ground 0
port out 0
Sensor voltage in 0 = Vs
Rsens resistor in p = Rs
Amp voltage x 0 = A * across(p, out)
Rout resistor x out = Ro
`,
  },
  {
    id: "degenerated-stage",
    title: "Transistor stage with emitter degeneration",
    summary: "Hybrid-pi common-emitter stage seen from its collector: how RE raises the output resistance.",
    netlist: `# common-emitter stage with emitter degeneration, seen from the collector
ground 0
port c 0
Signal voltage sig 0 = Vs
Rsrc resistor sig b = Rs
Rpi resistor b e = r_pi
Gm current c e = gm * across(b, e)
Ro resistor c e = r_o
Rdegen resistor e 0 = RE
`,
  },
  {
    id: "rc-input-filter",
    title: "RC input filter",
    summary: "The anti-alias RC in front of an ADC pin: Zth(s) and Vth(s) as the converter sees them.",
    netlist: `# RC input filter in front of an ADC, seen from the ADC pin
ground 0
port adc 0
Source voltage in 0 = Vs
Rfilt resistor in adc = R
Cfilt capacitor adc 0 = C
`,
  },
  {
    id: "transimpedance",
    title: "Op-amp transimpedance stage",
    summary: "A photodiode into an ideal op-amp with a feedback R and C: the output as a source.",
    netlist: `# photodiode transimpedance stage
ground 0
port out 0
Photo current 0 n = Iph
Cdiode capacitor n 0 = Cd
Tia opamp 0 n -> out
Rfb resistor n out = Rf
Cfb capacitor n out = Cf
`,
  },
];

export const BLANK_NETWORK = `# a new network: one element a line, then Solve
ground 0
port out 0
`;
