import { type ReactNode, useId, useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { ARCHIVE_FORMATS, type ArchiveFormat, archiveUrl, type DiveListState } from '../lib/dive-list-query';

/**
 * Downloads dives as one zip of track files: the selected ones, or every dive the filters match.
 * The CRS applies to CSV only (GPX, GeoJSON and KML are WGS 84 by their standards); the picker
 * comes from the page (`renderCrsPicker`), so this feature does not reach into another.
 */
export function ArchiveDownload({
  organisationId,
  projectId,
  selectedIds,
  matchingCount,
  state,
  crs,
  renderCrsPicker,
  onClearSelection,
}: {
  organisationId: string;
  projectId: string;
  selectedIds: string[];
  /** How many dives the filters match (the zip of everything holds at most 1 000). */
  matchingCount: number;
  state: DiveListState;
  crs: string;
  renderCrsPicker: (options: { disabled: boolean; description: string }) => ReactNode;
  onClearSelection: () => void;
}) {
  const formatId = useId();
  const [format, setFormat] = useState<ArchiveFormat>('gpx');
  const csv = format === 'csv';
  // The server takes at most 300 ids in one address.
  const tooMany = selectedIds.length > 300;
  const link = (ids?: string[]) =>
    archiveUrl({ organisationId, projectId, format, crs, ...(ids ? { ids } : { state }) });

  return (
    <section
      aria-labelledby={`${formatId}-title`}
      className="flex flex-col gap-3 rounded-lg border border-abyss/15 bg-white p-4"
    >
      <h2 id={`${formatId}-title`} className="font-semibold">
        Download as one zip
      </h2>
      <div className="grid gap-3 sm:grid-cols-[10rem_minmax(0,1fr)]">
        <div className="flex flex-col gap-1">
          <label htmlFor={formatId} className="text-sm font-medium">
            Format
          </label>
          <select
            id={formatId}
            value={format}
            onChange={(e) => setFormat(e.target.value as ArchiveFormat)}
            className="min-h-9 rounded-md border border-abyss/30 bg-white px-2 text-sm focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp"
          >
            {ARCHIVE_FORMATS.map((f) => (
              <option key={f.value} value={f.value}>
                {f.label}
              </option>
            ))}
          </select>
        </div>
        {renderCrsPicker({
          disabled: !csv,
          description: csv
            ? 'CSV keeps latitude and longitude and adds easting and northing in this CRS; crs-notes.txt in the zip says how each file was converted.'
            : 'GPX, GeoJSON and KML are WGS 84 latitude and longitude by their standards; choose CSV for another CRS.',
        })}
      </div>
      <div className="flex flex-wrap items-center gap-2">
        {selectedIds.length > 0 && !tooMany ? (
          <a href={link(selectedIds)} download className={buttonStyles('primary')}>
            Download selected ({selectedIds.length})
          </a>
        ) : (
          <button type="button" disabled className={buttonStyles('primary')}>
            Download selected ({selectedIds.length})
          </button>
        )}
        {matchingCount > 0 ? (
          <a href={link()} download className={buttonStyles('secondary')}>
            Download all {Math.min(matchingCount, 1000)} matching
          </a>
        ) : null}
        {selectedIds.length > 0 ? (
          <button type="button" className={buttonStyles('quiet')} onClick={onClearSelection}>
            Clear selection
          </button>
        ) : null}
      </div>
      {tooMany ? (
        <p role="alert" className="text-sm text-[#7d1a14]">
          At most 300 dives go in one selected zip; narrow the selection or download by filter instead.
        </p>
      ) : null}
      {matchingCount > 1000 ? (
        <p className="text-sm text-abyss-soft">The zip of matching dives holds the first 1 000 in this order.</p>
      ) : null}
    </section>
  );
}
