// The engine's own types that appear inside API answers (a circuit, its elements, diagnostics,
// one result's printed forms). Type-only: importing it loads no engine code.
export type { CheckDetail, Diagnostic, ExactExpression, NetworkInput, ResultName } from "../../shared/engine/types";
