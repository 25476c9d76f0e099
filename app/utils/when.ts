/** Date-time of an ISO string for tables and threads ("2 Dec 2026, 02:10"); `fallback` for null. */
export function formatWhen(iso: string | null, fallback = '—'): string {
  return iso ? new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' }) : fallback
}

/** Day of an ISO string for tables ("2 Dec 2026": no day/month order to guess). */
export function formatDay(iso: string): string {
  return new Date(iso).toLocaleDateString('en-GB', { dateStyle: 'medium' })
}
