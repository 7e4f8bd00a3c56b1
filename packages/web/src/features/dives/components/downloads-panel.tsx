import { type ReactNode, useId, useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { describeFailure } from '../../../components/ui/describe-failure';
import { ApiError } from '../../../lib/api-client';
import {
  fileNameFromDisposition,
  originalDownloadUrl,
  REPORT_FORMATS,
  reportDownloadUrl,
  TRACK_FORMATS,
  type TrackFormat,
  type TrackVariant,
  trackDownloadUrl,
} from '../lib/download-links';
import type { DiveArchiveRef } from '../types';

/** What a CRS picker gets from the downloads panel. */
export interface CrsPickerSlotProps {
  value: string;
  onChange: (value: string) => void;
  label: string;
  near?: { latDeg: number; lonDeg: number } | undefined;
}

/** A plain labelled text field, used when no CRS picker is given. */
export function PlainCrsInput({ value, onChange, label }: CrsPickerSlotProps) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <input
        id={id}
        value={value}
        onChange={(event) => onChange(event.target.value)}
        placeholder="EPSG:25832 or utm"
        className="min-h-10 rounded-md border border-abyss/30 bg-white px-3 focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp"
      />
    </div>
  );
}

/** Props of the downloads panel. */
export interface DownloadsPanelProps {
  diveId: string;
  archive: DiveArchiveRef;
  /** Whether a re-solved track can be written (the latest run or the project has a setup). */
  resolvedAvailable: boolean;
  /** Where the dive is, so the CRS picker can offer the systems that cover it. */
  near?: { latDeg: number; lonDeg: number } | undefined;
  /** The CRS picker to use; a plain text field by default. */
  renderCrsPicker?: (props: CrsPickerSlotProps) => ReactNode;
}

const VARIANTS: readonly { value: TrackVariant; label: string; hint: string }[] = [
  { value: 'raw', label: 'As logged', hint: 'the positions in the log' },
  { value: 'cleaned', label: 'Cleaned', hint: 'smoothed, with the latest audit’s outliers set aside' },
  { value: 'resolved', label: 'Re-solved', hint: 'recomputed with the latest run’s setup (or the project’s)' },
];

/** Fetches a download and hands it to the browser, so a refusal (422) can be shown here instead of as a file. */
async function saveDownload(url: string): Promise<string> {
  const response = await fetch(url, { credentials: 'same-origin' });
  if (!response.ok) {
    const text = await response.text();
    let error: { code: string; message: string } = {
      code: 'http-error',
      message: `The server answered ${response.status}.`,
    };
    try {
      const body = JSON.parse(text) as { error?: { code: string; message: string } };
      if (body.error) error = body.error;
    } catch {
      // Not JSON: keep the plain message.
    }
    throw new ApiError(response.status, error);
  }
  const blob = await response.blob();
  const fileName = fileNameFromDisposition(response.headers.get('Content-Disposition')) ?? 'track';
  const href = URL.createObjectURL(blob);
  const anchor = document.createElement('a');
  anchor.href = href;
  anchor.download = fileName;
  document.body.append(anchor);
  anchor.click();
  anchor.remove();
  setTimeout(() => URL.revokeObjectURL(href), 60_000);
  return fileName;
}

const LINK =
  'font-medium text-kelp underline underline-offset-2 hover:text-abyss focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp';

