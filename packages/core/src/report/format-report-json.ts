function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) out[key] = sortKeys((value as Record<string, unknown>)[key]);
    return out;
  }
  if (typeof value === 'number' && !Number.isFinite(value)) return null;
  return value;
}

/** Serialises a report stably: keys sorted at every level, non-finite numbers as `null`, two-space indent, trailing newline. */
export function formatReportJson(report: object): string {
  return `${JSON.stringify(sortKeys(report), null, 2)}\n`;
}
