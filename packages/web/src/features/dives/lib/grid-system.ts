import { createReprojection, type LocalFrame, type ResolvedCrs } from '@leadline/core';
import type { GridCrsChoice } from '../types';

/** A coordinate system the plan grid is drawn and labelled in, mapped to and from the local frame. */
export interface GridSystem {
  id: string;
  /** Shown in the picker and the legend. */
  label: string;
  /** Names of the two axes for the labels. */
  xName: string;
  yName: string;
  /** Local metres → grid coordinates (in place allowed). */
  toGrid(eastM: Float64Array, northM: Float64Array): { x: Float64Array; y: Float64Array };
  /** Grid coordinates → local metres. */
  fromGrid(x: Float64Array, y: Float64Array): { eastM: Float64Array; northM: Float64Array };
  /** Text for one grid value. */
  format(value: number, step: number): string;
}

/** The local east-north frame itself: metres from the dive's first fix. */
export function createLocalGrid(): GridSystem {
  return {
    id: 'local',
    label: 'Local metres (from the first fix)',
    xName: 'm E',
    yName: 'm N',
    toGrid: (eastM, northM) => ({ x: eastM, y: northM }),
    fromGrid: (x, y) => ({ eastM: x, northM: y }),
    format: (value, step) => formatNumber(value, step),
  };
}

/** Digits grouped by thin spaces, decimals only as fine as the step needs. */
export function formatNumber(value: number, step: number): string {
  const decimals = step >= 1 ? 0 : Math.min(3, Math.ceil(-Math.log10(step)));
  const fixed = Math.abs(value).toFixed(decimals);
  const [whole = '0', fraction] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009');
  const sign = value < 0 && Number(fixed) !== 0 ? '\u2212' : '';
  return `${sign}${grouped}${fraction === undefined ? '' : `.${fraction}`}`;
}

/**
 * The WGS 84 UTM zone of a position, with the published exceptions for south-west Norway (zone 32V
 * widened) and Svalbard (zones 31X–37X); from memory of the UTM zone definition.
 */
export function utmZoneOf(latDeg: number, lonDeg: number): { zone: number; south: boolean } {
  const lon = ((((lonDeg + 180) % 360) + 360) % 360) - 180;
  let zone = Math.floor((lon + 180) / 6) + 1;
  if (latDeg >= 56 && latDeg < 64 && lon >= 3 && lon < 12) zone = 32;
  if (latDeg >= 72 && latDeg < 84) {
    if (lon >= 0 && lon < 9) zone = 31;
    else if (lon >= 9 && lon < 21) zone = 33;
    else if (lon >= 21 && lon < 33) zone = 35;
    else if (lon >= 33 && lon < 42) zone = 37;
  }
  return { zone: Math.min(60, Math.max(1, zone)), south: latDeg < 0 };
}

/** The UTM CRS (WGS 84) that covers a position, as a grid choice. */
export function utmChoiceFor(latDeg: number, lonDeg: number): GridCrsChoice {
  const { zone, south } = utmZoneOf(latDeg, lonDeg);
  return {
    code: `EPSG:${(south ? 32700 : 32600) + zone}`,
    name: `WGS 84 / UTM zone ${zone}${south ? 'S' : 'N'}`,
    proj4: `+proj=utm +zone=${zone}${south ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`,
  };
}

/**
 * A projected CRS's easting/northing grid over the local frame, through core's reprojection.
 * Throws when proj4 cannot read the definition.
 */
export function createProjectedGrid(choice: GridCrsChoice, frame: LocalFrame): GridSystem {
  const crs: ResolvedCrs = {
    code: choice.code,
    name: choice.name,
    kind: 'projected',
    proj4: choice.proj4,
    method: 'proj4',
    accuracyM: undefined,
    note: `${choice.code} ${choice.name}`,
    areaOfUse: undefined,
    unit: 'metre',
  };
  const reprojection = createReprojection(crs);
  return {
    id: choice.code,
    label: `${choice.code} ${choice.name}`,
    xName: 'E',
    yName: 'N',
    toGrid(eastM, northM) {
      const lat = new Float64Array(eastM.length);
      const lon = new Float64Array(eastM.length);
      for (let i = 0; i < eastM.length; i++) {
        const p = frame.inverse(eastM[i] as number, northM[i] as number);
        lat[i] = p.latDeg;
        lon[i] = p.lonDeg;
      }
      const { x, y } = reprojection.forward(lon, lat);
      return { x, y };
    },
    fromGrid(x, y) {
      const geographic = reprojection.inverse(x, y);
      return frame.forwardColumns(geographic.y, geographic.x);
    },
    format: (value, step) => formatNumber(value, step),
  };
}
