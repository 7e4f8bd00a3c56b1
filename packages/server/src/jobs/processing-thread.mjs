// Worker-thread entry of the processing pool (jobs/processing-threads.ts): lowers this thread's
// scheduling priority, registers the TypeScript loader in this thread, then runs the named
// computation of services/processing-compute.ts.
import { setPriority } from 'node:os';
import { register } from 'tsx/esm/api';

// On Linux a nice value belongs to one thread: where both want the same core, background processing
// gets about half the share of the event loop that answers requests (CFS weights 526 and 1024). Mild on
// purpose: on a machine busy with other work a higher value would starve processing altogether.
try {
  // Elsewhere the nice value is the whole process's: leave it alone there.
  if (process.platform === 'linux') setPriority(3);
} catch {
  // Not allowed here (some containers): run at the process's priority.
}
register();
const compute = await import('../services/processing-compute.ts');

export default function runComputation({ name, payload }) {
  return compute[name](payload);
}
