export { useComments } from "./api/get-comments";
export { ReviewPanel } from "./components/review-panel";
export { ReviewQueueTable } from "./components/review-queue-table";
export { StepComments } from "./components/step-comments";
export type { ReviewContext } from "./components/step-comments";
export { VerdictMark } from "./components/verdict-mark";
