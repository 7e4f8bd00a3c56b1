import { type DragEvent, useId, useState } from 'react';
import { cn } from '../../../lib/cn';

/** Props of the drop zone. */
export interface UploadDropZoneProps {
  onFiles: (files: File[]) => void;
  disabled?: boolean;
}

/** Drop log files here, or choose them with the (keyboard-reachable) file input. */
export function UploadDropZone({ onFiles, disabled = false }: UploadDropZoneProps) {
  const inputId = useId();
  const hintId = useId();
  const [dragging, setDragging] = useState(false);
  const take = (list: FileList | null) => {
    const files = list === null ? [] : Array.from(list);
    if (files.length > 0) onFiles(files);
  };
  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    setDragging(false);
    if (!disabled) take(event.dataTransfer.files);
  };
  return (
    <section
      aria-label="Drop log files"
      data-testid="upload-drop-zone"
      onDragEnter={(event) => {
        event.preventDefault();
        if (!disabled) setDragging(true);
      }}
      onDragOver={(event) => event.preventDefault()}
      onDragLeave={() => setDragging(false)}
      onDrop={onDrop}
      className={cn(
        'flex flex-col items-center gap-3 rounded-xl border-2 border-dashed px-6 py-10 text-center transition-colors',
        dragging ? 'border-kelp bg-foam' : 'border-abyss/30 bg-white',
        disabled && 'opacity-60',
      )}
    >
      <p className="text-lg font-medium">Drop log files here</p>
      <p id={hintId} className="text-sm text-abyss-soft">
        CSV, TSV, GPX, NMEA, GeoJSON or KML; many at once. The original bytes are kept as they are.
      </p>
      <input
        id={inputId}
        type="file"
        multiple
        disabled={disabled}
        aria-describedby={hintId}
        className="peer sr-only"
        onChange={(event) => {
          take(event.target.files);
          event.target.value = '';
        }}
      />
      <label
        htmlFor={inputId}
        className={cn(
          'inline-flex min-h-10 cursor-pointer items-center rounded-md bg-abyss px-4 text-sm font-medium text-foam hover:bg-abyss-soft',
          'peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-kelp',
          disabled && 'cursor-not-allowed',
        )}
      >
        Choose log files
      </label>
    </section>
  );
}
