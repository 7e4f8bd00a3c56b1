/** Columns of the dive table a person may hide; the dive's name and the selection always show. */
export const OPTIONAL_COLUMNS = [
  { id: 'start', label: 'Start (UTC)' },
  { id: 'duration', label: 'Duration' },
  { id: 'maxDepth', label: 'Max depth' },
  { id: 'distance', label: 'Distance' },
  { id: 'fixes', label: 'Fixes' },
  { id: 'verdict', label: 'Verdict' },
  { id: 'profile', label: 'Audit profile' },
  { id: 'log', label: 'Log file' },
] as const;

/** Hidden by default, to keep the table readable on a tablet. */
const HIDDEN_BY_DEFAULT = new Set(['profile', 'log']);

const STORAGE_KEY = 'leadline.diveTable.columns';

/** Which columns show (`false` hides), remembered per browser; unknown keys and bad JSON are ignored. */
export function readColumnChoice(storage: Pick<Storage, 'getItem'> | undefined): Record<string, boolean> {
  const choice: Record<string, boolean> = {};
  for (const column of OPTIONAL_COLUMNS) choice[column.id] = !HIDDEN_BY_DEFAULT.has(column.id);
  let stored: unknown;
  try {
    stored = JSON.parse(storage?.getItem(STORAGE_KEY) ?? 'null');
  } catch {
    stored = null;
  }
  if (typeof stored === 'object' && stored !== null)
    for (const column of OPTIONAL_COLUMNS) {
      const value = (stored as Record<string, unknown>)[column.id];
      if (typeof value === 'boolean') choice[column.id] = value;
    }
  return choice;
}

/** Remembers the column choice; a browser that refuses storage keeps it until the page reloads. */
export function writeColumnChoice(
  storage: Pick<Storage, 'setItem'> | undefined,
  choice: Record<string, boolean>,
): void {
  try {
    storage?.setItem(STORAGE_KEY, JSON.stringify(choice));
  } catch {
    // Private windows may refuse storage.
  }
}
