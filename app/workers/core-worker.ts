// The worker thread's entry: the pool posts { task, input } and gets back the
// task's output with the time the work took (what the pool's queue estimate
// is made of). Big buffers in the output (answer bytes, table columns) are
// moved to the request's thread rather than copied.
import { move, transferableSymbol, valueSymbol } from "piscina";
import { CORE_TASKS, type CoreTaskInput, type CoreTaskName, type CoreTaskOutput } from "./core-tasks";

export type WorkerRequest<Name extends CoreTaskName = CoreTaskName> = { task: Name; input: CoreTaskInput<Name> };
export type WorkerAnswer<Name extends CoreTaskName = CoreTaskName> = { output: CoreTaskOutput<Name>; workMs: number };

/** Smaller buffers are copied: moving costs about as much, and small ones may share Node's buffer pool, which cannot be moved. */
const MOVE_FROM_BYTES = 64 * 1024;

/** The big buffers among the output's fields, a few objects deep (arrays of objects, such as frames, hold none). */
function bigBuffers(value: unknown, found: Set<ArrayBuffer>, depth = 0): Set<ArrayBuffer> {
  if (ArrayBuffer.isView(value)) {
    if (value.buffer instanceof ArrayBuffer && value.buffer.byteLength >= MOVE_FROM_BYTES) found.add(value.buffer);
  } else if (value !== null && typeof value === "object" && !Array.isArray(value) && depth < 4) {
    for (const field of Object.values(value)) bigBuffers(field, found, depth + 1);
  }
  return found;
}

export default function serve({ task, input }: WorkerRequest) {
  const started = performance.now();
  const output = (CORE_TASKS[task] as (input: unknown) => unknown)(input);
  const answer = { output, workMs: performance.now() - started };
  return move({ [transferableSymbol]: [...bigBuffers(output, new Set())], [valueSymbol]: answer });
}
