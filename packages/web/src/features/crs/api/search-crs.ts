import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { crsKeys } from './keys';

/** One CRS as `GET /api/v1/crs` lists it. */
export interface CrsListing {
  /** `EPSG:25832`. */
  code: string;
  name: string;
  kind: 'geographic' | 'projected';
  areaOfUse: { west: number; south: number; east: number; north: number; description: string } | null;
  accuracyM: number | null;
}

/** CRSs whose name holds every word typed, or whose EPSG code is the one typed (`25832`, `EPSG:25832`). */
export async function searchCrs(text: string, limit = 20): Promise<CrsListing[]> {
  const params = new URLSearchParams({ q: text, limit: String(limit) });
  return (await apiFetch<{ crs: CrsListing[] }>(`/crs?${params}`)).crs;
}

export function searchCrsQueryOptions(text: string) {
  const trimmed = text.trim();
  return queryOptions({
    queryKey: crsKeys.search(trimmed.toLowerCase()),
    queryFn: () => searchCrs(trimmed),
    // The registry does not change while the page is open.
    staleTime: Number.POSITIVE_INFINITY,
  });
}

/** Searches while someone types; an empty text asks nothing. Keeps the last list while the next loads. */
export function useCrsSearch(text: string) {
  return useQuery({ ...searchCrsQueryOptions(text), enabled: text.trim() !== '', placeholderData: keepPreviousData });
}
