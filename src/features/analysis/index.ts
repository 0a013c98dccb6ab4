export { AnalysisColumn } from "./components/analysis-column";
