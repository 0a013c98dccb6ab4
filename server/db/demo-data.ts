// The demo scenario: a small sensor-interface lab. Invented data, for the demo only.
export const demoUser = { id: "demo-user", email: "demo@portfold.local", name: "Dana Demo" };

export const demoTeam = { id: "00000000-0000-4000-8000-0000000000d1", name: "Sensor interface lab" };

export const demoNetworks = [
  {
    slug: "strain-gauge-buffer",
    title: "Strain-gauge buffer",
    description: "Finite-gain amplifier wired as a follower behind the bridge; what does the ADC input see?",
    circuit: {
      ground: "0",
      port: { plus: "out", minus: "0" },
      elements: [
        { name: "Vbridge", kind: "vsource", nodes: ["in", "0"], value: "Vs" },
        { name: "Amp", kind: "vcvs", nodes: ["x", "0"], control: { nodes: ["in", "out"] }, value: "A" },
        { name: "Rout", kind: "resistor", nodes: ["x", "out"], value: "Ro" },
      ],
    },
  },
];
