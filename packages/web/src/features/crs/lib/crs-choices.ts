/** A choice the CRS picker offers: the value it sets, a name and a line saying what it is. */
export interface CrsChoice {
  value: string;
  name: string;
  detail: string;
}

/** WGS 84 latitude and longitude: what GPX, GeoJSON and KML always carry. */
export const WGS84_CHOICE: CrsChoice = {
  value: 'EPSG:4326',
  name: 'WGS 84',
  detail: 'EPSG:4326 · latitude and longitude in degrees',
};

/** UTM on WGS 84 in the zone the server picks from each dive's positions. */
export const UTM_CHOICE: CrsChoice = {
  value: 'utm',
  name: 'UTM, zone from the data',
  detail: "WGS 84 / UTM in the zone of each dive's centre",
};

/** The choices offered before anything is typed. */
export const QUICK_CHOICES: readonly CrsChoice[] = [WGS84_CHOICE, UTM_CHOICE];

/** `EPSG:25832` for `25832`, `epsg:25832` or `EPSG: 25832`; `utm` for any spelling of it; else `undefined`. */
export function normaliseCrsValue(text: string): string | undefined {
  const trimmed = text.trim();
  if (/^utm$/i.test(trimmed)) return 'utm';
  const code = /^(?:epsg\s*:\s*)?(\d{1,6})$/i.exec(trimmed)?.[1];
  return code === undefined ? undefined : `EPSG:${code}`;
}

/** Formats an area-of-use box for a line of text: `3.0°E–12.0°E, 46.0°N–84.0°N`. */
export function formatArea(area: { west: number; south: number; east: number; north: number }): string {
  const lon = (v: number) => `${Math.abs(v).toFixed(1)}°${v < 0 ? 'W' : 'E'}`;
  const lat = (v: number) => `${Math.abs(v).toFixed(1)}°${v < 0 ? 'S' : 'N'}`;
  return `${lon(area.west)}–${lon(area.east)}, ${lat(area.south)}–${lat(area.north)}`;
}
