/** Query keys of the CRS feature. */
export const crsKeys = {
  all: ['crs'] as const,
  searches: () => [...crsKeys.all, 'search'] as const,
  search: (text: string) => [...crsKeys.searches(), text] as const,
  covering: (latDeg: number, lonDeg: number) => [...crsKeys.all, 'at', latDeg, lonDeg] as const,
};
