// Worker-thread entry of the processing pool (jobs/processing-threads.ts): registers the TypeScript
// loader in this thread, then runs the named computation of services/processing-compute.ts.
import { register } from 'tsx/esm/api';

register();
const compute = await import('../services/processing-compute.ts');

export default function runComputation({ name, payload }) {
  return compute[name](payload);
}
