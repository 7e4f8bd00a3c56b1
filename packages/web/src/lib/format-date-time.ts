/** An ISO timestamp as `2026-12-02 04:05 UTC` (one clock for everyone reading a shared list). */
export function formatDateTime(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}
