/**
 * How build times read on screen.
 */

/**
 * Returns `iso` (an ISO 8601 date-time) as a medium date and short time, e.g. "4 Mar 2026, 14:05" in British
 * English. `locale` and `timeZone` default to the reader's own. Returns "unknown time" when `iso` does not parse.
 */
export function formatWhen(iso: string, locale?: string, timeZone?: string): string {
  const t = Date.parse(iso);
  if (Number.isNaN(t)) return 'unknown time';
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short', timeZone }).format(new Date(t));
}
