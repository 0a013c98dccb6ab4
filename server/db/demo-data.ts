// The demo scenario: a small sensor-interface lab. Invented data, for the demo only.
export const demoUser = { id: "demo-user", email: "demo@portfold.local", name: "Dana Demo" };
export const demoReviewer = { id: "demo-reviewer", email: "reviewer@portfold.local", name: "Ravi Reviewer" };

export const demoTeam = { id: "00000000-0000-4000-8000-0000000000d1", name: "Sensor interface lab" };

import { createHash } from "node:crypto";

// A fixed share token so the demo link survives re-seeding; demo data only, never seeded in production.
export const demoShareToken = createHash("sha256").update("portfold demo share link: strain-gauge buffer, revision 1").digest("base64url");

export const demoNetworks = [
  {
    slug: "strain-gauge-buffer",
    title: "Strain-gauge buffer",
    description: "Finite-gain amplifier wired as a follower behind the bridge; what does the ADC input see?",
    circuit: {
      ground: "0",
      port: { plus: "out", minus: "0" },
      elements: [
        { name: "Vbridge", kind: "voltage", nodes: ["in", "0"], value: "Vs" },
        { name: "Amp", kind: "voltage", nodes: ["x", "0"], value: "A * across(in, out)" },
        { name: "Rout", kind: "resistor", nodes: ["x", "out"], value: "Ro" },
      ],
    },
  },
  {
    slug: "transistor-line-driver",
    title: "Transistor line driver",
    description: "Emitter follower driving the sensor line, small-signal (hybrid-pi); how stiff is the line end?",
    circuit: {
      ground: "0",
      port: { plus: "e", minus: "0" },
      elements: [
        { name: "Signal", kind: "voltage", nodes: ["sig", "0"], value: "Vs" },
        { name: "SourceRes", kind: "resistor", nodes: ["sig", "b"], value: "Rs" },
        { name: "BaseEmitter", kind: "resistor", nodes: ["b", "e"], value: "r_pi" },
        { name: "Transcond", kind: "current", nodes: ["0", "e"], value: "gm * across(b, e)" },
        { name: "Output", kind: "resistor", nodes: ["e", "0"], value: "r_o" },
        { name: "EmitterLoad", kind: "resistor", nodes: ["e", "0"], value: "RE" },
      ],
    },
  },
  {
    slug: "bridge-with-current-sense",
    title: "Bridge with current-controlled compensation",
    description: "Gauge bridge where a source proportional to one arm's current feeds the gauge node; the differential output as a source.",
    circuit: {
      ground: "0",
      port: { plus: "a", minus: "b" },
      elements: [
        { name: "Excite", kind: "voltage", nodes: ["top", "0"], value: "Vx" },
        { name: "ArmA", kind: "resistor", nodes: ["top", "a"], value: "Ra" },
        { name: "ArmB", kind: "resistor", nodes: ["a", "0"], value: "Rb" },
        { name: "ArmC", kind: "resistor", nodes: ["top", "b"], value: "Rc" },
        { name: "Gauge", kind: "resistor", nodes: ["b", "0"], value: "Rg" },
        { name: "Sense", kind: "current", nodes: ["0", "b"], value: "beta * through(ArmA)" },
      ],
    },
  },
];

// Review notes on the bridge: a reviewer's question with the author's answer, and a verdict;
// each anchored to the step with that id, or else the first step of that kind, should the engine rename ids.
export const demoReview = {
  slug: "bridge-with-current-sense",
  thread: {
    stepId: "vth.kcl.b",
    stepKind: "kcl",
    question: "The sense source injects into the gauge node: should its gain beta carry a sign for the sensing direction?",
    answer: "Positive beta means current into node b; the sign convention is in the element's description.",
  },
  note: { stepId: "result.thevenin", stepKind: "equivalent", body: "Please add the Rth limit for beta → 0 so we can compare with the plain bridge." },
  verdict: "needs_changes" as const,
  verdictNote: "Add the beta → 0 limit and state the sign of beta before this goes to layout.",
};
