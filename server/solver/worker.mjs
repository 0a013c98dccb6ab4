// Entry of a solver thread. Plain JavaScript, so the thread starts the same under `tsx`, vitest and
// `npm start`; tsx then compiles the TypeScript task and the engine for this thread alone.
import { tsImport } from "tsx/esm/api";

const task = await tsImport("./solve-task.ts", import.meta.url);

export default task.runSolveTask;
