export { useValueSets } from "./api/get-value-sets";
export { ValueSetsBar } from "./components/value-sets-bar";
export { valueSetsCsv, valueSetsLatex } from "./lib/export";