/** The dive's track in a chosen format, variant and CRS; its audit reports; the original file. */
export function DownloadsPanel({
  diveId,
  archive,
  resolvedAvailable,
  near,
  renderCrsPicker = (props) => <PlainCrsInput {...props} />,
}: DownloadsPanelProps) {
  const id = useId();
  const [format, setFormat] = useState<TrackFormat>('gpx');
  const [variant, setVariant] = useState<TrackVariant>('raw');
  const [crs, setCrs] = useState('EPSG:4326');
  const [state, setState] = useState<{ busy: boolean; error?: unknown; saved?: string }>({ busy: false });
  const download = async () => {
    setState({ busy: true });
    try {
      const url = trackDownloadUrl(archive, diveId, {
        format,
        variant,
        ...(format === 'csv' && crs !== 'EPSG:4326' ? { crs } : {}),
      });
      setState({ busy: false, saved: await saveDownload(url) });
    } catch (error) {
      setState({ busy: false, error });
    }
  };
  return (
    <section
      aria-labelledby={`${id}-heading`}
      className="flex flex-col gap-4 rounded-lg border border-abyss/15 bg-white p-4"
    >
      <h2 id={`${id}-heading`} className="text-lg font-semibold">
        Downloads
      </h2>
      <div className="flex flex-col gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-format`} className="font-medium">
            Track format
          </label>
          <select
            id={`${id}-format`}
            value={format}
            onChange={(event) => setFormat(event.target.value as TrackFormat)}
            className="min-h-10 rounded-md border border-abyss/30 bg-white px-2 focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp"
          >
            {TRACK_FORMATS.map((f) => (
              <option key={f.value} value={f.value}>
                {f.label}
              </option>
            ))}
          </select>
        </div>
        <fieldset className="flex flex-col gap-1">
          <legend className="font-medium">Positions</legend>
          {VARIANTS.map((v) => {
            const disabled = v.value === 'resolved' && !resolvedAvailable;
            return (
              <label key={v.value} className={`flex items-start gap-2 text-sm ${disabled ? 'text-abyss-soft' : ''}`}>
                <input
                  type="radio"
                  name={`${id}-variant`}
                  value={v.value}
                  checked={variant === v.value}
                  disabled={disabled}
                  onChange={() => setVariant(v.value)}
                  className="mt-1 accent-kelp"
                />
                <span>
                  <span className="font-medium">{v.label}</span>: {v.hint}
                  {disabled ? ' — needs a re-solve setup: reprocess with one, or give the project a default setup' : ''}
                </span>
              </label>
            );
          })}
        </fieldset>
        {format === 'csv' ? (
          renderCrsPicker({ value: crs, onChange: setCrs, label: 'Coordinates in (CSV)', near })
        ) : (
          <p className="text-sm text-abyss-soft">
            {format.toUpperCase()} holds WGS 84 longitude and latitude by definition; choose CSV for another CRS.
          </p>
        )}
        <div className="flex flex-wrap items-center gap-3">
          <button
            type="button"
            className={buttonStyles('primary', 'min-h-10')}
            onClick={download}
            disabled={state.busy}
          >
            {state.busy ? 'Preparing…' : 'Download the track'}
          </button>
          <p role="status" className="text-sm text-abyss-soft">
            {state.saved ? `Saved ${state.saved}.` : ''}
          </p>
        </div>
        {state.error ? (
          <div role="alert" className="flex flex-wrap items-center gap-2 text-sm text-[#7d1a14]">
            The track could not be written: {describeFailure(state.error)}
            <button type="button" className={buttonStyles('secondary')} onClick={download}>
              Try again
            </button>
          </div>
        ) : null}
      </div>
      <div className="flex flex-col gap-1 border-t border-abyss/10 pt-3 text-sm">
        <p className="font-medium">Audit report of the latest run</p>
        <p className="flex flex-wrap gap-3">
          {REPORT_FORMATS.map((r) => (
            <a key={r.value} href={reportDownloadUrl(archive, diveId, r.value)} download className={LINK}>
              {r.label}
            </a>
          ))}
        </p>
      </div>
      <div className="flex flex-col gap-1 border-t border-abyss/10 pt-3 text-sm">
        <p className="font-medium">Original file</p>
        <p>
          <a href={originalDownloadUrl(archive)} download className={LINK}>
            {archive.logFileName}
          </a>{' '}
          <span className="text-abyss-soft">(byte for byte as uploaded)</span>
        </p>
      </div>
    </section>
  );
}
