export { useRevision } from "./api/get-revision";
export { useRevisions } from "./api/get-revisions";
export { useSolveNetwork } from "./api/solve-network";
export type { SolveProgress } from "./api/solve-network";
export { Ledger } from "./components/ledger";
export { ResultCard } from "./components/result-card";
