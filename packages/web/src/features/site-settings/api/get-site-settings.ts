import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { siteSettingsKeys } from './keys';

/** The installation's settings for the site (mirrors the server's `SiteSettings`). */
export interface SiteSettings {
  /** XYZ template ({z}/{x}/{y}) of the optional background map; null when none is configured. */
  tileUrl: string | null;
  tileAttribution: string | null;
}

export function getSiteSettings(): Promise<SiteSettings> {
  return apiFetch<SiteSettings>('/site-settings');
}

export function siteSettingsQueryOptions() {
  // Fixed while the server runs.
  return queryOptions({
    queryKey: siteSettingsKeys.all,
    queryFn: getSiteSettings,
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useSiteSettings() {
  return useQuery(siteSettingsQueryOptions());
}

/** The background map of the plan view, or null when none is configured (or the settings did not load). */
export function useTileSource(): { url: string; attribution: string | null } | null {
  const settings = useSiteSettings();
  const url = settings.data?.tileUrl;
  return url ? { url, attribution: settings.data?.tileAttribution ?? null } : null;
}
