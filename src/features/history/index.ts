export { useRevisionComparison } from "./api/get-revision-comparison";
