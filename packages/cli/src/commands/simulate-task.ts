import { type PlannedDive, simulatePlannedDive } from '@leadline/core';

/** One dive simulated on a worker: its files' names and texts, and counts. */
export interface DiveTaskResult {
  files: Array<{ name: string; text: string }>;
  vehicleFixes: number;
  surfaceFixes: number;
}

/** Worker task: simulates one planned dive and returns its log files and truth file. */
export function simulateDiveTask(planned: PlannedDive): DiveTaskResult {
  const result = simulatePlannedDive(planned);
  return {
    files: [...result.files.map((f) => ({ name: f.name, text: f.text })), result.truthFile],
    vehicleFixes: result.dive.vehicleLog.length,
    surfaceFixes: result.dive.surfaceLog.length,
  };
}
