import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { crsKeys } from './keys';
import type { CrsListing } from './search-crs';

/** CRSs whose area of use covers a WGS 84 position, best first (projected, most accurate, most local). */
export async function findCrsAt(latDeg: number, lonDeg: number, limit = 8): Promise<CrsListing[]> {
  const params = new URLSearchParams({ at: `${latDeg},${lonDeg}`, limit: String(limit) });
  return (await apiFetch<{ crs: CrsListing[] }>(`/crs?${params}`)).crs;
}

export function findCrsAtQueryOptions(latDeg: number, lonDeg: number) {
  // Rounded to 0.01° (about 1 km): nearby positions share one answer.
  const lat = Math.round(latDeg * 100) / 100;
  const lon = Math.round(lonDeg * 100) / 100;
  return queryOptions({
    queryKey: crsKeys.covering(lat, lon),
    queryFn: () => findCrsAt(lat, lon),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

/** The CRSs covering a position; asks nothing without one. */
export function useCrsAt(near: { latDeg: number; lonDeg: number } | undefined) {
  const valid = near !== undefined && Number.isFinite(near.latDeg) && Number.isFinite(near.lonDeg);
  return useQuery({
    ...findCrsAtQueryOptions(valid ? near.latDeg : 0, valid ? near.lonDeg : 0),
    enabled: valid,
  });
}
