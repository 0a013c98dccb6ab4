// Entry of a solver or reader thread. Plain JavaScript, so the thread starts the same under `tsx`,
// vitest and `npm start`; tsx then compiles the TypeScript tasks and the engine for this thread alone.
import { tsImport } from "tsx/esm/api";

const solve = await tsImport("./solve-task.ts", import.meta.url);
const read = await tsImport("./read-task.ts", import.meta.url);

export default solve.runSolveTask;
export const runReadTask = read.runReadTask;
