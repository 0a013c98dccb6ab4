// The client's door into the engine's frequency and design-solve modules (pure, shared with the server).
export {
  
  frequencyLimit,
  frequencyResponse,
  frequencySpan,
  logFrequencies,
  numericCoefficientsInS,
  openCircuitTransfer,
  polesAndZeros,
  
  type OpenCircuitTransfer,
  
  type SRoot,
} from "../../shared/engine/circuit/frequency";
export { designSolve, type DesignSolveAnswer } from "../../shared/engine/circuit/design-solve";
export { independentSourcesOf } from "../../shared/engine/index";
