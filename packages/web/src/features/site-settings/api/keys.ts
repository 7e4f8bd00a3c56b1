/** Query keys of the site settings. */
export const siteSettingsKeys = {
  all: ['site-settings'] as const,
};
