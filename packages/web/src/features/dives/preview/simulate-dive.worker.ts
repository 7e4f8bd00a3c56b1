import { createSimulatedDive, transferablesOf } from './create-simulated-dive';

/** What the page asks the worker for. */
export interface SimulateDiveRequest {
  fixCount: number;
  seed: number;
}

// Simulating and auditing tens of thousands of fixes takes seconds; off the main thread the page stays usable.
globalThis.onmessage = (event: MessageEvent<SimulateDiveRequest>) => {
  try {
    const dive = createSimulatedDive(event.data);
    globalThis.postMessage({ ok: true, dive }, { transfer: transferablesOf(dive) });
  } catch (error) {
    globalThis.postMessage({ ok: false, message: error instanceof Error ? error.message : String(error) });
  }
};
