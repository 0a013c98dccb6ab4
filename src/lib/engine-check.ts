// The engine's full pre-solve check, for live diagnostics while typing. Loaded lazily: it carries
// the value parser.
export { checkNetworkInput } from "../../shared/engine/index";
