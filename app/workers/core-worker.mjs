// The worker entry in the source tree (tests and `react-router dev`): Node 20's
// worker threads load no TypeScript, so tsx is registered before the entry is
// imported. The build has its own, compiled entry (build/server/core-worker.js).
import { register } from "tsx/esm/api";

register();
const { default: serve } = await import("./core-worker.ts");

export default serve;
