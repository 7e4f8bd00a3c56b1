// Worker-thread entry of the processing pool (jobs/processing-threads.ts): lowers this thread's
// scheduling priority, registers the TypeScript loader in this thread, then runs the named
// computation of services/processing-compute.ts.
import { setPriority } from 'node:os';
import { register } from 'tsx/esm/api';

// On Linux a nice value belongs to one thread: background processing yields the CPU to the event
// loop that answers requests (and to the loading of its own code at start-up).
try {
  setPriority(10);
} catch {
  // Not allowed here (some containers): run at the process's priority.
}
register();
const compute = await import('../services/processing-compute.ts');

export default function runComputation({ name, payload }) {
  return compute[name](payload);
}
