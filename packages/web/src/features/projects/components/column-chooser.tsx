import { OPTIONAL_COLUMNS } from '../lib/column-choice';

/** A disclosure of checkboxes, one per optional column of the dive table. */
export function ColumnChooser({
  choice,
  onChange,
}: {
  choice: Record<string, boolean>;
  onChange: (choice: Record<string, boolean>) => void;
}) {
  const shown = OPTIONAL_COLUMNS.filter((c) => choice[c.id] !== false).length;
  return (
    <details className="relative">
      <summary className="inline-flex min-h-9 cursor-pointer items-center rounded-md border border-abyss/30 bg-white px-3 text-sm font-medium hover:bg-foam focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp">
        Columns ({shown} of {OPTIONAL_COLUMNS.length})
      </summary>
      <fieldset className="absolute right-0 z-10 mt-1 flex w-56 flex-col gap-1.5 rounded-md border border-abyss/20 bg-white p-3 shadow-lg">
        <legend className="sr-only">Columns to show</legend>
        {OPTIONAL_COLUMNS.map((column) => (
          <label key={column.id} className="inline-flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              className="size-4 accent-kelp"
              checked={choice[column.id] !== false}
              onChange={(e) => onChange({ ...choice, [column.id]: e.target.checked })}
            />
            {column.label}
          </label>
        ))}
      </fieldset>
    </details>
  );
}
