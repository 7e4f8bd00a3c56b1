import { FIX_COLUMN_NAMES, type FixColumnName, hasColumnValues, type Track } from '@leadline/core';

/** A track as stored: the fix columns that hold values, back to back as little-endian float64. */
export interface EncodedTrack {
  role: Track['role'];
  fixCount: number;
  meta: { id: string; name?: string; provenance: Track['provenance'] };
  segmentStarts: number[];
  sourceLines: Buffer;
  columnNames: FixColumnName[];
  fixes: Buffer;
}

const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

function bytesOf(array: Float64Array | Uint32Array): Buffer {
  return Buffer.from(array.buffer, array.byteOffset, array.byteLength);
}

/** Packs a track for `dive_tracks`; columns the track never filled are left out. */
export function encodeTrack(track: Track): EncodedTrack {
  if (!LITTLE_ENDIAN) throw new Error('the track codec expects a little-endian machine');
  const columnNames = FIX_COLUMN_NAMES.filter(
    (name) => name === 'timeMs' || name === 'latDeg' || name === 'lonDeg' || hasColumnValues(track.columns[name]),
  );
  const fixes = Buffer.concat(columnNames.map((name) => bytesOf(track.columns[name].subarray(0, track.length))));
  return {
    role: track.role,
    fixCount: track.length,
    meta: {
      id: track.id,
      ...(track.name === undefined ? {} : { name: track.name }),
      provenance: track.provenance,
    },
    segmentStarts: track.segmentStarts,
    sourceLines: bytesOf(track.sourceLines.subarray(0, track.length)),
    columnNames,
    fixes,
  };
}

/** Unpacks a stored track; missing columns come back as `NaN`. */
export function decodeTrack(stored: EncodedTrack): Track {
  const n = stored.fixCount;
  // Copy once into aligned memory: a Buffer from the driver may sit at any byte offset.
  const aligned = new ArrayBuffer(stored.fixes.byteLength);
  new Uint8Array(aligned).set(stored.fixes);
  const columns = {} as Track['columns'];
  for (const name of FIX_COLUMN_NAMES) {
    const at = stored.columnNames.indexOf(name);
    columns[name] = at < 0 ? new Float64Array(n).fill(Number.NaN) : new Float64Array(aligned, at * n * 8, n);
  }
  const lines = new ArrayBuffer(stored.sourceLines.byteLength);
  new Uint8Array(lines).set(stored.sourceLines);
  return {
    id: stored.meta.id,
    role: stored.role,
    ...(stored.meta.name === undefined ? {} : { name: stored.meta.name }),
    length: n,
    columns,
    segmentStarts: [...stored.segmentStarts],
    sourceLines: new Uint32Array(lines, 0, n),
    provenance: stored.meta.provenance,
  };
}
