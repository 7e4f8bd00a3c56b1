// Worker-thread entry when the command line runs from TypeScript source (tests): registers tsx's
// loader in this thread, then hands each task to src/worker-entry.ts. The bundled command line uses
// dist/worker.mjs instead.
import { register } from 'tsx/esm/api';

register();
const { default: runTask } = await import('../src/worker-entry.ts');
export default runTask;
