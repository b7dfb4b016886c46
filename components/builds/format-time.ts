/**
 * How build times read on screen.
 */

/**
 * Returns `iso` (an ISO 8601 date-time) as a short local date and time, e.g. "4 Mar 2026, 14:05" in an English
 * locale, using the reader's locale and time zone. Returns "unknown time" when `iso` does not parse.
 */
export function formatWhen(iso: string, locale?: string): string {
  const t = Date.parse(iso);
  if (Number.isNaN(t)) return 'unknown time';
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(t));
}
