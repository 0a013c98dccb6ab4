export { ApiReference } from "./components/api-reference";
